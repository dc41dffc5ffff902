/**
 * Schedule import for one cabinet: preview (every row's problems, nothing written) and
 * commit (all rows in one transaction, or nothing). Rows are matched to terminals by
 * strip tag + position + level: a match is updated (the mapped columns only), otherwise a
 * terminal is created; a strip tag the cabinet lacks is created. A channel tag names a
 * channel of this cabinet; a tag the project does not have yet is created as a channel of
 * this cabinet with signal type "other" and no guard (the preview lists them in
 * `channelsToCreate`, and the audit calls such a channel unprotected until the engineer sets
 * its type and guard). A tag that belongs to another cabinet is a row error.
 */
import { Op, type Transaction } from 'sequelize';
import { logAction } from '@/lib/data/audit-log';
import { translateDbError } from '@/lib/data/versioned';
import { getDb, type Attributes, type Channel, type Strip, type Terminal } from '@/lib/db';
import {
  checkMapping,
  FIELD_COLUMN,
  readRows,
  readScheduleFile,
  rowKey,
  suggestMapping,
  type ColumnMapping,
  type ImportRow,
  type MappingProblem,
  type ScheduleFileKind,
  type ScheduleTable,
} from '@/lib/schedule-io';
import { terminalFactsProblems } from '@/lib/validation/terminal';
import { findCabinet, inTransaction, type ScheduleActor } from './scope';
import { nextStripOrder } from './strips';
import { listTerminals } from './terminals';

export interface ImportPreview {
  fileName: string;
  kind: ScheduleFileKind;
  headers: string[];
  suggestedMapping: ColumnMapping;
  /** The mapping the rows were read with (the one sent, or the suggestion). */
  mapping: ColumnMapping;
  /** Problems with the mapping itself; when any, rows are not checked and nothing can be imported. */
  mappingErrors: MappingProblem[];
  rows: { row: number; values: ImportRow['values']; errors: { column: string; message: string }[]; action: 'create' | 'update' | null }[];
  /** Problems in all: mapping problems plus every row's errors. */
  errorCount: number;
  /** Rows with no error. */
  validCount: number;
  /** Channel tags the commit will create (signal type "other", no guard), in file order. */
  channelsToCreate: string[];
}

export interface ImportResult {
  created: number;
  updated: number;
  unchanged: number;
  stripsCreated: string[];
  channelsCreated: string[];
}

/** A commit refused because some row (or the mapping) has a problem; nothing was written. */
export class ImportRejectedError extends Error {
  constructor(readonly preview: ImportPreview) {
    super(
      preview.mappingErrors.length > 0
        ? `The column mapping needs attention (${preview.mappingErrors.map((p) => `${p.column}: ${p.message}`).join(' ')}); nothing was imported.`
        : `${preview.rows.filter((r) => r.errors.length > 0).length} row(s) have errors; nothing was imported. Fix them and import again.`,
    );
    this.name = 'ImportRejectedError';
  }
}

export interface ImportUpload {
  name: string;
  bytes: Uint8Array;
  /** The mapping sent with the upload, or null to use the suggestion. */
  mapping: ColumnMapping | null;
  /** Problems found reading the mapping field itself. */
  mappingProblems?: MappingProblem[];
}

interface Analysis {
  preview: ImportPreview;
  rows: ImportRow[];
  strips: Map<string, Strip>;
  existing: Map<string, Terminal>;
  channels: Map<string, Channel>;
}

async function analyse(
  projectId: number,
  cabinetId: number,
  upload: ImportUpload,
  table: ScheduleTable,
  transaction?: Transaction,
): Promise<Analysis> {
  const { models } = getDb();
  const suggestedMapping = suggestMapping(table.headers);
  const mapping = upload.mapping ?? suggestedMapping;
  const mappingErrors = [...(upload.mappingProblems ?? []), ...checkMapping(mapping, table.headers)];

  const stripList = await models.Strip.findAll({ where: { cabinetId }, transaction });
  const strips = new Map(stripList.map((s) => [s.tag, s]));
  const stripTag = new Map(stripList.map((s) => [s.id, s.tag]));
  const terminals = stripList.length
    ? await models.Terminal.findAll({ where: { stripId: { [Op.in]: stripList.map((s) => s.id) } }, transaction })
    : [];
  const existing = new Map(terminals.map((t) => [rowKey(stripTag.get(t.stripId)!, t.position, t.level), t]));
  const channelList = await models.Channel.findAll({ where: { projectId }, transaction });
  const channels = new Map(channelList.map((c) => [c.tag, c]));

  const rows: ImportRow[] =
    mappingErrors.length > 0
      ? table.rows.map(({ row }) => ({ row, values: {}, errors: [] }))
      : readRows(table, mapping);

  const previewRows: ImportPreview['rows'] = [];
  const channelsToCreate: string[] = [];
  for (const r of rows) {
    let action: 'create' | 'update' | null = null;
    if (r.parsed) {
      const { stripTag: tag, channelTag, fields } = r.parsed;
      if (channelTag) {
        const channel = channels.get(channelTag);
        if (!channel) {
          if (!channelsToCreate.includes(channelTag)) channelsToCreate.push(channelTag);
        } else if (channel.cabinetId !== cabinetId) {
          r.errors.push({ column: 'channel', message: `channel "${channelTag}" belongs to another cabinet.` });
        }
      }
      const match = existing.get(rowKey(tag, fields.position, fields.level));
      const base = match ? (match.get({ plain: true }) as Attributes<Terminal>) : {};
      const merged = { ...base, ...fields };
      for (const [field, messages] of Object.entries(terminalFactsProblems(merged))) {
        const column = FIELD_COLUMN[field as keyof typeof FIELD_COLUMN] ?? field;
        const absent = mapping[column as keyof ColumnMapping] === undefined ? ` (the file has no ${column} column)` : '';
        // Say it in the file's words: "voltage is required…", not the field name behind it.
        const said = (m: string) => m.replaceAll(field, column).replace(/\.$/, '');
        for (const m of messages) r.errors.push({ column, message: `${said(m)}${absent}.` });
      }
      action = r.errors.length === 0 ? (match ? 'update' : 'create') : null;
    }
    previewRows.push({ row: r.row, values: r.values, errors: r.errors, action });
  }
  const rowErrors = previewRows.reduce((n, r) => n + r.errors.length, 0);
  const preview: ImportPreview = {
    fileName: upload.name,
    kind: table.kind,
    headers: table.headers,
    suggestedMapping,
    mapping,
    mappingErrors,
    rows: previewRows,
    errorCount: mappingErrors.length + rowErrors,
    validCount: mappingErrors.length > 0 ? 0 : previewRows.filter((r) => r.errors.length === 0).length,
    channelsToCreate,
  };
  return { preview, rows, strips, existing, channels };
}

export async function previewImport(projectId: number, cabinetId: number, upload: ImportUpload): Promise<ImportPreview> {
  await findCabinet(projectId, cabinetId);
  const table = await readScheduleFile(upload.name, upload.bytes);
  return (await analyse(projectId, cabinetId, upload, table)).preview;
}

/** Writes every row in one transaction, or — when any row has a problem — nothing (ImportRejectedError). */
export async function commitImport(actor: ScheduleActor, cabinetId: number, upload: ImportUpload): Promise<ImportResult> {
  const { models } = getDb();
  const cabinet = await findCabinet(actor.projectId, cabinetId);
  const table = await readScheduleFile(upload.name, upload.bytes);
  return inTransaction(async (transaction) => {
    const a = await analyse(actor.projectId, cabinetId, upload, table, transaction);
    if (a.preview.errorCount > 0) throw new ImportRejectedError(a.preview);

    const result: ImportResult = { created: 0, updated: 0, unchanged: 0, stripsCreated: [], channelsCreated: [] };
    const createdLabels: string[] = [];
    const updatedLabels: string[] = [];
    let order = await nextStripOrder(cabinetId, transaction);
    try {
      for (const tag of a.preview.channelsToCreate) {
        const channel = await models.Channel.create(
          {
            projectId: actor.projectId,
            cabinetId,
            tag,
            signalType: 'other',
            notes: `Created by the schedule import of ${upload.name}: set its signal type and guard.`,
          },
          { transaction },
        );
        a.channels.set(tag, channel);
        result.channelsCreated.push(tag);
      }
      for (const r of a.rows) {
        const { stripTag, channelTag, fields } = r.parsed!;
        let strip = a.strips.get(stripTag);
        if (!strip) {
          strip = await models.Strip.create({ cabinetId, tag: stripTag, order: order++ }, { transaction });
          a.strips.set(stripTag, strip);
          result.stripsCreated.push(stripTag);
        }
        const channel = channelTag ? a.channels.get(channelTag)! : null;
        const values = channelTag === undefined ? fields : { ...fields, channelId: channel ? channel.id : null };
        const match = a.existing.get(rowKey(stripTag, fields.position, fields.level));
        let terminal: Terminal;
        if (match) {
          match.set(values);
          if (match.changed()) {
            await match.save({ transaction });
            result.updated += 1;
            updatedLabels.push(match.label);
          } else result.unchanged += 1;
          terminal = match;
        } else {
          terminal = await models.Terminal.create({ stripId: strip.id, ...values }, { transaction });
          result.created += 1;
          createdLabels.push(terminal.label);
        }
        // Fill in a channel's missing signal/return terminal from the schedule; never replace one.
        if (channel && fields.circuitClass === 'sensitive' && channel.signalTerminalId == null && channel.returnTerminalId !== terminal.id) {
          await channel.update({ signalTerminalId: terminal.id }, { transaction });
        } else if (channel && fields.circuitClass === 'return' && channel.returnTerminalId == null && channel.signalTerminalId !== terminal.id) {
          await channel.update({ returnTerminalId: terminal.id }, { transaction });
        }
      }
    } catch (err) {
      throw translateDbError(err);
    }
    await logAction(
      {
        actorId: actor.userId,
        projectId: actor.projectId,
        action: 'schedule.import',
        entity: 'Cabinet',
        entityId: cabinetId,
        detail: {
          cabinetTag: cabinet.tag,
          fileName: upload.name,
          mapping: a.preview.mapping,
          created: createdLabels,
          updated: updatedLabels,
          unchanged: result.unchanged,
          stripsCreated: result.stripsCreated,
          channelsCreated: result.channelsCreated,
        },
      },
      transaction,
    );
    return result;
  });
}

/** Every terminal of the cabinet in schedule order, for the export. */
export async function exportRows(projectId: number, cabinetId: number) {
  const cabinet = await findCabinet(projectId, cabinetId);
  const { items } = await listTerminals(projectId, cabinetId, { dir: 'asc', page: 1, pageSize: Number.MAX_SAFE_INTEGER });
  return { cabinet, items };
}
