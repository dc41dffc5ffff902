/**
 * Building stress cases from project settings.
 */
import type { AcCase, DcCase, EsdCase, SurgeCase } from './types';

/** Steady mains at its maximum: nominal × (1 + tolerance); IEC 60038: 230 V + 10 % = 253 V. */
export function mainsCase(
  nominalRms: number,
  tolerance: number,
  frequency: number,
  sourceResistance = 0,
): AcCase {
  return { kind: 'ac', rmsVoltage: nominalRms * (1 + tolerance), frequency, sourceResistance };
}

/** DC supply at its maximum, e.g. 24 V + 20 % = 28.8 V (IEC 61131-2 steady range, REFERENCE.md). */
export function dcSupplyCase(nominal: number, tolerance: number, sourceResistance = 0): DcCase {
  return { kind: 'dc', voltage: nominal * (1 + tolerance), sourceResistance };
}

/**
 * Extra coupling resistance beyond the generator's 2 Ω, IEC 61000-4-5 (REFERENCE.md; the
 * 10 Ω line-to-earth figure is from memory): line-to-line on power ports 0 Ω, line-to-earth
 * 10 Ω, unshielded signal lines 40 Ω.
 */
export const SURGE_COUPLING = { lineToLine: 0, lineToEarth: 10, signalLine: 40 } as const;

export type SurgeCoupling = keyof typeof SURGE_COUPLING;

/** IEC 61000-4-5 test levels 1–4: 0.5, 1, 2, 4 kV open-circuit peak. */
export const SURGE_LEVELS = { 1: 500, 2: 1000, 3: 2000, 4: 4000 } as const;

export function surgeCase(peakVoltage: number, coupling: SurgeCoupling | number): SurgeCase {
  return {
    kind: 'surge',
    peakVoltage,
    couplingResistance: typeof coupling === 'number' ? coupling : SURGE_COUPLING[coupling],
  };
}

/** IEC 61000-4-2 contact-discharge levels 1–4: 2, 4, 6, 8 kV. */
export const ESD_CONTACT_LEVELS = { 1: 2000, 2: 4000, 3: 6000, 4: 8000 } as const;

export function esdCase(voltage: number): EsdCase {
  return { kind: 'esd', voltage };
}
