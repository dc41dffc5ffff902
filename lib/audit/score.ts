import type { StressResult, Verdict } from '../stress/types';
import { VERDICT_SEVERITY } from '../stress/types';

/**
 * Worst utilisation of an absolute rating over every check of every element: value / rating
 * (1 = exactly at the rating). 0 when nothing is rated.
 */
export function utilisationOf(result: StressResult): number {
  let worst = 0;
  for (const el of result.elements) {
    for (const c of el.checks) {
      if (c.rating === null || !(c.rating > 0)) continue;
      const u = Math.abs(c.value) / c.rating;
      if (u > worst) worst = u;
    }
  }
  return worst;
}

/** Smallest margin over every check of every element, null when none was judged. */
export function marginOf(result: StressResult): number | null {
  let worst: number | null = null;
  for (const el of result.elements) {
    for (const c of el.checks) {
      if (c.margin === null) continue;
      if (worst === null || c.margin < worst) worst = c.margin;
    }
  }
  return worst;
}

/**
 * The nearest mis-wire hazard score (our own definition):
 *
 *   score = likelihood weight × (verdict severity + u / (1 + u))
 *
 * verdict severity is VERDICT_SEVERITY (holds 0, marginal 1, incomplete 2, fails 3,
 * unprotected 4) and u the worst utilisation of an absolute rating — at least 1 for `fails`
 * and `unprotected`, which are beyond an absolute rating by definition even when the rating
 * exceeded is the input's own. u/(1+u) lies in [0, 1), so within one verdict the harder-pressed
 * guard scores higher but never overtakes the next verdict at equal likelihood; with the
 * default weights a plausible failure (0.3 × ≥ 3.5) outranks any likely hold (1 × < 1).
 * Equal scores fall to the higher source peak voltage, then the finding key.
 */
export function hazardScore(weight: number, verdict: Verdict, utilisation: number): number {
  const floor = verdict === 'fails' || verdict === 'unprotected' ? 1 : 0;
  const u = Math.max(floor, utilisation);
  return weight * (VERDICT_SEVERITY[verdict] + u / (1 + u));
}
