/** Strips (terminal rails) of a cabinet: ordered list, create, versioned update and delete, each write logged. */
import type { Transaction } from 'sequelize';
import { diffFields, logAction } from '@/lib/data/audit-log';
import { destroyVersioned, translateDbError, updateVersioned } from '@/lib/data/versioned';
import { getDb, type Attributes, type Strip } from '@/lib/db';
import { ConflictError, ValidationError } from '@/lib/errors';
import type { StripCreate, StripUpdate } from '@/lib/validation/strip';
import { findCabinet, findStrip, inTransaction, type ScheduleActor } from './scope';
import { staleChecked } from './stale';

export type StripRow = Attributes<Strip> & { terminalCount: number };

async function toRows(strips: Strip[], transaction?: Transaction): Promise<StripRow[]> {
  const { models } = getDb();
  if (strips.length === 0) return [];
  const counts = (await models.Terminal.count({
    where: { stripId: strips.map((s) => s.id) },
    group: ['stripId'],
    transaction,
  })) as unknown as { stripId: number; count: number }[];
  const byStrip = new Map(counts.map((c) => [c.stripId, Number(c.count)]));
  return strips.map((s) => {
    const { cabinet: _cabinet, ...plain } = s.get({ plain: true }) as Attributes<Strip> & { cabinet?: unknown };
    return { ...plain, terminalCount: byStrip.get(s.id) ?? 0 };
  });
}

export async function listStrips(projectId: number, cabinetId: number): Promise<StripRow[]> {
  const { models } = getDb();
  await findCabinet(projectId, cabinetId);
  const strips = await models.Strip.findAll({
    where: { cabinetId },
    order: [
      ['order', 'ASC'],
      ['tag', 'ASC'],
    ],
  });
  return toRows(strips);
}

async function assertTagFree(cabinetId: number, tag: string, exceptId: number | null, transaction: Transaction) {
  const { models } = getDb();
  const other = await models.Strip.findOne({ where: { cabinetId, tag }, transaction });
  if (other && other.id !== exceptId) {
    throw new ValidationError(`A strip tagged ${tag} already exists in this cabinet.`, {
      tag: [`${tag} is already used by another strip in this cabinet.`],
    });
  }
}

/** Next free `order` in the cabinet: after the last strip. */
export async function nextStripOrder(cabinetId: number, transaction?: Transaction): Promise<number> {
  const { models } = getDb();
  const max = (await models.Strip.max('order', { where: { cabinetId }, transaction })) as number | null;
  return max === null || max === undefined ? 0 : Number(max) + 1;
}

export async function createStrip(actor: ScheduleActor, cabinetId: number, input: StripCreate): Promise<StripRow> {
  const { models } = getDb();
  const strip = await inTransaction(async (transaction) => {
    await findCabinet(actor.projectId, cabinetId, transaction);
    await assertTagFree(cabinetId, input.tag, null, transaction);
    const order = input.order ?? (await nextStripOrder(cabinetId, transaction));
    const created = await models.Strip.create({ cabinetId, tag: input.tag, name: input.name ?? null, order }, { transaction }).catch(
      (err) => {
        throw translateDbError(err);
      },
    );
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'strip.create', entity: 'Strip', entityId: created.id, detail: { cabinetId, tag: created.tag, order } },
      transaction,
    );
    return created;
  });
  return (await toRows([strip]))[0];
}

export async function updateStrip(actor: ScheduleActor, stripId: number, update: StripUpdate): Promise<StripRow> {
  const { models } = getDb();
  const { version, ...changes } = update;
  const saved = await inTransaction(async (transaction) => {
    const before = await findStrip(actor.projectId, stripId, transaction);
    if (changes.tag !== undefined) await assertTagFree(before.cabinetId, changes.tag, stripId, transaction);
    const diff = diffFields(before.get({ plain: true }), changes);
    const after = await staleChecked('Strip', stripId, () => updateVersioned(models.Strip, stripId, version, changes, { transaction }), transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'strip.update', entity: 'Strip', entityId: stripId, detail: { changes: diff } },
      transaction,
    );
    return after;
  });
  return (await toRows([saved]))[0];
}

/** Refuses while terminals remain on the strip. */
export async function deleteStrip(actor: ScheduleActor, stripId: number, version: number): Promise<void> {
  const { models } = getDb();
  await inTransaction(async (transaction) => {
    const strip = await findStrip(actor.projectId, stripId, transaction);
    const terminals = await models.Terminal.count({ where: { stripId }, transaction });
    if (terminals > 0) {
      throw new ConflictError(
        `Strip ${strip.tag} still has ${terminals} terminal${terminals === 1 ? '' : 's'}; delete or move them first.`,
        (await toRows([strip], transaction))[0],
      );
    }
    await staleChecked('Strip', stripId, () => destroyVersioned(models.Strip, stripId, version, { transaction }), transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'strip.delete', entity: 'Strip', entityId: stripId, detail: { cabinetId: strip.cabinetId, tag: strip.tag } },
      transaction,
    );
  });
}
