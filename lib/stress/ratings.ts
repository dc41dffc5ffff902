/**
 * Ratings, derating and verdicts: each stress against the figure a datasheet gives.
 *
 * A check has three levels: `rating` (the datasheet figure), `temperatureRating` (what the
 * part may take at the cabinet ambient) and `deratedRating` (that, times the project's
 * derating margin). Beyond the temperature rating the part `fails`; between the derated and
 * the temperature rating it is `marginal`; a missing figure makes the check `incomplete`.
 */
import { formatEng } from '../units';
import type { RatingCheck, StressConditions, StressQuantity, Verdict } from './types';
import { VERDICT_SEVERITY } from './types';

/**
 * Resistor power derating: rated power up to 70 °C, linear to zero at 155 °C (the usual
 * IEC 60115-1 style curve of film resistor datasheets; REFERENCE.md "Resistors").
 */
export function resistorTemperatureFactor(ambientC: number): number {
  if (ambientC <= 70) return 1;
  if (ambientC >= 155) return 0;
  return (155 - ambientC) / 85;
}

/**
 * Semiconductor power/current derating: linear from 25 °C to zero at a 150 °C junction
 * (common practice, no source; ⚠ typical of small-signal diode and zener datasheets).
 */
export function semiconductorTemperatureFactor(ambientC: number): number {
  if (ambientC <= 25) return 1;
  if (ambientC >= 150) return 0;
  return (150 - ambientC) / 125;
}

/**
 * Varistor surge current/energy derating: full rating to 85 °C, linear to zero at 125 °C
 * (common practice, no source ⚠; typical metal-oxide varistor datasheets).
 */
export function varistorTemperatureFactor(ambientC: number): number {
  if (ambientC <= 85) return 1;
  if (ambientC >= 125) return 0;
  return (125 - ambientC) / 40;
}

/**
 * TVS peak pulse power for a pulse shorter than the 10/1000 µs rating pulse. Without the
 * part's peak-power-versus-duration curve we take the t^−½ (thermal, Wunsch–Bell) law through
 * ×5 at a 20 µs half-value time: REFERENCE.md gives ≈ ×6–7 as typical for 8/20 µs and ×5 as the
 * conservative default (common practice ⚠). Never below ×1.
 */
export function tvsPulseFactor(halfValueTime: number): number {
  if (!(halfValueTime > 0)) return 1;
  return Math.max(1, 5 * Math.sqrt(20e-6 / halfValueTime));
}

/**
 * Varistor 8/20 µs surge current rating applied to a longer pulse: scaled by (20 µs / t)^½,
 * never above the 8/20 figure (common practice ⚠; use the part's pulse-rating curve when known).
 */
export function varistorPulseFactor(halfValueTime: number): number {
  if (!(halfValueTime > 20e-6)) return 1;
  return Math.sqrt(20e-6 / halfValueTime);
}

export interface CheckInput {
  quantity: StressQuantity;
  value: number;
  rating: number | null | undefined;
  /** Temperature factor applied to the rating (1 for voltages). */
  temperatureFactor: number;
  /** Margin factor (powerDerating or voltageDerating). */
  margin: number;
  /** Text for the reason: element id and what the value is. */
  label: string;
  unit: string;
  /** What to say when the rating is missing. */
  missing?: string;
  /** Words after the value (e.g. "average"). */
  suffix?: string;
}

export function check(input: CheckInput): RatingCheck {
  const { quantity, value, rating, temperatureFactor, margin, label, unit } = input;
  const shown = `${formatEng(value, unit)}${input.suffix ? ` ${input.suffix}` : ''}`;
  if (rating === null || rating === undefined) {
    return {
      quantity,
      value,
      rating: null,
      deratedRating: null,
      temperatureRating: null,
      margin: null,
      verdict: 'incomplete',
      reason: `${label} ${shown}: ${input.missing ?? 'no rating given to judge it against'}`,
    };
  }
  const atTemperature = rating * temperatureFactor;
  const derated = atTemperature * margin;
  let verdict: Verdict = 'holds';
  if (value > atTemperature) verdict = 'fails';
  else if (value > derated) verdict = 'marginal';
  const marginValue = derated > 0 ? (derated - value) / derated : value > 0 ? -Infinity : 0;
  const against =
    temperatureFactor !== 1
      ? `${formatEng(derated, unit)} derated (${formatEng(rating, unit)} rated, ${formatEng(atTemperature, unit)} at ambient)`
      : `${formatEng(derated, unit)} derated (${formatEng(rating, unit)} rated)`;
  return {
    quantity,
    value,
    rating,
    temperatureRating: atTemperature,
    deratedRating: derated,
    margin: Number.isFinite(marginValue) ? marginValue : -1e9,
    verdict,
    reason: `${label} ${shown} against ${against}`,
  };
}

/** A check that records a fact without a rating (e.g. a fuse that does not open). */
export function note(
  quantity: StressQuantity,
  value: number,
  verdict: Verdict,
  reason: string,
  rating: number | null = null,
): RatingCheck {
  return {
    quantity,
    value,
    rating,
    deratedRating: rating,
    temperatureRating: rating,
    margin: null,
    verdict,
    reason,
  };
}

export function worstVerdict(verdicts: Verdict[]): Verdict {
  let worst: Verdict = 'holds';
  for (const v of verdicts) if (VERDICT_SEVERITY[v] > VERDICT_SEVERITY[worst]) worst = v;
  return worst;
}

/** Index of the first item with the worst verdict (ties: the first, i.e. outermost). */
export function worstIndex<T extends { verdict: Verdict }>(items: T[]): number {
  let index = -1;
  let severity = -1;
  items.forEach((item, k) => {
    if (VERDICT_SEVERITY[item.verdict] > severity) {
      severity = VERDICT_SEVERITY[item.verdict];
      index = k;
    }
  });
  return index;
}

export const DEFAULT_CONDITIONS: StressConditions = {
  ambientC: 40,
  powerDerating: 0.5,
  voltageDerating: 0.8,
  appliedTo: 'signal',
};
