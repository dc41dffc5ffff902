/**
 * The terminal schedule of a cabinet: list (sort, filter, page), create, versioned update —
 * one terminal or many in one all-or-nothing transaction — and delete, each write logged.
 */
import { Op, Sequelize, type Includeable, type Order, type Transaction, type WhereOptions } from 'sequelize';
import { diffFields, logAction } from '@/lib/data/audit-log';
import { destroyVersioned, translateDbError } from '@/lib/data/versioned';
import { getDb, type Attributes, type Cabinet, type Channel, type Strip, type Terminal } from '@/lib/db';
import { ConflictError, NotFoundError, ValidationError } from '@/lib/errors';
import {
  terminalFactsProblems,
  type TerminalChanges,
  type TerminalCreate,
  type TerminalListQuery,
} from '@/lib/validation/terminal';
import { findCabinet, findTerminal, inTransaction, type ScheduleActor } from './scope';
import { lastChange, StaleRecordError, staleChecked, type ChangedBy } from './stale';

/** One schedule row: the terminal's fields plus the tags the table shows. */
export type TerminalRow = Attributes<Terminal> & { stripTag: string; channelTag: string | null };

type LoadedTerminal = Terminal & { strip: Strip & { cabinet?: Cabinet }; channel?: Channel | null };

/**
 * Joins for a schedule row. With a projectId the strip's cabinet is joined and scoped to the
 * project; the list passes null because it has already scoped the cabinet (one join fewer
 * on the table's hot path).
 */
function rowIncludes(projectId: number | null): Includeable[] {
  const { models } = getDb();
  return [
    {
      model: models.Strip,
      as: 'strip',
      required: true,
      attributes: ['id', 'tag', 'order', 'cabinetId'],
      include:
        projectId === null
          ? []
          : [{ model: models.Cabinet, as: 'cabinet', required: true, attributes: ['id', 'projectId', 'tag'], where: { projectId } }],
    },
    { model: models.Channel, as: 'channel', required: false, attributes: ['id', 'tag'] },
  ];
}

export function toTerminalRow(t: LoadedTerminal): TerminalRow {
  const { strip, channel, ...plain } = t.get({ plain: true }) as Attributes<Terminal> & {
    strip?: { tag: string };
    channel?: { tag: string } | null;
  };
  return { ...plain, stripTag: strip?.tag ?? t.strip.tag, channelTag: channel?.tag ?? null };
}

export async function loadTerminalRows(projectId: number, ids: number[], transaction?: Transaction): Promise<TerminalRow[]> {
  const { models } = getDb();
  if (ids.length === 0) return [];
  const terminals = (await models.Terminal.findAll({
    where: { id: { [Op.in]: ids } },
    include: rowIncludes(projectId),
    transaction,
  })) as LoadedTerminal[];
  const byId = new Map(terminals.map((t) => [t.id, toTerminalRow(t)]));
  return ids.map((id) => byId.get(id)).filter((r): r is TerminalRow => r !== undefined);
}

// ---------------------------------------------------------------- list

const SEARCHED_COLUMNS = [
  'Terminal.label',
  'Terminal.terminalNumber',
  'Terminal.blockId',
  'Terminal.wireNumber',
  'Terminal.cableId',
  'Terminal.cableCore',
  'Terminal.connector',
  'Terminal.wireColour',
  'Terminal.circuitClass',
  'Terminal.bridgeGroup',
  'Terminal.notes',
  'strip.tag',
  'channel.tag',
];

function orderFor(query: TerminalListQuery): Order {
  const { models } = getDb();
  const dir = query.dir === 'desc' ? 'DESC' : 'ASC';
  const stripOrder: Order = [
    [{ model: models.Strip, as: 'strip' }, 'order', 'ASC'],
    [{ model: models.Strip, as: 'strip' }, 'tag', 'ASC'],
    ['position', 'ASC'],
    ['level', 'ASC'],
    ['id', 'ASC'],
  ];
  if (!query.sort) return stripOrder;
  if (query.sort === 'stripTag') return [[{ model: models.Strip, as: 'strip' }, 'tag', dir], ...stripOrder];
  if (query.sort === 'channelTag') return [[{ model: models.Channel, as: 'channel' }, 'tag', dir], ...stripOrder];
  return [[query.sort, dir], ...stripOrder];
}

export async function listTerminals(
  projectId: number,
  cabinetId: number,
  query: TerminalListQuery,
): Promise<{ items: TerminalRow[]; total: number }> {
  const { models } = getDb();
  await findCabinet(projectId, cabinetId);
  const where: WhereOptions[] = [{ '$strip.cabinetId$': cabinetId }];
  if (query.stripId !== undefined) where.push({ stripId: query.stripId });
  if (query.circuitClass) where.push({ circuitClass: query.circuitClass });
  if (query.q) {
    // lower() on both sides: case-insensitive on SQLite and PostgreSQL alike.
    const needle = `%${query.q.toLowerCase()}%`;
    where.push({
      [Op.or]: SEARCHED_COLUMNS.map((column) =>
        Sequelize.where(Sequelize.fn('lower', Sequelize.col(column)), { [Op.like]: needle }),
      ),
    });
  }
  const include = rowIncludes(null); // the cabinet was found in this project above
  const [total, terminals] = await Promise.all([
    models.Terminal.count({ where: { [Op.and]: where }, include, distinct: true, col: 'id' }),
    // Raw rows: building model instances costs most of the time for a whole cabinet.
    models.Terminal.findAll({
      where: { [Op.and]: where },
      include,
      order: orderFor(query),
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
      subQuery: false,
      raw: true,
      nest: true,
    }) as unknown as Promise<RawTerminalRow[]>,
  ]);
  return { items: terminals.map(fromRaw), total };
}

type RawTerminalRow = Omit<Attributes<Terminal>, 'createdAt' | 'updatedAt'> & {
  createdAt: Date | string;
  updatedAt: Date | string;
  strip: { tag: string };
  channel: { tag: string | null };
};

/** SQLite hands raw dates back as text ('2026-12-01 19:02:13.115 +00:00'); PostgreSQL as Date. */
function toDate(value: Date | string): Date {
  if (value instanceof Date) return value;
  const m = /^(\d{4}-\d\d-\d\d) (\d\d:\d\d:\d\d(?:\.\d+)?) ?([+-]\d\d:\d\d|Z)?$/.exec(value);
  return new Date(m ? `${m[1]}T${m[2]}${m[3] ?? 'Z'}` : value);
}

function fromRaw(raw: RawTerminalRow): TerminalRow {
  const { strip, channel, createdAt, updatedAt, ...fields } = raw;
  return { ...fields, createdAt: toDate(createdAt), updatedAt: toDate(updatedAt), stripTag: strip.tag, channelTag: channel?.tag ?? null };
}

// ---------------------------------------------------------------- checks shared by create and update

type FieldErrors = Record<string, string[]>;

function addError(errors: FieldErrors, field: string, message: string) {
  (errors[field] ??= []).push(message);
}

interface Placement {
  id: number | null;
  stripId: number;
  position: number;
  level: number;
}

const placeKey = (p: { stripId: number; position: number; level: number }) => `${p.stripId}:${p.position}:${p.level}`;

/**
 * Checks that each placement is free: not taken by a terminal outside the batch, and not
 * claimed twice inside it. Returns errors (on `position`) per batch index.
 */
async function placementProblems(
  placements: Placement[],
  stripTags: Map<number, string>,
  transaction: Transaction,
): Promise<Map<number, FieldErrors>> {
  const { models } = getDb();
  const problems = new Map<number, FieldErrors>();
  if (placements.length === 0) return problems;
  const batchIds = new Set(placements.map((p) => p.id).filter((id): id is number => id !== null));
  const occupants = await models.Terminal.findAll({
    where: { stripId: { [Op.in]: [...new Set(placements.map((p) => p.stripId))] } },
    attributes: ['id', 'stripId', 'position', 'level', 'label'],
    transaction,
  });
  const taken = new Map<string, string>();
  for (const o of occupants) if (!batchIds.has(o.id)) taken.set(placeKey(o), o.label);
  const claimed = new Map<string, number>();
  placements.forEach((p, i) => {
    const key = placeKey(p);
    const where = `position ${p.position} level ${p.level} on strip ${stripTags.get(p.stripId) ?? p.stripId}`;
    const holder = taken.get(key);
    if (holder !== undefined) {
      problems.set(i, { position: [`${where} is already taken by terminal ${holder}.`] });
    } else if (claimed.has(key)) {
      problems.set(i, { position: [`${where} is given to two terminals in this change (also change ${claimed.get(key)! + 1}).`] });
    } else claimed.set(key, i);
  });
  return problems;
}

/** Strips of the project by id (for moves and creates), each with its cabinet. */
async function stripsById(projectId: number, ids: number[], transaction: Transaction) {
  const { models } = getDb();
  const strips = (await models.Strip.findAll({
    where: { id: { [Op.in]: [...new Set(ids)] } },
    include: [{ model: models.Cabinet, as: 'cabinet', where: { projectId }, required: true }],
    transaction,
  })) as (Strip & { cabinet: Cabinet })[];
  return new Map(strips.map((s) => [s.id, s]));
}

async function channelsById(projectId: number, ids: number[], transaction: Transaction) {
  const { models } = getDb();
  if (ids.length === 0) return new Map<number, Channel>();
  const channels = await models.Channel.findAll({ where: { id: { [Op.in]: [...new Set(ids)] }, projectId }, transaction });
  return new Map(channels.map((c) => [c.id, c]));
}

function channelProblem(channel: Channel | undefined, channelId: number, cabinet: { id: number; tag: string }): string | null {
  if (!channel) return `channel ${channelId} does not exist in this project.`;
  if (channel.cabinetId !== cabinet.id) return `channel ${channel.tag} belongs to another cabinet, not ${cabinet.tag}.`;
  return null;
}

// ---------------------------------------------------------------- create

export async function createTerminal(actor: ScheduleActor, input: TerminalCreate): Promise<TerminalRow> {
  const { models } = getDb();
  const id = await inTransaction(async (transaction) => {
    const strips = await stripsById(actor.projectId, [input.stripId], transaction);
    const strip = strips.get(input.stripId);
    if (!strip) {
      throw new ValidationError(`stripId: strip ${input.stripId} does not exist in this project.`, {
        stripId: [`strip ${input.stripId} does not exist in this project.`],
      });
    }
    if (input.channelId !== null) {
      const channels = await channelsById(actor.projectId, [input.channelId], transaction);
      const problem = channelProblem(channels.get(input.channelId), input.channelId, strip.cabinet);
      if (problem) throw new ValidationError(`channelId: ${problem}`, { channelId: [problem] });
    }
    const placement = await placementProblems(
      [{ id: null, stripId: input.stripId, position: input.position, level: input.level }],
      new Map([[strip.id, strip.tag]]),
      transaction,
    );
    const clash = placement.get(0);
    if (clash) throw new ValidationError(`position: ${clash.position[0]}`, clash);
    const created = await models.Terminal.create(input, { transaction }).catch((err) => {
      throw translateDbError(err);
    });
    await logAction(
      {
        actorId: actor.userId,
        projectId: actor.projectId,
        action: 'terminal.create',
        entity: 'Terminal',
        entityId: created.id,
        detail: { stripTag: strip.tag, label: created.label, position: created.position, level: created.level },
      },
      transaction,
    );
    return created.id;
  });
  return (await loadTerminalRows(actor.projectId, [id]))[0];
}

// ---------------------------------------------------------------- update (one or many)

export interface TerminalChangeRequest {
  id: number;
  version: number;
  changes: TerminalChanges;
}

/** Some of a batch were edited by someone else since they were read; nothing was written. */
export class TerminalConflictError extends ConflictError {
  constructor(
    message: string,
    readonly conflicts: { id: number; current: TerminalRow; changedBy: ChangedBy | null }[],
  ) {
    super(message, conflicts[0]?.current);
  }
}

/**
 * Applies a batch of terminal changes in one transaction, all or nothing. Checks, before
 * writing anything: every terminal is in the project (404), every version is current (409
 * listing each stale one with its current row), every change is valid on the record as it
 * would stand — hazard facts, target strip in the same cabinet, channel of that cabinet, no
 * two terminals on one place (422, errors keyed by `fieldKey(index, field)`).
 */
async function applyTerminalChanges(
  actor: ScheduleActor,
  requests: TerminalChangeRequest[],
  fieldKey: (index: number, field: string) => string,
  action: string,
): Promise<TerminalRow[]> {
  const { models } = getDb();
  const ids = requests.map((r) => r.id);
  await inTransaction(async (transaction) => {
    const loaded = (await models.Terminal.findAll({
      where: { id: { [Op.in]: ids } },
      include: rowIncludes(actor.projectId),
      transaction,
    })) as LoadedTerminal[];
    const byId = new Map(loaded.map((t) => [t.id, t]));
    const missing = ids.filter((id) => !byId.has(id));
    if (missing.length > 0) {
      throw new NotFoundError(
        `Terminal${missing.length > 1 ? 's' : ''} ${missing.join(', ')} not found in this project.`,
      );
    }

    const conflicts = await Promise.all(
      requests
        .filter((r) => byId.get(r.id)!.version !== r.version)
        .map(async (r) => {
          const current = toTerminalRow(byId.get(r.id)!);
          return { id: r.id, current, changedBy: await lastChange('Terminal', r.id, current.updatedAt, transaction) };
        }),
    );
    if (conflicts.length > 0) {
      const list = conflicts.map((c) => `${c.current.label} (now version ${c.current.version})`).join(', ');
      throw new TerminalConflictError(
        `Changed by someone else since you read ${conflicts.length === 1 ? 'it' : 'them'}: ${list}. Reload and apply your change again; nothing was saved.`,
        conflicts,
      );
    }

    const targetStrips = await stripsById(
      actor.projectId,
      requests.map((r) => r.changes.stripId ?? byId.get(r.id)!.stripId),
      transaction,
    );
    const channels = await channelsById(
      actor.projectId,
      requests.map((r) => r.changes.channelId).filter((c): c is number => typeof c === 'number'),
      transaction,
    );

    const errors: FieldErrors = {};
    const moving: { index: number; placement: Placement }[] = [];
    requests.forEach((r, i) => {
      const current = byId.get(r.id)!;
      const merged = { ...(current.get({ plain: true }) as Attributes<Terminal>), ...r.changes };
      const strip = targetStrips.get(merged.stripId);
      if (!strip) addError(errors, fieldKey(i, 'stripId'), `strip ${merged.stripId} does not exist in this project.`);
      else if (strip.cabinetId !== current.strip.cabinetId) {
        addError(errors, fieldKey(i, 'stripId'), `strip ${strip.tag} is in another cabinet; a terminal moves only within its cabinet.`);
      }
      if (typeof r.changes.channelId === 'number') {
        const problem = channelProblem(channels.get(r.changes.channelId), r.changes.channelId, current.strip.cabinet!);
        if (problem) addError(errors, fieldKey(i, 'channelId'), problem);
      }
      for (const [field, messages] of Object.entries(terminalFactsProblems(merged))) {
        for (const m of messages) addError(errors, fieldKey(i, field), m);
      }
      if (merged.stripId !== current.stripId || merged.position !== current.position || merged.level !== current.level) {
        moving.push({ index: i, placement: { id: r.id, stripId: merged.stripId, position: merged.position, level: merged.level } });
      }
    });
    const stripTags = new Map([...targetStrips.values()].map((s) => [s.id, s.tag]));
    const clashes = await placementProblems(moving.map((m) => m.placement), stripTags, transaction);
    for (const [k, fieldErrors] of clashes) {
      for (const m of fieldErrors.position) addError(errors, fieldKey(moving[k].index, 'position'), m);
    }
    const errorCount = Object.keys(errors).length;
    if (errorCount > 0) {
      const [firstKey, [firstMessage]] = Object.entries(errors)[0];
      throw new ValidationError(
        `${firstKey}: ${firstMessage}${errorCount > 1 ? ` (and ${errorCount - 1} more)` : ''} Nothing was saved.`,
        errors,
      );
    }

    // Moves may swap places (A → 5 while 5 → 4): park the movers on free temporary places
    // first so the unique (strip, position, level) index never sees a transient clash.
    for (const m of moving) {
      await models.Terminal.update(
        { position: -m.placement.id! },
        { where: { id: m.placement.id! }, transaction, validate: false, hooks: false },
      );
    }
    const movingIds = new Set(moving.map((m) => m.placement.id));
    for (const r of requests) {
      const terminal = byId.get(r.id)!;
      const before = terminal.get({ plain: true }) as Record<string, unknown>;
      const diff = diffFields(before, r.changes);
      terminal.set(r.changes);
      if (movingIds.has(r.id)) terminal.changed('position', true);
      try {
        await terminal.save({ transaction });
      } catch (err) {
        throw translateDbError(err);
      }
      await logAction(
        {
          actorId: actor.userId,
          projectId: actor.projectId,
          action,
          entity: 'Terminal',
          entityId: r.id,
          detail: { label: terminal.label, changes: diff },
        },
        transaction,
      );
    }
  });
  return loadTerminalRows(actor.projectId, ids);
}

export async function updateTerminal(
  actor: ScheduleActor,
  terminalId: number,
  version: number,
  changes: TerminalChanges,
): Promise<TerminalRow> {
  try {
    const [row] = await applyTerminalChanges(actor, [{ id: terminalId, version, changes }], (_i, field) => field, 'terminal.update');
    return row;
  } catch (err) {
    if (err instanceof TerminalConflictError) {
      throw new StaleRecordError(err.message, err.conflicts[0].current, err.conflicts[0].changedBy);
    }
    throw err;
  }
}

/** The bulk edit (paste, fill-down): all or nothing; errors keyed "updates.<i>.changes.<field>". */
export async function bulkUpdateTerminals(actor: ScheduleActor, requests: TerminalChangeRequest[]): Promise<TerminalRow[]> {
  return applyTerminalChanges(
    actor,
    requests,
    (i, field) => (field === 'id' ? `updates.${i}.id` : `updates.${i}.changes.${field}`),
    'terminal.bulk-update',
  );
}

// ---------------------------------------------------------------- delete

export async function deleteTerminal(actor: ScheduleActor, terminalId: number, version: number): Promise<void> {
  const { models } = getDb();
  await inTransaction(async (transaction) => {
    const terminal = await findTerminal(actor.projectId, terminalId, transaction);
    await staleChecked(
      'Terminal',
      terminalId,
      () => destroyVersioned(models.Terminal, terminalId, version, { transaction }),
      transaction,
      async () => (await loadTerminalRows(actor.projectId, [terminalId], transaction))[0],
    );
    await logAction(
      {
        actorId: actor.userId,
        projectId: actor.projectId,
        action: 'terminal.delete',
        entity: 'Terminal',
        entityId: terminalId,
        detail: { stripTag: terminal.strip.tag, label: terminal.label, position: terminal.position, level: terminal.level },
      },
      transaction,
    );
  });
}
