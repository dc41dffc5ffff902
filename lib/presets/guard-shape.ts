/**
 * Structural check of a stored Guard (lib/stress/types.ts): known element kinds, required
 * figures present as finite SI numbers, optional figures numeric when given. It does not
 * judge whether values are sensible — that is the engine's job. Pure; shared by the model
 * validator, seeders and forms.
 */
import type { Guard, ProtectedInput, SeriesElement, ShuntElement } from '@/lib/stress/types';

/** How a field must appear: a required or optional finite number, or a boolean. */
type Role = 'number' | 'number?' | 'boolean' | 'boolean?';
type FieldSpec = Readonly<Record<string, Role>>;

/**
 * One entry per field of each element type (Record over its keys): this fails to compile
 * when lib/stress/types.ts gains or loses a field, so the list cannot drift from the engine's.
 */
type SpecOf<E> = Readonly<Record<Exclude<keyof E, 'kind' | 'id'>, Role>>;
type SeriesSpecs = { [K in SeriesElement['kind']]: SpecOf<Extract<SeriesElement, { kind: K }>> };
type ShuntSpecs = { [K in ShuntElement['kind']]: SpecOf<Extract<ShuntElement, { kind: K }>> };

const SERIES: SeriesSpecs = {
  resistor: {
    resistance: 'number',
    ratedPower: 'number?',
    limitingVoltage: 'number?',
    overloadVoltage: 'number?',
    pulseEnergy: 'number?',
  },
  ptc: {
    resistance: 'number',
    holdCurrent: 'number',
    tripCurrent: 'number',
    maxVoltage: 'number?',
    maxCurrent: 'number?',
  },
  fuse: {
    ratedCurrent: 'number',
    voltageRating: 'number?',
    meltingI2t: 'number?',
    resistance: 'number?',
  },
  wire: { resistance: 'number' },
};

const SHUNT: ShuntSpecs = {
  railDiodes: {
    forwardVoltage: 'number',
    forwardCurrent: 'number',
    averageCurrent: 'number?',
    surgeCurrent: 'number?',
    surgeDuration: 'number?',
    emissionCoefficient: 'number?',
    seriesResistance: 'number?',
  },
  zener: {
    bidirectional: 'boolean',
    zenerVoltage: 'number',
    dynamicImpedance: 'number',
    testCurrent: 'number?',
    powerRating: 'number?',
    forwardVoltage: 'number?',
    forwardCurrent: 'number?',
  },
  tvs: {
    bidirectional: 'boolean',
    standoffVoltage: 'number',
    breakdownVoltage: 'number',
    clampVoltage: 'number',
    peakPulseCurrent: 'number',
    peakPulsePower: 'number?',
    testCurrent: 'number?',
    steadyPower: 'number?',
    forwardVoltage: 'number?',
    forwardCurrent: 'number?',
  },
  varistor: {
    maxContinuousVoltage: 'number',
    varistorVoltage: 'number',
    clampVoltage: 'number',
    clampCurrent: 'number',
    surgeCurrent: 'number?',
    surgeEnergy: 'number?',
    maxContinuousDcVoltage: 'number?',
  },
  capacitor: { capacitance: 'number', voltageRating: 'number?' },
  shuntResistor: {
    resistance: 'number',
    ratedPower: 'number?',
    limitingVoltage: 'number?',
    overloadVoltage: 'number?',
  },
};

const INPUT: SpecOf<ProtectedInput> = {
  positiveRail: 'number',
  negativeRail: 'number',
  absMaxBeyondRail: 'number',
  absMaxCurrent: 'number?',
  inputResistance: 'number?',
  positiveRailMinLoad: 'number?',
  negativeRailMinLoad: 'number?',
  internalClamps: 'boolean?',
  clampForwardVoltage: 'number?',
  clampForwardCurrent: 'number?',
};

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function checkFields(
  where: string,
  value: Record<string, unknown>,
  spec: FieldSpec,
  problems: string[],
  ignore: readonly string[] = [],
): void {
  // A misspelt rating would otherwise be ignored and the part judged without it.
  for (const key of Object.keys(value)) {
    if (!Object.hasOwn(spec, key) && !ignore.includes(key))
      problems.push(`${where}.${key} is not a field of this element.`);
  }
  for (const [key, role] of Object.entries(spec)) {
    const v = value[key];
    const optional = role.endsWith('?');
    if (v === undefined && optional) continue;
    if (role.startsWith('number')) {
      if (typeof v !== 'number' || !Number.isFinite(v)) {
        problems.push(
          optional
            ? `${where}.${key} must be a number in SI units when given.`
            : `${where}.${key} is required (a number in SI units).`,
        );
      }
    } else if (typeof v !== 'boolean') {
      problems.push(`${where}.${key} must be true or false.`);
    }
  }
}

function checkElement(
  where: string,
  element: unknown,
  kinds: Readonly<Record<string, FieldSpec>>,
  ids: Set<string>,
  problems: string[],
): void {
  if (!isObject(element)) {
    problems.push(`${where} must be an element object.`);
    return;
  }
  const kind = element.kind;
  if (typeof kind !== 'string' || !Object.hasOwn(kinds, kind)) {
    problems.push(`${where}.kind must be one of: ${Object.keys(kinds).join(', ')}.`);
    return;
  }
  if (typeof element.id !== 'string' || element.id.length === 0) {
    problems.push(`${where}.id must be a non-empty string.`);
  } else if (ids.has(element.id)) {
    problems.push(`${where}.id "${element.id}" is used twice in this guard.`);
  } else {
    ids.add(element.id);
  }
  checkFields(where, element, kinds[kind], problems, ['kind', 'id']);
}

/** Problems with the guard's shape, each naming the path; empty when it is well formed. */
export function guardShapeProblems(value: unknown): string[] {
  const problems: string[] = [];
  if (!isObject(value)) return ['guard must be an object with stages and input.'];
  const ids = new Set<string>();
  if (!Array.isArray(value.stages)) {
    problems.push('guard.stages must be a list.');
  } else {
    value.stages.forEach((stage: unknown, i: number) => {
      const where = `guard.stages[${i}]`;
      if (!isObject(stage)) {
        problems.push(`${where} must be an object with series and shunts.`);
        return;
      }
      checkElement(`${where}.series`, stage.series, SERIES, ids, problems);
      if (!Array.isArray(stage.shunts)) {
        problems.push(`${where}.shunts must be a list.`);
      } else {
        stage.shunts.forEach((shunt: unknown, j: number) =>
          checkElement(`${where}.shunts[${j}]`, shunt, SHUNT, ids, problems),
        );
      }
    });
  }
  if (!isObject(value.input)) problems.push('guard.input must be an object.');
  else checkFields('guard.input', value.input, INPUT, problems);
  return problems;
}

export function isGuard(value: unknown): value is Guard {
  return guardShapeProblems(value).length === 0;
}
