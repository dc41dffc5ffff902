/**
 * How the report prints the engine's numbers. Pure: the channel page, the findings table and
 * the tests all go through these, so what a page shows is exactly formatEng of the engine's
 * figure (three significant figures, engineering prefixes).
 */
import { formatEng } from '../units';
import type { RatingCheck, StressCase, StressQuantity, Verdict } from '../stress/types';

export const QUANTITY_UNIT: Record<StressQuantity, string> = {
  power: 'W',
  voltage: 'V',
  current: 'A',
  energy: 'J',
  surgeCurrent: 'A',
  pulsePower: 'W',
  i2t: 'A²s',
};

export const QUANTITY_LABEL: Record<StressQuantity, string> = {
  power: 'Power',
  voltage: 'Voltage',
  current: 'Current',
  energy: 'Pulse energy',
  surgeCurrent: 'Surge current',
  pulsePower: 'Pulse power',
  i2t: 'I²t',
};

export const VERDICT_LABEL: Record<Verdict, string> = {
  holds: 'Holds',
  marginal: 'Marginal',
  fails: 'Fails',
  unprotected: 'Unprotected',
  incomplete: 'Incomplete',
};

/** Worst first, for filters and legends. */
export const VERDICT_ORDER: Verdict[] = ['unprotected', 'fails', 'incomplete', 'marginal', 'holds'];

/** One figure as printed: the engine's value, its unit and the text shown. */
export interface ShownNumber {
  value: number;
  unit: string;
  text: string;
}

export function shown(value: number, unit: string): ShownNumber {
  return { value, unit, text: formatEng(value, unit) };
}

/**
 * Margin as a percentage of the derated rating, one decimal: 0.7781 → "77.8 %". Far beyond
 * the rating a percentage stops reading well (−200858.8 %), so from ten times the derated
 * rating it reads as that multiple: stress / derated = 1 − margin → "2010× derated".
 */
export function formatMargin(margin: number | null): string {
  if (margin === null) return '—';
  if (margin <= -1e8) return 'far over';
  if (margin < -9) {
    const times = 1 - margin;
    return `${times >= 100 ? Math.round(times) : Number(times.toPrecision(3))}× derated`;
  }
  return `${(margin * 100).toFixed(1)} %`;
}

/** A check's rows as the element table prints them. */
export function checkCells(c: RatingCheck) {
  const unit = QUANTITY_UNIT[c.quantity];
  return {
    quantity: QUANTITY_LABEL[c.quantity],
    value: formatEng(c.value, unit),
    rating: c.rating === null ? 'not given' : formatEng(c.rating, unit),
    atAmbient:
      c.temperatureRating === undefined ||
      c.temperatureRating === null ||
      c.temperatureRating === c.rating
        ? null
        : formatEng(c.temperatureRating, unit),
    derated: c.deratedRating === null ? '—' : formatEng(c.deratedRating, unit),
    margin: formatMargin(c.margin),
    verdict: c.verdict,
  };
}

/** The stress case as inputs: what is applied, through what. */
export function caseInputs(c: StressCase): { label: string; text: string }[] {
  switch (c.kind) {
    case 'dc':
      return [
        { label: 'Applied voltage', text: formatEng(c.voltage, 'V') + ' DC' },
        { label: 'Source resistance', text: formatEng(c.sourceResistance, 'Ω') },
      ];
    case 'ac':
      return [
        {
          label: 'Applied voltage',
          text: `${formatEng(c.rmsVoltage, 'V')} rms (${formatEng(c.rmsVoltage * Math.SQRT2, 'V')} peak)`,
        },
        { label: 'Frequency', text: formatEng(c.frequency, 'Hz') },
        { label: 'Source resistance', text: formatEng(c.sourceResistance, 'Ω') },
      ];
    case 'surge':
      return [
        { label: 'Open-circuit peak', text: `${formatEng(c.peakVoltage, 'V')}, 1.2/50 µs` },
        { label: 'Generator + coupling', text: `2 Ω + ${formatEng(c.couplingResistance, 'Ω')}` },
      ];
    case 'esd':
      return [
        { label: 'Charge voltage', text: formatEng(c.voltage, 'V') },
        { label: 'Discharge network', text: '150 pF through 330 Ω (contact)' },
      ];
  }
}

export const CASE_KIND_LABEL: Record<StressCase['kind'], string> = {
  dc: 'DC fault',
  ac: 'AC mains fault',
  surge: 'Surge',
  esd: 'Electrostatic discharge',
};
