/**
 * The schedule table's columns: our own column names (the same as the import/export columns),
 * how each cell reads as text, and how typed or pasted text becomes a field value. Pure: the
 * table, the paste handler and the tests share it.
 */
import { CIRCUIT_CLASSES, CURRENT_KINDS, HAZARD_KINDS } from '@/models/enums';
import { EngParseError, parseEng, type UnitSymbol } from '@/lib/units';
import type { ImportColumn } from './types';
import type { TerminalFields, TerminalRow } from './types';

export interface LookupContext {
  /** Strip tag → strip id in this cabinet. */
  stripsByTag: Map<string, number>;
  /** Channel tag → channel id in this cabinet. */
  channelsByTag: Map<string, number>;
}

export type CellParse =
  { ok: true; changes: Partial<TerminalFields> } | { ok: false; message: string };

export interface ScheduleColumn {
  id: ImportColumn;
  /** The field the cell edits (strip and channel are edited through their tags). */
  field: keyof TerminalFields;
  width: number;
  align?: 'right';
  /** Closed vocabularies offer a list while editing. */
  options?: readonly string[];
  /** Shown in the header's tooltip and beside the editor. */
  hint: string;
  text: (row: TerminalRow) => string;
  parse: (text: string, ctx: LookupContext) => CellParse;
  /** Value used for sorting (numbers sort numerically). */
  sortValue: (row: TerminalRow) => string | number;
}

const blank = (text: string) => text.trim() === '';
const ok = (changes: Partial<TerminalFields>): CellParse => ({ ok: true, changes });
const bad = (message: string): CellParse => ({ ok: false, message });

function textColumn(
  id: ImportColumn,
  field: keyof TerminalFields,
  width: number,
  hint: string,
  opts: { required?: boolean; max?: number } = {},
): ScheduleColumn {
  const max = opts.max ?? 40;
  return {
    id,
    field,
    width,
    hint,
    text: (row) => (row[field] as string | null) ?? '',
    sortValue: (row) => ((row[field] as string | null) ?? '').toLowerCase(),
    parse: (text) => {
      const value = text.trim();
      if (value === '')
        return opts.required ? bad(`${id} must not be empty.`) : ok({ [field]: null });
      if (value.length > max)
        return bad(`${id} is at most ${max} characters (this has ${value.length}).`);
      return ok({ [field]: value });
    },
  };
}

function wholeColumn(
  id: ImportColumn,
  field: 'position' | 'level',
  width: number,
  min: number,
  max: number,
  hint: string,
): ScheduleColumn {
  return {
    id,
    field,
    width,
    align: 'right',
    hint,
    text: (row) => String(row[field]),
    sortValue: (row) => row[field],
    parse: (text) => {
      const value = text.trim();
      if (value === '') return bad(`${id} must not be empty.`);
      if (!/^\d+$/.test(value)) return bad(`${id} must be a whole number (got "${value}").`);
      const n = Number(value);
      if (n < min || n > max) return bad(`${id} must be between ${min} and ${max}.`);
      return ok({ [field]: n });
    },
  };
}

function engColumn(
  id: ImportColumn,
  field: 'nominalVoltage' | 'frequency' | 'sourceImpedance',
  unit: UnitSymbol,
  width: number,
  hint: string,
): ScheduleColumn {
  return {
    id,
    field,
    width,
    align: 'right',
    hint,
    text: (row) => (row[field] === null ? '' : String(row[field])),
    sortValue: (row) => row[field] ?? -1,
    parse: (text) => {
      if (blank(text)) return ok({ [field]: null });
      try {
        const n = parseEng(text, unit);
        if (n < 0) return bad(`${id} must be 0 or more.`);
        return ok({ [field]: n });
      } catch (error) {
        return bad(`${id}: ${error instanceof EngParseError ? error.message : 'not a number'}.`);
      }
    },
  };
}

function enumColumn(
  id: ImportColumn,
  field: 'circuitClass' | 'hazardKind' | 'currentKind',
  options: readonly string[],
  width: number,
  hint: string,
  required = false,
): ScheduleColumn {
  return {
    id,
    field,
    width,
    options,
    hint,
    text: (row) => (row[field] as string | null) ?? '',
    sortValue: (row) => (row[field] as string | null) ?? '',
    parse: (text) => {
      const value = text.trim().toLowerCase();
      if (value === '') return required ? bad(`${id} must not be empty.`) : ok({ [field]: null });
      if (!options.includes(value))
        return bad(`${id} must be one of ${options.join(', ')} (got "${text.trim()}").`);
      return ok({ [field]: value as never });
    },
  };
}

export const SCHEDULE_COLUMNS: ScheduleColumn[] = [
  {
    id: 'strip',
    field: 'stripId',
    width: 72,
    hint: 'Strip tag in this cabinet, e.g. X3',
    text: (row) => row.stripTag,
    sortValue: (row) => row.stripTag.toLowerCase(),
    parse: (text, ctx) => {
      const tag = text.trim();
      const id = ctx.stripsByTag.get(tag);
      if (id === undefined) {
        const known = [...ctx.stripsByTag.keys()].join(', ');
        return bad(`strip "${tag}" is not a strip of this cabinet (${known || 'none yet'}).`);
      }
      return ok({ stripId: id });
    },
  },
  wholeColumn('position', 'position', 72, 1, 10_000, 'Position along the strip, 1 = first'),
  wholeColumn('level', 'level', 56, 1, 6, 'Level of a multi-level block, 1 = bottom'),
  textColumn('block', 'blockId', 80, 'Block id; stacked levels share it'),
  textColumn('label', 'label', 96, 'Printed marker, e.g. X3:14', { required: true }),
  textColumn('terminal_no', 'terminalNumber', 84, 'Number on the terminal itself', { max: 20 }),
  textColumn('wire_no', 'wireNumber', 96, 'Wire number'),
  textColumn('cable', 'cableId', 96, 'Cable id'),
  textColumn('core', 'cableCore', 64, 'Core of the cable', { max: 20 }),
  textColumn('connector', 'connector', 96, 'Connector'),
  textColumn('colour', 'wireColour', 84, 'Wire colour', { max: 30 }),
  enumColumn(
    'circuit_class',
    'circuitClass',
    CIRCUIT_CLASSES,
    112,
    CIRCUIT_CLASSES.join(' · '),
    true,
  ),
  enumColumn(
    'hazard_kind',
    'hazardKind',
    HAZARD_KINDS,
    120,
    'Hazard terminals only: ' + HAZARD_KINDS.join(' · '),
  ),
  engColumn('voltage', 'nominalVoltage', 'V', 84, 'Nominal volts (RMS for AC), e.g. 230, 24V, 400'),
  enumColumn('ac_dc', 'currentKind', CURRENT_KINDS, 64, 'ac or dc'),
  engColumn('frequency_hz', 'frequency', 'Hz', 96, 'Hz, for AC hazards'),
  engColumn(
    'source_ohms',
    'sourceImpedance',
    'Ω',
    96,
    'Source impedance, e.g. 0R5, 2, 10k; blank = default',
  ),
  textColumn('bridge', 'bridgeGroup', 80, 'Jumper or comb group'),
  {
    id: 'channel',
    field: 'channelId',
    width: 104,
    hint: 'Channel tag of this cabinet; blank = none',
    text: (row) => row.channelTag ?? '',
    sortValue: (row) => (row.channelTag ?? '').toLowerCase(),
    parse: (text, ctx) => {
      const tag = text.trim();
      if (tag === '') return ok({ channelId: null });
      const id = ctx.channelsByTag.get(tag);
      if (id === undefined)
        return bad(`channel "${tag}" is not a channel of this cabinet; create it first.`);
      return ok({ channelId: id });
    },
  },
  textColumn('notes', 'notes', 200, 'Free text', { max: 2000 }),
];

export const COLUMN_BY_ID = new Map(SCHEDULE_COLUMNS.map((c) => [c.id, c]));

/** Column ids shown by default; the rest can be turned on. */
export const DEFAULT_HIDDEN: ImportColumn[] = [
  'terminal_no',
  'connector',
  'frequency_hz',
  'source_ohms',
  'notes',
];

/**
 * Tab-separated text from a spreadsheet → a grid of cells. A trailing newline (spreadsheets
 * add one) is not a row; quoted cells with embedded tabs or newlines are unquoted.
 */
export function parseClipboardGrid(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  const normalised = text.replace(/\r\n?/g, '\n');
  for (let i = 0; i < normalised.length; i++) {
    const ch = normalised[i];
    if (quoted) {
      if (ch === '"' && normalised[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell === '') quoted = true;
    else if (ch === '\t') {
      row.push(cell);
      cell = '';
    } else if (ch === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
    } else cell += ch;
  }
  if (cell !== '' || row.length > 0) {
    row.push(cell);
    rows.push(row);
  }
  return rows;
}

/** Fields that differ between two versions of a terminal, named by our column names. */
export function describeDifferences(before: TerminalRow, after: TerminalRow): string[] {
  const out: string[] = [];
  for (const column of SCHEDULE_COLUMNS) {
    const a = column.text(before);
    const b = column.text(after);
    if (a !== b) out.push(`${column.id}: “${a || '—'}” → “${b || '—'}”`);
  }
  return out;
}
