/**
 * Channels (sensitive inputs) of a project. A channel's signal and return terminals carry
 * the channel's id too (Terminal.channelId, what the schedule's `channel` column shows):
 * linking a terminal here sets it there, unlinking clears it, in the same transaction.
 */
import { Op, type Transaction } from 'sequelize';
import { diffFields, logAction } from '@/lib/data/audit-log';
import { destroyVersioned, translateDbError, updateVersioned } from '@/lib/data/versioned';
import { getDb, type Attributes, type Channel, type Strip, type Terminal } from '@/lib/db';
import { ValidationError } from '@/lib/errors';
import type { ChannelCreate, ChannelUpdate } from '@/lib/validation/channel';
import { findCabinet, findChannel, inTransaction, type ScheduleActor } from './scope';
import { lastChange, StaleRecordError, staleChecked } from './stale';

export type ChannelRow = Attributes<Channel> & {
  signalTerminalLabel: string | null;
  returnTerminalLabel: string | null;
  guardRecipeName: string | null;
};

async function toRows(channels: Channel[], transaction?: Transaction): Promise<ChannelRow[]> {
  const { models } = getDb();
  const terminalIds = channels.flatMap((c) => [c.signalTerminalId, c.returnTerminalId]).filter((id): id is number => id != null);
  const recipeIds = channels.map((c) => c.guardRecipeId).filter((id): id is number => id != null);
  const terminals = terminalIds.length
    ? await models.Terminal.findAll({ where: { id: { [Op.in]: terminalIds } }, attributes: ['id', 'label'], transaction })
    : [];
  const recipes = recipeIds.length
    ? await models.GuardRecipe.findAll({ where: { id: { [Op.in]: recipeIds } }, attributes: ['id', 'name'], transaction })
    : [];
  const label = new Map(terminals.map((t) => [t.id, t.label]));
  const recipeName = new Map(recipes.map((r) => [r.id, r.name]));
  return channels.map((c) => ({
    ...(c.get({ plain: true }) as Attributes<Channel>),
    signalTerminalLabel: c.signalTerminalId === null ? null : (label.get(c.signalTerminalId) ?? null),
    returnTerminalLabel: c.returnTerminalId === null ? null : (label.get(c.returnTerminalId) ?? null),
    guardRecipeName: c.guardRecipeId === null ? null : (recipeName.get(c.guardRecipeId) ?? null),
  }));
}

export async function listChannels(projectId: number, cabinetId?: number): Promise<ChannelRow[]> {
  const { models } = getDb();
  if (cabinetId !== undefined) await findCabinet(projectId, cabinetId);
  const channels = await models.Channel.findAll({
    where: cabinetId === undefined ? { projectId } : { projectId, cabinetId },
    order: [['tag', 'ASC']],
  });
  return toRows(channels);
}

type References = Pick<ChannelCreate, 'signalTerminalId' | 'returnTerminalId' | 'guardRecipeId'>;

/** The terminals must be in the channel's cabinet, the recipe in the project; field errors otherwise. */
async function checkReferences(projectId: number, cabinetId: number, refs: Partial<References>, transaction: Transaction) {
  const { models } = getDb();
  const errors: Record<string, string[]> = {};
  for (const field of ['signalTerminalId', 'returnTerminalId'] as const) {
    const id = refs[field];
    if (id === null || id === undefined) continue;
    const terminal = (await models.Terminal.findOne({
      where: { id },
      include: [{ model: models.Strip, as: 'strip', required: true, attributes: ['cabinetId'] }],
      transaction,
    })) as (Terminal & { strip: Strip }) | null;
    if (!terminal || terminal.strip.cabinetId !== cabinetId) errors[field] = [`terminal ${id} is not a terminal of this channel's cabinet.`];
  }
  if (refs.guardRecipeId !== null && refs.guardRecipeId !== undefined) {
    const recipe = await models.GuardRecipe.findOne({ where: { id: refs.guardRecipeId, projectId }, transaction });
    if (!recipe) errors.guardRecipeId = [`guard recipe ${refs.guardRecipeId} does not exist in this project.`];
  }
  if (Object.keys(errors).length > 0) {
    const [field, [message]] = Object.entries(errors)[0];
    throw new ValidationError(`${field}: ${message}`, errors);
  }
}

async function assertTagFree(projectId: number, tag: string, exceptId: number | null, transaction: Transaction) {
  const { models } = getDb();
  const other = await models.Channel.findOne({ where: { projectId, tag }, transaction });
  if (other && other.id !== exceptId) {
    throw new ValidationError(`A channel tagged ${tag} already exists in this project.`, {
      tag: [`${tag} is already used by another channel in this project.`],
    });
  }
}

/** Points the channel's signal/return terminals at it, and releases terminals it no longer uses. */
async function syncTerminalLinks(channel: Channel, transaction: Transaction) {
  const { models } = getDb();
  const wanted = new Set([channel.signalTerminalId, channel.returnTerminalId].filter((id): id is number => id != null));
  const linked = await models.Terminal.findAll({ where: { channelId: channel.id }, transaction });
  for (const t of linked) {
    if (!wanted.has(t.id)) await t.update({ channelId: null }, { transaction });
  }
  const already = new Set(linked.map((t) => t.id));
  for (const id of wanted) {
    if (already.has(id)) continue;
    const terminal = await models.Terminal.findByPk(id, { transaction });
    if (terminal) await terminal.update({ channelId: channel.id }, { transaction });
  }
}

export async function createChannel(actor: ScheduleActor, input: ChannelCreate): Promise<ChannelRow> {
  const { models } = getDb();
  const channel = await inTransaction(async (transaction) => {
    await findCabinet(actor.projectId, input.cabinetId, transaction).catch(() => {
      throw new ValidationError(`cabinetId: cabinet ${input.cabinetId} does not exist in this project.`, {
        cabinetId: [`cabinet ${input.cabinetId} does not exist in this project.`],
      });
    });
    await assertTagFree(actor.projectId, input.tag, null, transaction);
    await checkReferences(actor.projectId, input.cabinetId, input, transaction);
    const created = await models.Channel.create({ ...input, projectId: actor.projectId }, { transaction }).catch((err) => {
      throw translateDbError(err);
    });
    await syncTerminalLinks(created, transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'channel.create', entity: 'Channel', entityId: created.id, detail: { tag: created.tag, cabinetId: created.cabinetId } },
      transaction,
    );
    return created;
  });
  return (await toRows([channel]))[0];
}

export async function updateChannel(actor: ScheduleActor, channelId: number, update: ChannelUpdate): Promise<ChannelRow> {
  const { models } = getDb();
  const { version, ...changes } = update;
  const saved = await inTransaction(async (transaction) => {
    const before = await findChannel(actor.projectId, channelId, transaction);
    if (changes.tag !== undefined) await assertTagFree(actor.projectId, changes.tag, channelId, transaction);
    const signal = changes.signalTerminalId !== undefined ? changes.signalTerminalId : before.signalTerminalId;
    const ret = changes.returnTerminalId !== undefined ? changes.returnTerminalId : before.returnTerminalId;
    if (signal !== null && signal === ret) {
      throw new ValidationError('returnTerminalId must be a different terminal from signalTerminalId.', {
        returnTerminalId: ['must be a different terminal from signalTerminalId.'],
      });
    }
    await checkReferences(actor.projectId, before.cabinetId, changes, transaction);
    const diff = diffFields(before.get({ plain: true }), changes);
    const after = await staleChecked(
      'Channel',
      channelId,
      () => updateVersioned(models.Channel, channelId, version, changes, { transaction }),
      transaction,
      async () => (await toRows([(await findChannel(actor.projectId, channelId, transaction))], transaction))[0],
    );
    await syncTerminalLinks(after, transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'channel.update', entity: 'Channel', entityId: channelId, detail: { tag: after.tag, changes: diff } },
      transaction,
    );
    return after;
  });
  return (await toRows([saved]))[0];
}

/** Deleting a channel releases its terminals (their `channel` becomes empty). */
export async function deleteChannel(actor: ScheduleActor, channelId: number, version: number): Promise<void> {
  const { models } = getDb();
  await inTransaction(async (transaction) => {
    const channel = await findChannel(actor.projectId, channelId, transaction);
    if (channel.version !== version) {
      throw new StaleRecordError(
        `Channel ${channel.tag} was changed by someone else (now version ${channel.version}, you read version ${version}). Reload it first.`,
        (await toRows([channel], transaction))[0],
        await lastChange('Channel', channelId, channel.updatedAt, transaction),
      );
    }
    const linked = await models.Terminal.findAll({ where: { channelId }, transaction });
    for (const t of linked) await t.update({ channelId: null }, { transaction });
    await destroyVersioned(models.Channel, channelId, version, { transaction });
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'channel.delete', entity: 'Channel', entityId: channelId, detail: { tag: channel.tag, releasedTerminals: linked.map((t) => t.label) } },
      transaction,
    );
  });
}
