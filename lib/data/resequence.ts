import { Op } from 'sequelize';
import { canonicalJson, sha256Hex } from '@/lib/audit';
import { proposeResequence, type ResequenceProposal, type Separator } from '@/lib/remedies/resequence';
import type { ProjectActor } from '@/lib/auth/guard';
import { getDb } from '@/lib/db';
import { ConflictError, NotFoundError, ValidationError } from '@/lib/errors';
import type { ResequenceApply } from '@/lib/validation/resequence';
import { logAction } from './audit-log';
import { buildProjectSnapshot } from './audit-snapshot';

export interface ResequenceView extends ResequenceProposal {
  stripTag: string;
  /** Identifies this exact proposal; applying requires it, so the engineer applies what they saw. */
  fingerprint: string;
  /** Current version of every terminal on the strip. */
  versions: Record<string, number>;
}

async function stripOfProject(projectId: number, stripId: number) {
  const { models } = getDb();
  const strip = await models.Strip.findByPk(stripId);
  const cabinet = strip ? await models.Cabinet.findByPk(strip.cabinetId, { attributes: ['id', 'projectId'] }) : null;
  if (!strip || !cabinet || cabinet.projectId !== projectId) throw new NotFoundError(`Strip ${stripId} not found in this project.`);
  return strip;
}

/** The proposal for one strip of the schedule as it stands; nothing is written. */
export async function proposeForStrip(projectId: number, stripId: number, separator?: Separator): Promise<ResequenceView> {
  const { models } = getDb();
  const strip = await stripOfProject(projectId, stripId);
  const snapshot = await buildProjectSnapshot(projectId);
  const terminals = snapshot.terminals.filter((t) => t.stripId === String(stripId));
  const proposal = proposeResequence(terminals, { separator });
  const rows = await models.Terminal.findAll({ where: { stripId }, attributes: ['id', 'version'] });
  return {
    ...proposal,
    stripTag: strip.tag,
    fingerprint: sha256Hex(canonicalJson({ order: proposal.order, added: proposal.addedSeparators })),
    versions: Object.fromEntries(rows.map((r) => [String(r.id), r.version])),
  };
}

// Positions are unique per strip and level: park the renumbered terminals far away first.
const PARKING_OFFSET = 1_000_000;

/**
 * Applies a reviewed proposal as ordinary versioned terminal changes, in one transaction:
 * renumbered terminals take their new positions, added separators become barrier or spare
 * terminals. Refused (409) when the strip changed since the proposal was shown.
 */
export async function applyResequence(actor: ProjectActor, stripId: number, input: ResequenceApply) {
  const { models, sequelize } = getDb();
  const strip = await stripOfProject(actor.projectId, stripId);
  const view = await proposeForStrip(actor.projectId, stripId, input.separator);
  if (view.fingerprint !== input.fingerprint) {
    throw new ConflictError('The strip changed since this proposal was shown; review the new proposal before applying it.', view);
  }
  if (!view.changed) throw new ValidationError('This strip needs no re-sequencing: the proposal keeps the order.');
  const stale = Object.entries(view.versions).filter(([id, v]) => input.versions[id] !== v);
  if (stale.length > 0) {
    throw new ConflictError(`${stale.length} terminal(s) on ${strip.tag} changed since the proposal was shown.`, view);
  }

  return sequelize.transaction(async (transaction) => {
    const ids = view.renumbered.map((m) => Number(m.terminalId));
    const rows = await models.Terminal.findAll({ where: { id: { [Op.in]: ids } }, transaction });
    const byId = new Map(rows.map((r) => [String(r.id), r]));
    for (const move of view.renumbered) {
      await byId.get(move.terminalId)!.update({ position: move.to + PARKING_OFFSET }, { transaction });
    }
    for (const move of view.renumbered) {
      await byId.get(move.terminalId)!.update({ position: move.to }, { transaction });
    }
    const added = [];
    for (const sep of view.addedSeparators) {
      added.push(
        await models.Terminal.create(
          {
            stripId,
            position: sep.position,
            level: 1,
            label: `${strip.tag}:${sep.kind === 'barrier' ? 'PL' : 'SP'}${sep.position}`,
            circuitClass: sep.kind === 'barrier' ? 'barrier' : 'spare',
            blockId: null,
            terminalNumber: null,
            wireNumber: null,
            cableId: null,
            cableCore: null,
            connector: null,
            wireColour: null,
            hazardKind: null,
            nominalVoltage: null,
            currentKind: null,
            frequency: null,
            sourceImpedance: null,
            bridgeGroup: null,
            channelId: null,
            notes: 'Added by re-sequencing',
          },
          { transaction },
        ),
      );
    }
    await logAction(
      {
        actorId: actor.user.id,
        projectId: actor.projectId,
        action: 'strip.resequence',
        entity: 'Strip',
        entityId: stripId,
        detail: {
          fingerprint: view.fingerprint,
          before: view.before,
          after: view.after,
          moves: view.moves,
          renumbered: view.renumbered,
          added: view.addedSeparators,
        },
      },
      transaction,
    );
    return { renumbered: view.renumbered.length, added: added.length, before: view.before, after: view.after };
  });
}
