/**
 * Row-by-row reading of a mapped table: each cell parsed by its column's rule, each problem
 * reported as { column, message } on the row number the spreadsheet shows. What needs the
 * database (channel tags, the record a row updates) is checked by lib/data/schedule/import.ts.
 */
import type { CircuitClass, CurrentKind, HazardKind } from '@/models/enums';
import { COLUMN_FIELD, COLUMN_PARSERS, SCHEDULE_COLUMNS, type ScheduleColumn } from './columns';
import type { ColumnMapping } from './mapping';
import type { ScheduleTable } from './read';

export interface CellProblem {
  column: string;
  message: string;
}

/** The Terminal fields an import row may set (only those whose column is mapped are present). */
export interface ImportedFields {
  position: number;
  level: number;
  label: string;
  circuitClass: CircuitClass;
  blockId?: string | null;
  terminalNumber?: string | null;
  wireNumber?: string | null;
  cableId?: string | null;
  cableCore?: string | null;
  connector?: string | null;
  wireColour?: string | null;
  hazardKind?: HazardKind | null;
  nominalVoltage?: number | null;
  currentKind?: CurrentKind | null;
  frequency?: number | null;
  sourceImpedance?: number | null;
  bridgeGroup?: string | null;
  notes?: string | null;
}

export interface ImportRow {
  /** Row number as the spreadsheet shows it (header = 1). */
  row: number;
  /** The mapped cells, as the file has them. */
  values: Partial<Record<ScheduleColumn, string>>;
  errors: CellProblem[];
  /** Present when every cell parsed. `channelTag` undefined: the file has no channel column. */
  parsed?: { stripTag: string; channelTag?: string | null; fields: ImportedFields };
}

export function rowKey(stripTag: string, position: number, level: number): string {
  return `${stripTag}\u0000${position}\u0000${level}`;
}

export function readRows(table: ScheduleTable, mapping: ColumnMapping): ImportRow[] {
  const columnIndex = new Map<ScheduleColumn, number>();
  for (const column of SCHEDULE_COLUMNS) {
    const header = mapping[column];
    if (header !== undefined) columnIndex.set(column, table.headers.indexOf(header));
  }
  const firstRowOfKey = new Map<string, number>();
  return table.rows.map(({ row, cells }) => {
    const values: ImportRow['values'] = {};
    const errors: CellProblem[] = [];
    const out: Record<string, string | number | null> = {};
    for (const [column, index] of columnIndex) {
      const raw = index >= 0 ? (cells[index] ?? '') : '';
      values[column] = raw;
      const parsed = COLUMN_PARSERS[column](column, raw);
      if (parsed.ok) out[COLUMN_FIELD[column]] = parsed.value;
      else errors.push({ column, message: parsed.message });
    }
    if (!columnIndex.has('level')) out.level = 1;
    const result: ImportRow = { row, values, errors };
    if (errors.length === 0) {
      const { stripTag, channelTag, ...fields } = out;
      const key = rowKey(String(stripTag), Number(fields.position), Number(fields.level));
      const first = firstRowOfKey.get(key);
      if (first !== undefined) {
        errors.push({
          column: 'position',
          message: `strip ${stripTag} position ${fields.position} level ${fields.level} is also on row ${first}; each place may appear once.`,
        });
      } else {
        firstRowOfKey.set(key, row);
        result.parsed = {
          stripTag: String(stripTag),
          ...(columnIndex.has('channel')
            ? { channelTag: (channelTag as string | null) ?? null }
            : {}),
          fields: fields as unknown as ImportedFields,
        };
      }
    }
    return result;
  });
}
