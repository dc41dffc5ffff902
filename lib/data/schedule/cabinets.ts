/** Cabinets of a project: list with counts, create, versioned update and delete, each write logged. */
import { Op, type Transaction } from 'sequelize';
import { diffFields, logAction } from '@/lib/data/audit-log';
import { destroyVersioned, translateDbError, updateVersioned } from '@/lib/data/versioned';
import { getDb, type Attributes, type Cabinet } from '@/lib/db';
import { ConflictError, ValidationError } from '@/lib/errors';
import type { CabinetCreate, CabinetUpdate } from '@/lib/validation/cabinet';
import { findCabinet, inTransaction, type ScheduleActor } from './scope';
import { staleChecked } from './stale';

export type CabinetRow = Attributes<Cabinet> & { stripCount: number; terminalCount: number; channelCount: number };

async function countsFor(cabinetIds: number[], transaction?: Transaction) {
  const { models } = getDb();
  const counts = new Map(cabinetIds.map((id) => [id, { stripCount: 0, terminalCount: 0, channelCount: 0 }]));
  if (cabinetIds.length === 0) return counts;
  const strips = await models.Strip.findAll({
    where: { cabinetId: { [Op.in]: cabinetIds } },
    attributes: ['id', 'cabinetId'],
    transaction,
  });
  const stripCabinet = new Map(strips.map((s) => [s.id, s.cabinetId]));
  for (const s of strips) counts.get(s.cabinetId)!.stripCount += 1;
  const terminals = (await models.Terminal.count({
    where: { stripId: { [Op.in]: [...stripCabinet.keys()] } },
    group: ['stripId'],
    transaction,
  })) as unknown as { stripId: number; count: number }[];
  for (const row of terminals) counts.get(stripCabinet.get(row.stripId)!)!.terminalCount += Number(row.count);
  const channels = (await models.Channel.count({
    where: { cabinetId: { [Op.in]: cabinetIds } },
    group: ['cabinetId'],
    transaction,
  })) as unknown as { cabinetId: number; count: number }[];
  for (const row of channels) counts.get(row.cabinetId)!.channelCount = Number(row.count);
  return counts;
}

async function toRows(cabinets: Cabinet[], transaction?: Transaction): Promise<CabinetRow[]> {
  const counts = await countsFor(cabinets.map((c) => c.id), transaction);
  return cabinets.map((c) => ({ ...c.get({ plain: true }), ...counts.get(c.id)! }));
}

export async function listCabinets(projectId: number): Promise<CabinetRow[]> {
  const { models } = getDb();
  const cabinets = await models.Cabinet.findAll({ where: { projectId }, order: [['tag', 'ASC']] });
  return toRows(cabinets);
}

export async function getCabinet(projectId: number, cabinetId: number): Promise<CabinetRow> {
  const [row] = await toRows([await findCabinet(projectId, cabinetId)]);
  return row;
}

async function assertTagFree(projectId: number, tag: string, exceptId: number | null, transaction: Transaction) {
  const { models } = getDb();
  const other = await models.Cabinet.findOne({ where: { projectId, tag }, transaction });
  if (other && other.id !== exceptId) {
    throw new ValidationError(`A cabinet tagged ${tag} already exists in this project.`, {
      tag: [`${tag} is already used by another cabinet in this project.`],
    });
  }
}

export async function createCabinet(actor: ScheduleActor, input: CabinetCreate): Promise<CabinetRow> {
  const { models } = getDb();
  const cabinet = await inTransaction(async (transaction) => {
    await assertTagFree(actor.projectId, input.tag, null, transaction);
    const created = await models.Cabinet.create(
      { projectId: actor.projectId, tag: input.tag, name: input.name, location: input.location ?? null },
      { transaction },
    ).catch((err) => {
      throw translateDbError(err);
    });
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'cabinet.create', entity: 'Cabinet', entityId: created.id, detail: { tag: created.tag, name: created.name } },
      transaction,
    );
    return created;
  });
  return (await toRows([cabinet]))[0];
}

export async function updateCabinet(actor: ScheduleActor, cabinetId: number, update: CabinetUpdate): Promise<CabinetRow> {
  const { models } = getDb();
  const { version, ...changes } = update;
  const saved = await inTransaction(async (transaction) => {
    const before = await findCabinet(actor.projectId, cabinetId, transaction);
    if (changes.tag !== undefined) await assertTagFree(actor.projectId, changes.tag, cabinetId, transaction);
    const diff = diffFields(before.get({ plain: true }), changes);
    const after = await staleChecked('Cabinet', cabinetId, () => updateVersioned(models.Cabinet, cabinetId, version, changes, { transaction }), transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'cabinet.update', entity: 'Cabinet', entityId: cabinetId, detail: { changes: diff } },
      transaction,
    );
    return after;
  });
  return (await toRows([saved]))[0];
}

/** Refuses while the cabinet still has strips: deleting a cabinet never deletes a schedule by accident. */
export async function deleteCabinet(actor: ScheduleActor, cabinetId: number, version: number): Promise<void> {
  const { models } = getDb();
  await inTransaction(async (transaction) => {
    const cabinet = await findCabinet(actor.projectId, cabinetId, transaction);
    const strips = await models.Strip.count({ where: { cabinetId }, transaction });
    if (strips > 0) {
      throw new ConflictError(
        `Cabinet ${cabinet.tag} still has ${strips} strip${strips === 1 ? '' : 's'}; delete or move them first.`,
        (await toRows([cabinet], transaction))[0],
      );
    }
    const channels = await models.Channel.count({ where: { cabinetId }, transaction });
    if (channels > 0) {
      throw new ConflictError(
        `Cabinet ${cabinet.tag} still has ${channels} channel${channels === 1 ? '' : 's'}; delete them first.`,
        (await toRows([cabinet], transaction))[0],
      );
    }
    await staleChecked('Cabinet', cabinetId, () => destroyVersioned(models.Cabinet, cabinetId, version, { transaction }), transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'cabinet.delete', entity: 'Cabinet', entityId: cabinetId, detail: { tag: cabinet.tag, name: cabinet.name } },
      transaction,
    );
  });
}
