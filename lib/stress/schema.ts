/**
 * zod schemas for the stress engine's JSON input. Every value accepts a number (SI) or an
 * engineering-notation string ("4k99", "0.25W", "100n"); the output is the SI-number types of
 * ./types. Errors carry the field path (e.g. guard.stages.0.series.resistance).
 */
import { z } from 'zod';
import { EngParseError, parseEng, type UnitSymbol } from '../units';
import type { Guard, ShuntElement, StressCase, StressConditions } from './types';

type Bound = 'positive' | 'nonnegative' | 'any';

function eng(unit: UnitSymbol, bound: Bound = 'positive') {
  return z
    .union([z.number(), z.string()], {
      error: (issue) =>
        issue.input === undefined
          ? `required (a value in ${unit})`
          : `must be a number or an engineering-notation string such as "4k99" (${unit})`,
    })
    .transform((raw, ctx): number => {
      let value: number;
      try {
        value = parseEng(raw, unit);
      } catch (error) {
        ctx.addIssue({
          code: 'custom',
          message: error instanceof EngParseError ? error.message : String(error),
        });
        return z.NEVER;
      }
      if (bound === 'positive' && !(value > 0)) {
        ctx.addIssue({ code: 'custom', message: `must be greater than 0 ${unit} (got ${value})` });
        return z.NEVER;
      }
      if (bound === 'nonnegative' && !(value >= 0)) {
        ctx.addIssue({ code: 'custom', message: `must not be negative (got ${value} ${unit})` });
        return z.NEVER;
      }
      return value;
    });
}

const id = z.string().trim().min(1, 'element id is required').max(40);

const resistor = z.strictObject({
  kind: z.literal('resistor'),
  id,
  resistance: eng('Ω', 'nonnegative'),
  ratedPower: eng('W').optional(),
  limitingVoltage: eng('V').optional(),
  overloadVoltage: eng('V').optional(),
  pulseEnergy: eng('J').optional(),
});
const ptc = z
  .strictObject({
    kind: z.literal('ptc'),
    id,
    resistance: eng('Ω', 'nonnegative'),
    holdCurrent: eng('A'),
    tripCurrent: eng('A'),
    maxVoltage: eng('V').optional(),
    maxCurrent: eng('A').optional(),
  })
  .refine((p) => p.tripCurrent >= p.holdCurrent, {
    message: 'trip current must not be below the hold current',
    path: ['tripCurrent'],
  });
const fuse = z.strictObject({
  kind: z.literal('fuse'),
  id,
  ratedCurrent: eng('A'),
  voltageRating: eng('V').optional(),
  meltingI2t: eng('A²s').optional(),
  resistance: eng('Ω', 'nonnegative').optional(),
});
const wire = z.strictObject({ kind: z.literal('wire'), id, resistance: eng('Ω', 'nonnegative') });
const series = z.discriminatedUnion('kind', [resistor, ptc, fuse, wire], {
  error: (issue) =>
    `unknown series element kind ${JSON.stringify((issue.input as { kind?: unknown } | undefined)?.kind)}: expected resistor, ptc, fuse or wire`,
});

const railDiodes = z
  .strictObject({
    kind: z.literal('railDiodes'),
    id,
    forwardVoltage: eng('V'),
    forwardCurrent: eng('A'),
    averageCurrent: eng('A').optional(),
    surgeCurrent: eng('A').optional(),
    surgeDuration: eng('s').optional(),
    emissionCoefficient: z.number().min(0.5).max(4).optional(),
    seriesResistance: eng('Ω', 'nonnegative').optional(),
  })
  .refine(
    (d) =>
      d.seriesResistance === undefined || d.forwardVoltage > d.forwardCurrent * d.seriesResistance,
    {
      message: 'series resistance × forward current must stay below the forward voltage',
      path: ['seriesResistance'],
    },
  );
const zener = z.strictObject({
  kind: z.literal('zener'),
  id,
  bidirectional: z.boolean(),
  zenerVoltage: eng('V'),
  testCurrent: eng('A').optional(),
  dynamicImpedance: eng('Ω'),
  powerRating: eng('W').optional(),
  forwardVoltage: eng('V').optional(),
  forwardCurrent: eng('A').optional(),
});
const tvs = z
  .strictObject({
    kind: z.literal('tvs'),
    id,
    bidirectional: z.boolean(),
    standoffVoltage: eng('V'),
    breakdownVoltage: eng('V'),
    clampVoltage: eng('V'),
    peakPulseCurrent: eng('A'),
    peakPulsePower: eng('W').optional(),
    testCurrent: eng('A').optional(),
    steadyPower: eng('W').optional(),
    forwardVoltage: eng('V').optional(),
    forwardCurrent: eng('A').optional(),
  })
  .refine((t) => t.breakdownVoltage >= t.standoffVoltage, {
    message: 'breakdown voltage must not be below the stand-off voltage',
    path: ['breakdownVoltage'],
  })
  .refine((t) => t.clampVoltage > t.breakdownVoltage, {
    message: 'clamping voltage must exceed the breakdown voltage',
    path: ['clampVoltage'],
  })
  .refine((t) => t.peakPulseCurrent > (t.testCurrent ?? 1e-3), {
    message: 'peak pulse current must exceed the breakdown test current',
    path: ['peakPulseCurrent'],
  });
const varistor = z
  .strictObject({
    kind: z.literal('varistor'),
    id,
    maxContinuousVoltage: eng('V'),
    varistorVoltage: eng('V'),
    clampVoltage: eng('V'),
    clampCurrent: eng('A'),
    surgeCurrent: eng('A').optional(),
    surgeEnergy: eng('J').optional(),
    maxContinuousDcVoltage: eng('V').optional(),
  })
  .refine((v) => v.clampVoltage > v.varistorVoltage, {
    message: 'clamping voltage must exceed the varistor voltage at 1 mA',
    path: ['clampVoltage'],
  })
  .refine((v) => v.clampCurrent > 1e-3, {
    message: 'clamping current must exceed the 1 mA varistor-voltage current',
    path: ['clampCurrent'],
  });
const capacitor = z.strictObject({
  kind: z.literal('capacitor'),
  id,
  capacitance: eng('F'),
  voltageRating: eng('V').optional(),
});
const shuntResistor = z.strictObject({
  kind: z.literal('shuntResistor'),
  id,
  resistance: eng('Ω'),
  ratedPower: eng('W').optional(),
  limitingVoltage: eng('V').optional(),
  overloadVoltage: eng('V').optional(),
});
const SHUNT_KINDS = { railDiodes, zener, tvs, varistor, capacitor, shuntResistor } as const;
// Dispatch on kind first so an error names the fields of the intended element, not of all six.
const shunt = z.any().transform((raw: unknown, ctx) => {
  const kind = (raw as { kind?: unknown } | null)?.kind;
  const schema =
    typeof kind === 'string' && Object.hasOwn(SHUNT_KINDS, kind)
      ? SHUNT_KINDS[kind as keyof typeof SHUNT_KINDS]
      : null;
  if (!schema) {
    ctx.addIssue({
      code: 'custom',
      message: `unknown shunt element kind ${JSON.stringify(kind)}: expected ${Object.keys(SHUNT_KINDS).join(', ')}`,
    });
    return z.NEVER;
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues)
      ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
    return z.NEVER;
  }
  return parsed.data as ShuntElement;
});

const stage = z.strictObject({ series, shunts: z.array(shunt).max(12).default([]) });

const input = z
  .strictObject({
    positiveRail: eng('V', 'any'),
    negativeRail: eng('V', 'any'),
    absMaxBeyondRail: eng('V', 'nonnegative'),
    absMaxCurrent: eng('A').optional(),
    inputResistance: eng('Ω').optional(),
    positiveRailMinLoad: eng('A', 'nonnegative').optional(),
    negativeRailMinLoad: eng('A', 'nonnegative').optional(),
    internalClamps: z.boolean().optional(),
    clampForwardVoltage: eng('V').optional(),
    clampForwardCurrent: eng('A').optional(),
  })
  .refine((i) => i.positiveRail > i.negativeRail, {
    message: 'positive rail must be above the negative rail',
    path: ['positiveRail'],
  });

export const guardSchema = z
  .strictObject({ stages: z.array(stage).max(8), input })
  .superRefine((g, ctx) => {
    const seen = new Set<string>();
    g.stages.forEach((s, k) => {
      for (const [path, el] of [
        [['stages', k, 'series', 'id'], s.series],
        ...s.shunts.map((sh, j) => [['stages', k, 'shunts', j, 'id'], sh] as const),
      ] as const) {
        if (seen.has(el.id))
          ctx.addIssue({
            code: 'custom',
            message: `duplicate element id "${el.id}"`,
            path: [...path],
          });
        seen.add(el.id);
      }
    });
  });

const kindError = (allowed: string) => ({
  error: (issue: { input?: unknown }) =>
    `unknown kind ${JSON.stringify((issue.input as { kind?: unknown } | undefined)?.kind)}: expected one of ${allowed}`,
});

export const stressCaseSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('dc'),
      voltage: eng('V', 'any'),
      sourceResistance: eng('Ω', 'nonnegative'),
    }),
    z.strictObject({
      kind: z.literal('ac'),
      rmsVoltage: eng('V', 'nonnegative'),
      frequency: eng('Hz'),
      sourceResistance: eng('Ω', 'nonnegative'),
    }),
    z.strictObject({
      kind: z.literal('surge'),
      peakVoltage: eng('V', 'any'),
      couplingResistance: eng('Ω', 'nonnegative'),
    }),
    z.strictObject({ kind: z.literal('esd'), voltage: eng('V', 'any') }),
  ],
  kindError('dc, ac, surge, esd'),
);

export const stressConditionsSchema = z.strictObject({
  ambientC: z.union([z.number(), z.string()]).transform((raw, ctx): number => {
    try {
      const v = parseEng(raw, '°C');
      if (v < -60 || v > 200) throw new EngParseError(`ambient ${v} °C is outside −60 … 200 °C`);
      return v;
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: (error as Error).message });
      return z.NEVER;
    }
  }),
  powerDerating: z.number().gt(0).max(1).default(0.5),
  voltageDerating: z.number().gt(0).max(1).default(0.8),
  appliedTo: z.enum(['signal', 'return']).optional(),
});

export const stressRequestSchema = z
  .strictObject({
    guard: guardSchema,
    case: stressCaseSchema.optional(),
    cases: z.array(stressCaseSchema).min(1).max(64).optional(),
    conditions: stressConditionsSchema.default({
      ambientC: 40,
      powerDerating: 0.5,
      voltageDerating: 0.8,
    }),
    waveform: z.boolean().optional(),
    maxWaveformPoints: z.number().int().min(2).max(100000).optional(),
  })
  .refine((r) => (r.case === undefined) !== (r.cases === undefined), {
    message: 'give exactly one of "case" or "cases"',
    path: ['case'],
  });

export interface StressRequest {
  guard: Guard;
  cases: StressCase[];
  conditions: StressConditions;
  waveform: boolean;
  maxWaveformPoints?: number;
}

export class StressInputError extends Error {
  readonly issues: { path: string; message: string }[];
  constructor(issues: { path: string; message: string }[]) {
    super(issues.map((i) => `${i.path || '(root)'}: ${i.message}`).join('\n'));
    this.name = 'StressInputError';
    this.issues = issues;
  }
}

function parseWith<T>(schema: z.ZodType<T>, value: unknown, prefix: string): T {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  throw new StressInputError(
    parsed.error.issues.map((issue) => ({
      path: [prefix, ...issue.path.map(String)].filter((p) => p !== '').join('.'),
      message: issue.message,
    })),
  );
}

export function parseGuard(value: unknown, prefix = 'guard'): Guard {
  return parseWith(guardSchema, value, prefix);
}
export function parseStressCase(value: unknown, prefix = 'case'): StressCase {
  return parseWith(stressCaseSchema, value, prefix);
}
export function parseStressConditions(value: unknown, prefix = 'conditions'): StressConditions {
  return parseWith(stressConditionsSchema, value, prefix);
}
export function parseStressRequest(value: unknown): StressRequest {
  const r = parseWith(stressRequestSchema, value, '');
  return {
    guard: r.guard,
    cases: r.cases ?? (r.case ? [r.case] : []),
    conditions: r.conditions,
    waveform: r.waveform ?? false,
    maxWaveformPoints: r.maxWaveformPoints,
  };
}
