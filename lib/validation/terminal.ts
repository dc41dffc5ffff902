/**
 * Terminal input (one row of the schedule), shared by the terminal dialog, the schedule
 * table's inline edit and paste, the import and the route handlers. Field rules follow
 * models/Terminal.ts; the hazard facts are checked on the whole record (`terminalFactsProblems`)
 * so an update is judged on the record as it would stand after the change.
 */
import { z } from 'zod';
import { CIRCUIT_CLASSES, CURRENT_KINDS, HAZARD_KINDS, type CircuitClass } from '@/models/enums';
import { idField, optionalText, requiredText, versionField } from './cabinet';

export const MAX_LEVEL = 6;
/** A whole cabinet in one request (the contract's page size limit). */
export const MAX_BULK_UPDATES = 5000;

function nonNegativeNumber(field: string, unit: string) {
  return z
    .number({ error: `${field} must be a number (${unit}).` })
    .min(0, { error: `${field} must be 0 or more (${unit}).` })
    .nullish()
    .transform((v) => (v === undefined ? null : v));
}

function oneOfOrNull<T extends readonly [string, ...string[]]>(field: string, values: T) {
  return z
    .enum(values, { error: `${field} must be one of: ${values.join(', ')}.` })
    .nullish()
    .transform((v) => v ?? null);
}

export const terminalFields = {
  stripId: idField('stripId'),
  position: z
    .number({ error: 'position must be a whole number of 1 or more.' })
    .int({ error: 'position must be a whole number of 1 or more.' })
    .min(1, { error: 'position must be a whole number of 1 or more.' }),
  level: z
    .number({ error: `level must be a whole number from 1 to ${MAX_LEVEL}.` })
    .int({ error: `level must be a whole number from 1 to ${MAX_LEVEL}.` })
    .min(1, { error: `level must be a whole number from 1 to ${MAX_LEVEL}.` })
    .max(MAX_LEVEL, { error: `level must be a whole number from 1 to ${MAX_LEVEL}.` }),
  blockId: optionalText('blockId', 40),
  label: requiredText('label', 40),
  terminalNumber: optionalText('terminalNumber', 20),
  wireNumber: optionalText('wireNumber', 40),
  cableId: optionalText('cableId', 40),
  cableCore: optionalText('cableCore', 20),
  connector: optionalText('connector', 40),
  wireColour: optionalText('wireColour', 30),
  circuitClass: z.enum(CIRCUIT_CLASSES, {
    error: `circuitClass must be one of: ${CIRCUIT_CLASSES.join(', ')}.`,
  }),
  hazardKind: oneOfOrNull('hazardKind', HAZARD_KINDS),
  nominalVoltage: nonNegativeNumber('nominalVoltage', 'V, RMS for AC'),
  currentKind: oneOfOrNull('currentKind', CURRENT_KINDS),
  frequency: nonNegativeNumber('frequency', 'Hz'),
  sourceImpedance: nonNegativeNumber('sourceImpedance', 'Ω'),
  bridgeGroup: optionalText('bridgeGroup', 40),
  channelId: idField('channelId')
    .nullish()
    .transform((v) => v ?? null),
  notes: optionalText('notes', 2000),
};

/** The facts that decide whether a terminal's electrical description is complete. */
export interface TerminalFacts {
  circuitClass: CircuitClass;
  hazardKind?: string | null;
  nominalVoltage?: number | null;
  currentKind?: string | null;
  frequency?: number | null;
}

/**
 * Cross-field rules of the model (models/Terminal.ts `hazardFacts`), as field → messages:
 * a hazard needs its kind, nominal voltage and AC/DC (and a frequency when AC); only a hazard
 * carries a hazard kind. Empty when the record is consistent.
 */
export function terminalFactsProblems(t: TerminalFacts): Record<string, string[]> {
  const problems: Record<string, string[]> = {};
  const add = (field: string, message: string) => (problems[field] ??= []).push(message);
  if (t.circuitClass === 'hazard') {
    if (!t.hazardKind)
      add(
        'hazardKind',
        `hazardKind is required on a hazard terminal (${HAZARD_KINDS.join(', ')}).`,
      );
    if (t.nominalVoltage === null || t.nominalVoltage === undefined) {
      add('nominalVoltage', 'nominalVoltage is required on a hazard terminal (V, RMS for AC).');
    }
    if (!t.currentKind)
      add('currentKind', 'currentKind is required on a hazard terminal (ac or dc).');
    if (t.currentKind === 'ac' && !t.frequency) {
      add('frequency', 'frequency is required on an AC hazard terminal (Hz, e.g. 50 or 60).');
    }
  } else if (t.hazardKind) {
    add('hazardKind', `hazardKind is only for hazard terminals (this one is ${t.circuitClass}).`);
  }
  return problems;
}

const terminalObject = z.object({
  ...terminalFields,
  level: terminalFields.level.default(1),
});

export const terminalCreateSchema = terminalObject.strict().superRefine((t, ctx) => {
  for (const [field, messages] of Object.entries(terminalFactsProblems(t))) {
    for (const message of messages) ctx.addIssue({ code: 'custom', message, path: [field] });
  }
});
export type TerminalCreateInput = z.input<typeof terminalCreateSchema>;
export type TerminalCreate = z.output<typeof terminalCreateSchema>;

/** The changed fields of one terminal (no version): field rules only; the facts are checked after merging. */
export const terminalChangesSchema = z.object(terminalFields).partial().strict();
export type TerminalChanges = z.output<typeof terminalChangesSchema>;

export const terminalUpdateSchema = terminalChangesSchema.extend({ version: versionField });
export type TerminalUpdateInput = z.input<typeof terminalUpdateSchema>;
export type TerminalUpdate = z.output<typeof terminalUpdateSchema>;

export const terminalBulkUpdateSchema = z
  .object({
    updates: z
      .array(
        z
          .object({ id: idField('id'), version: versionField, changes: terminalChangesSchema })
          .strict(),
        { error: 'updates must be a list of { id, version, changes }.' },
      )
      .min(1, { error: 'updates must hold at least one change.' })
      .max(MAX_BULK_UPDATES, { error: `updates may hold at most ${MAX_BULK_UPDATES} changes.` }),
  })
  .strict()
  .superRefine((body, ctx) => {
    const seen = new Map<number, number>();
    body.updates.forEach((u, i) => {
      const first = seen.get(u.id);
      if (first !== undefined) {
        ctx.addIssue({
          code: 'custom',
          message: `terminal ${u.id} is already changed by updates.${first}; send one change per terminal.`,
          path: ['updates', i, 'id'],
        });
      } else seen.set(u.id, i);
    });
  });
export type TerminalBulkUpdate = z.output<typeof terminalBulkUpdateSchema>;

/** Columns the schedule list may sort by (the contract's `sort=`). */
export const TERMINAL_SORT_FIELDS = [
  'position',
  'level',
  'blockId',
  'label',
  'terminalNumber',
  'wireNumber',
  'cableId',
  'cableCore',
  'connector',
  'wireColour',
  'circuitClass',
  'hazardKind',
  'nominalVoltage',
  'currentKind',
  'frequency',
  'bridgeGroup',
  'stripTag',
  'channelTag',
  'updatedAt',
] as const;
export type TerminalSortField = (typeof TERMINAL_SORT_FIELDS)[number];

export const MAX_PAGE_SIZE = 5000;

const pageNumber = (field: string, max?: number) =>
  z
    .string()
    .regex(/^[1-9]\d*$/, { error: `${field} must be a whole number of 1 or more.` })
    .transform(Number)
    .refine((n) => max === undefined || n <= max, { error: `${field} must be at most ${max}.` });

/** The schedule list's query string: sorting, filtering and paging. */
export const terminalListQuerySchema = z.object({
  sort: z
    .enum(TERMINAL_SORT_FIELDS, {
      error: `sort must be one of: ${TERMINAL_SORT_FIELDS.join(', ')}.`,
    })
    .optional(),
  dir: z.enum(['asc', 'desc'], { error: 'dir must be asc or desc.' }).default('asc'),
  q: z.string().trim().max(100, { error: 'q must be at most 100 characters.' }).optional(),
  stripId: pageNumber('stripId').optional(),
  circuitClass: z
    .enum(CIRCUIT_CLASSES, { error: `circuitClass must be one of: ${CIRCUIT_CLASSES.join(', ')}.` })
    .optional(),
  page: pageNumber('page').default(1),
  pageSize: pageNumber('pageSize', MAX_PAGE_SIZE).default(500),
});
export type TerminalListQuery = z.output<typeof terminalListQuerySchema>;
