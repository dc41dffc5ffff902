/**
 * Structural check of a stored Guard (lib/stress/types.ts): known element kinds, required
 * figures present as finite SI numbers, optional figures numeric when given. It does not
 * judge whether values are sensible — that is the engine's job. Pure; shared by the model
 * validator, seeders and forms.
 */
import type { Guard } from '@/lib/stress/types';

type FieldSpec = { required: readonly string[]; optional: readonly string[]; booleans?: readonly string[] };

const SERIES: Record<string, FieldSpec> = {
  resistor: { required: ['resistance'], optional: ['ratedPower', 'limitingVoltage', 'overloadVoltage', 'pulseEnergy'] },
  ptc: { required: ['resistance', 'holdCurrent', 'tripCurrent'], optional: ['maxVoltage', 'maxCurrent'] },
  fuse: { required: ['ratedCurrent'], optional: ['voltageRating', 'meltingI2t', 'resistance'] },
  wire: { required: ['resistance'], optional: [] },
};

const SHUNT: Record<string, FieldSpec> = {
  railDiodes: {
    required: ['forwardVoltage', 'forwardCurrent'],
    optional: ['averageCurrent', 'surgeCurrent', 'surgeDuration'],
  },
  zener: {
    required: ['zenerVoltage', 'dynamicImpedance'],
    optional: ['testCurrent', 'powerRating'],
    booleans: ['bidirectional'],
  },
  tvs: {
    required: ['standoffVoltage', 'breakdownVoltage', 'clampVoltage', 'peakPulseCurrent'],
    optional: ['peakPulsePower'],
    booleans: ['bidirectional'],
  },
  varistor: {
    required: ['maxContinuousVoltage', 'varistorVoltage', 'clampVoltage', 'clampCurrent'],
    optional: ['surgeCurrent', 'surgeEnergy'],
  },
  capacitor: { required: ['capacitance'], optional: ['voltageRating'] },
  shuntResistor: { required: ['resistance'], optional: ['ratedPower', 'limitingVoltage', 'overloadVoltage'] },
};

const INPUT: FieldSpec = {
  required: ['positiveRail', 'negativeRail', 'absMaxBeyondRail'],
  optional: ['absMaxCurrent', 'inputResistance', 'positiveRailMinLoad', 'negativeRailMinLoad'],
  booleans: ['internalClamps'],
};

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function checkFields(where: string, value: Record<string, unknown>, spec: FieldSpec, problems: string[]): void {
  for (const key of spec.required) {
    const v = value[key];
    if (typeof v !== 'number' || !Number.isFinite(v)) problems.push(`${where}.${key} is required (a number in SI units).`);
  }
  for (const key of spec.optional) {
    const v = value[key];
    if (v !== undefined && (typeof v !== 'number' || !Number.isFinite(v))) {
      problems.push(`${where}.${key} must be a number in SI units when given.`);
    }
  }
  for (const key of spec.booleans ?? []) {
    const v = value[key];
    const required = key === 'bidirectional';
    if ((required || v !== undefined) && typeof v !== 'boolean') problems.push(`${where}.${key} must be true or false.`);
  }
}

function checkElement(
  where: string,
  element: unknown,
  kinds: Record<string, FieldSpec>,
  ids: Set<string>,
  problems: string[],
): void {
  if (!isObject(element)) {
    problems.push(`${where} must be an element object.`);
    return;
  }
  const kind = element.kind;
  if (typeof kind !== 'string' || !(kind in kinds)) {
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
  checkFields(where, element, kinds[kind], problems);
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
