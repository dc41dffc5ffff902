/**
 * The column-mapping step: which of the file's headers feeds each of our columns. A
 * suggestion is made from the header names (case, spacing and punctuation ignored, plus a
 * few synonyms of our own); the user may change it before the preview.
 */
import {
  COLUMN_SYNONYMS,
  normaliseHeader,
  REQUIRED_COLUMNS,
  SCHEDULE_COLUMNS,
  type ScheduleColumn,
} from './columns';

/** { ourColumn: theirHeader } */
export type ColumnMapping = Partial<Record<ScheduleColumn, string>>;

export interface MappingProblem {
  column: string;
  message: string;
}

export function suggestMapping(headers: string[]): ColumnMapping {
  const normalised = headers.map(normaliseHeader);
  const used = new Set<number>();
  const mapping: ColumnMapping = {};
  const claim = (column: ScheduleColumn, candidates: readonly string[]) => {
    if (mapping[column] !== undefined) return;
    for (const candidate of candidates.map(normaliseHeader)) {
      const index = normalised.findIndex((h, i) => h === candidate && h !== '' && !used.has(i));
      if (index >= 0) {
        used.add(index);
        mapping[column] = headers[index];
        return;
      }
    }
  };
  // Our own names first, so a synonym never takes a header that names another column exactly.
  for (const column of SCHEDULE_COLUMNS) claim(column, [column]);
  for (const column of SCHEDULE_COLUMNS) claim(column, COLUMN_SYNONYMS[column]);
  return mapping;
}

/** Reads the `mapping` form field: JSON { ourColumn: theirHeader }; null when absent. */
export function parseMappingField(raw: string | null): {
  mapping: ColumnMapping | null;
  problems: MappingProblem[];
} {
  if (raw === null || raw.trim() === '') return { mapping: null, problems: [] };
  let value: unknown;
  try {
    value = JSON.parse(raw);
  } catch {
    return {
      mapping: null,
      problems: [
        { column: 'mapping', message: 'mapping must be JSON: { "ourColumn": "their header" }.' },
      ],
    };
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    return {
      mapping: null,
      problems: [
        {
          column: 'mapping',
          message: 'mapping must be an object: { "ourColumn": "their header" }.',
        },
      ],
    };
  }
  const mapping: ColumnMapping = {};
  const problems: MappingProblem[] = [];
  for (const [column, header] of Object.entries(value)) {
    if (!(SCHEDULE_COLUMNS as readonly string[]).includes(column)) {
      problems.push({
        column,
        message: `"${column}" is not one of our columns (${SCHEDULE_COLUMNS.join(', ')}).`,
      });
    } else if (header === null || header === '') {
      continue; // explicitly left unmapped
    } else if (typeof header !== 'string') {
      problems.push({ column, message: `the header mapped to ${column} must be text.` });
    } else mapping[column as ScheduleColumn] = header;
  }
  return { mapping, problems };
}

/** Problems with a mapping against the file's headers: unknown headers, a header used twice, required columns left out. */
export function checkMapping(mapping: ColumnMapping, headers: string[]): MappingProblem[] {
  const problems: MappingProblem[] = [];
  const seen = new Map<string, string>();
  for (const [column, header] of Object.entries(mapping) as [ScheduleColumn, string][]) {
    if (!headers.includes(header)) {
      problems.push({ column, message: `the file has no column headed "${header}".` });
      continue;
    }
    const other = seen.get(header);
    if (other)
      problems.push({
        column,
        message: `"${header}" is already mapped to ${other}; map each header once.`,
      });
    else seen.set(header, column);
  }
  for (const column of REQUIRED_COLUMNS) {
    if (mapping[column] === undefined)
      problems.push({
        column,
        message: `${column} is required: map one of the file's columns to it.`,
      });
  }
  return problems;
}
