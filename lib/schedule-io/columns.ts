/**
 * The schedule's import/export columns: our own names, what each holds, how a cell's text
 * becomes a field value (with the message a spreadsheet user needs when it cannot), and how
 * a field is written back out. README "Schedule import and export columns" documents them.
 */
import { parseEng, type UnitSymbol } from '@/lib/units';
import { CIRCUIT_CLASSES, CURRENT_KINDS, HAZARD_KINDS } from '@/models/enums';
import { MAX_LEVEL } from '@/lib/validation/terminal';

export const SCHEDULE_COLUMNS = [
  'strip',
  'position',
  'level',
  'block',
  'label',
  'terminal_no',
  'wire_no',
  'cable',
  'core',
  'connector',
  'colour',
  'circuit_class',
  'hazard_kind',
  'voltage',
  'ac_dc',
  'frequency_hz',
  'source_ohms',
  'bridge',
  'channel',
  'notes',
] as const;
export type ScheduleColumn = (typeof SCHEDULE_COLUMNS)[number];

/** Columns a file must have (mapped) to be imported at all. */
export const REQUIRED_COLUMNS: readonly ScheduleColumn[] = [
  'strip',
  'position',
  'label',
  'circuit_class',
];

/** The Terminal field a column fills; strip and channel are looked up by tag. */
export const COLUMN_FIELD = {
  strip: 'stripTag',
  position: 'position',
  level: 'level',
  block: 'blockId',
  label: 'label',
  terminal_no: 'terminalNumber',
  wire_no: 'wireNumber',
  cable: 'cableId',
  core: 'cableCore',
  connector: 'connector',
  colour: 'wireColour',
  circuit_class: 'circuitClass',
  hazard_kind: 'hazardKind',
  voltage: 'nominalVoltage',
  ac_dc: 'currentKind',
  frequency_hz: 'frequency',
  source_ohms: 'sourceImpedance',
  bridge: 'bridgeGroup',
  channel: 'channelTag',
  notes: 'notes',
} as const satisfies Record<ScheduleColumn, string>;
export type ImportField = (typeof COLUMN_FIELD)[ScheduleColumn];

/** The column that shows a Terminal field (to place a record-level error on a cell). */
export const FIELD_COLUMN = Object.fromEntries(
  Object.entries(COLUMN_FIELD).map(([column, field]) => [field, column]),
) as Record<ImportField, ScheduleColumn>;

/** Other header names we recognise for each column (compared case-, space- and punctuation-blind). */
export const COLUMN_SYNONYMS: Record<ScheduleColumn, readonly string[]> = {
  strip: ['rail', 'terminal strip', 'strip tag'],
  position: ['pos', 'slot', 'place'],
  level: ['tier', 'deck', 'storey'],
  block: ['block id', 'block tag'],
  label: ['marker', 'terminal label', 'terminal marker'],
  terminal_no: ['terminal number', 'term no', 'number', 'no'],
  wire_no: ['wire number', 'wire', 'wire id', 'ferrule'],
  cable: ['cable id', 'cable tag'],
  core: ['cable core', 'core no', 'conductor'],
  connector: ['plug', 'connector pin'],
  colour: ['color', 'wire colour', 'wire color', 'insulation colour'],
  circuit_class: ['class', 'circuit', 'circuit type'],
  hazard_kind: ['hazard', 'hazard type', 'source kind'],
  voltage: ['nominal voltage', 'volts', 'voltage v', 'un'],
  ac_dc: ['acdc', 'current kind', 'supply kind', 'ac or dc'],
  frequency_hz: ['frequency', 'freq', 'hz'],
  source_ohms: ['source impedance', 'source resistance', 'impedance ohms', 'zsource'],
  bridge: ['bridge group', 'jumper', 'comb'],
  channel: ['channel tag', 'io tag', 'i o tag', 'signal tag'],
  notes: ['note', 'remarks', 'comment', 'comments'],
};

/** A header as compared for mapping: lower case, letters and digits only. */
export function normaliseHeader(header: string): string {
  return header.toLowerCase().replace(/[^a-z0-9]/g, '');
}

type Parsed = { ok: true; value: string | number | null } | { ok: false; message: string };

const ok = (value: string | number | null): Parsed => ({ ok: true, value });
const bad = (message: string): Parsed => ({ ok: false, message });

function text(max: number, required = false) {
  return (column: string, raw: string): Parsed => {
    if (raw === '') return required ? bad(`${column} is required.`) : ok(null);
    if (raw.length > max)
      return bad(`${column} must be at most ${max} characters (has ${raw.length}).`);
    return ok(raw);
  };
}

function wholeNumber(min: number, max: number | null, fallback: number | null) {
  return (column: string, raw: string): Parsed => {
    const range = max === null ? `of ${min} or more` : `from ${min} to ${max}`;
    if (raw === '')
      return fallback === null
        ? bad(`${column} is required (a whole number ${range}).`)
        : ok(fallback);
    if (!/^[+]?\d+(\.0+)?$/.test(raw))
      return bad(`${column} must be a whole number ${range}; "${raw}" is not.`);
    const n = Number(raw);
    if (n < min || (max !== null && n > max))
      return bad(`${column} must be a whole number ${range}; got ${n}.`);
    return ok(n);
  };
}

function oneOf(values: readonly string[]) {
  return (column: string, raw: string): Parsed => {
    if (raw === '') return ok(null);
    const value = raw.toLowerCase();
    if (!values.includes(value))
      return bad(`${column} "${raw}" is not one of: ${values.join(', ')}.`);
    return ok(value);
  };
}

function measure(unit: UnitSymbol, unitWords: string) {
  return (column: string, raw: string): Parsed => {
    if (raw === '') return ok(null);
    let value: number;
    try {
      value = parseEng(raw, unit);
    } catch {
      return bad(
        `${column} must be a number in ${unitWords} (e.g. 230, 24V, 1k); "${raw}" is not.`,
      );
    }
    if (value < 0) return bad(`${column} must be 0 or more; got ${raw}.`);
    return ok(value);
  };
}

/** Cell text → field value, or the reason it cannot be one. Cells arrive trimmed. */
export const COLUMN_PARSERS: Record<ScheduleColumn, (column: string, raw: string) => Parsed> = {
  strip: text(20, true),
  position: wholeNumber(1, null, null),
  level: wholeNumber(1, MAX_LEVEL, 1),
  block: text(40),
  label: text(40, true),
  terminal_no: text(20),
  wire_no: text(40),
  cable: text(40),
  core: text(20),
  connector: text(40),
  colour: text(30),
  circuit_class: (column, raw) =>
    raw === ''
      ? bad(`${column} is required (${CIRCUIT_CLASSES.join(', ')}).`)
      : oneOf(CIRCUIT_CLASSES)(column, raw),
  hazard_kind: oneOf(HAZARD_KINDS),
  voltage: measure('V', 'volts (RMS for AC)'),
  ac_dc: oneOf(CURRENT_KINDS),
  frequency_hz: measure('Hz', 'hertz'),
  source_ohms: measure('Ω', 'ohms'),
  bridge: text(40),
  channel: text(40),
  notes: text(2000),
};

/** A terminal row as the export writes it: field values by column. */
export type ExportRow = Record<ScheduleColumn, string | number | null>;
