/**
 * Source waveforms of the stress cases.
 *
 * Surge (IEC 61000-4-5 combination wave). We model the generator as its open-circuit
 * 1.2/50 µs voltage behind its 2 Ω effective output impedance plus the coupling resistance
 * (Thevenin form), not as the standard's charging-capacitor/pulse-shaping circuit. Why:
 *  - it is exact where the audit lives: signal lines couple through 40 Ω (42 Ω total), a load
 *    large enough that the generator's output follows its open-circuit shape;
 *  - into low impedance (2 Ω / 12 Ω coupling onto a clamp) the real generator delivers an
 *    8/20 µs current, shorter than the 1.2/50 µs shape used here, so pulse energy and charge
 *    are overestimated (≈ 2–3× into a short): conservative for every rating;
 *  - the short-circuit peak is still open-circuit peak / 2 Ω, the standard's defining ratio;
 *  - the standard fixes the waveforms, not the generator's component values, so a circuit
 *    model would add fitted numbers without a source.
 * The double exponential below is fitted to the standard's definitions (IEC 61000-4-5 clause 3:
 * front time T1 = 1.67 × (t90 − t30), duration T2 from the virtual origin to half value on
 * the tail): τ1 = 0.40503 µs, τ2 = 68.217 µs give T1 = 1.200 µs and T2 = 50.00 µs.
 *
 * ESD (IEC 61000-4-2): the generator's energy-storage capacitance 150 pF discharged through
 * its discharge resistance 330 Ω (the standard's generator circuit values, clause 6.1), plus a
 * small "tip" branch for the calibration waveform's fast first peak. Into the standard's 2 Ω
 * current target the 150 pF / 330 Ω body alone gives 3.01 A/kV at t = 0, 1.65 A/kV at 30 ns
 * and 0.90 A/kV at 60 ns: the 30 and 60 ns points fall within the standard's 2 and 1 A/kV
 * ±30 %, but the first peak (3.75 A/kV ±15 %) does not. The tip branch — 0.738 pF through
 * 1353 Ω, fitted here (no source for these two values) so that the current into 2 Ω at t = 0+
 * is exactly 3.75 A/kV, decaying in 1 ns — adds that peak with 0.5 % of the charge. It rises
 * instantly (no 0.8 ns rise time): conservative for peak current and voltage.
 */

export const SURGE_GENERATOR_IMPEDANCE = 2;
export const SURGE_TAU_FRONT = 0.4050343086387387e-6;
export const SURGE_TAU_TAIL = 68.21697156035133e-6;
/** Peak of exp(−t/τ2) − exp(−t/τ1), reached at SURGE_PEAK_TIME. */
export const SURGE_SHAPE_PEAK = 0.9640856865905347;
export const SURGE_PEAK_TIME =
  (Math.log(SURGE_TAU_TAIL / SURGE_TAU_FRONT) * SURGE_TAU_FRONT * SURGE_TAU_TAIL) /
  (SURGE_TAU_TAIL - SURGE_TAU_FRONT);

/** Open-circuit surge voltage at time t for an open-circuit peak `peak`. */
export function surgeOpenCircuitVoltage(t: number, peak: number): number {
  if (t <= 0) return 0;
  return (
    (peak / SURGE_SHAPE_PEAK) * (Math.exp(-t / SURGE_TAU_TAIL) - Math.exp(-t / SURGE_TAU_FRONT))
  );
}

export const ESD_CAPACITANCE = 150e-12;
export const ESD_RESISTANCE = 330;
/** Tip branch: 1/R_tip = 3.75 A/kV − 1/(330 Ω + 2 Ω), less the 2 Ω target; τ = 1 ns. */
export const ESD_TIP_RESISTANCE = 1 / (3.75e-3 - 1 / (ESD_RESISTANCE + 2)) - 2;
export const ESD_TIP_CAPACITANCE = 1e-9 / ESD_TIP_RESISTANCE;
export const ESD_BRANCHES = [
  { capacitance: ESD_CAPACITANCE, resistance: ESD_RESISTANCE },
  { capacitance: ESD_TIP_CAPACITANCE, resistance: ESD_TIP_RESISTANCE },
] as const;
/** Output resistance of the generator at t = 0+ (both branches in parallel). */
export const ESD_SOURCE_RESISTANCE_AT_ZERO = 1 / (1 / ESD_RESISTANCE + 1 / ESD_TIP_RESISTANCE);

/** Surge integration span: 8 tail time constants (the open-circuit voltage is then 0.03 % of peak). */
export const SURGE_SPAN = 8 * SURGE_TAU_TAIL;
const LEVEL_TABLE_SIZE = 4096;

let levelTables: { g: Float64Array; h: Float64Array } | null = null;

/** Time within [0, SURGE_SPAN] that the normalised shape spends at or above level u (0 < u ≤ 1). */
function timeAbove(u: number): number {
  if (u <= 0) return SURGE_SPAN;
  if (u >= 1) return 0;
  const shape = (t: number) => surgeOpenCircuitVoltage(t, 1);
  let lo = 0;
  let hi = SURGE_PEAK_TIME;
  for (let k = 0; k < 64; k++) {
    const mid = 0.5 * (lo + hi);
    if (shape(mid) < u) lo = mid;
    else hi = mid;
  }
  const rise = 0.5 * (lo + hi);
  lo = SURGE_PEAK_TIME;
  hi = 40 * SURGE_TAU_TAIL;
  for (let k = 0; k < 64; k++) {
    const mid = 0.5 * (lo + hi);
    if (shape(mid) >= u) lo = mid;
    else hi = mid;
  }
  return Math.min(0.5 * (lo + hi), SURGE_SPAN) - rise;
}

/** G(u) = ∫₀ᵘ T(v) dv and H(u) = ∫₀ᵘ v·T(v) dv on a fine uniform table, built once. */
function levelIntegrals(): { g: Float64Array; h: Float64Array } {
  if (levelTables) return levelTables;
  const n = LEVEL_TABLE_SIZE;
  const g = new Float64Array(n + 1);
  const h = new Float64Array(n + 1);
  let previous = timeAbove(0);
  for (let k = 1; k <= n; k++) {
    const u0 = (k - 1) / n;
    const um = (k - 0.5) / n;
    const u1 = k / n;
    const mid = timeAbove(um);
    const next = timeAbove(u1);
    // Simpson on each cell
    g[k] = g[k - 1] + (previous + 4 * mid + next) / 6 / n;
    h[k] = h[k - 1] + (u0 * previous + 4 * um * mid + u1 * next) / 6 / n;
    previous = next;
  }
  levelTables = { g, h };
  return levelTables;
}

function tableAt(table: Float64Array, u: number): number {
  const x = Math.min(Math.max(u, 0), 1) * LEVEL_TABLE_SIZE;
  const k = Math.min(Math.floor(x), LEVEL_TABLE_SIZE - 1);
  return table[k] + (x - k) * (table[k + 1] - table[k]);
}

/**
 * Time weights for sampling a function of the normalised surge level at `levels` (ascending,
 * from 0 to 1): ∫₀^span f(s(t)) dt ≈ Σ W_j f(u_j). By parts,
 * ∫ f(s(t)) dt = f(0)·span + ∫₀¹ f′(u) T(u) du (T: time at or above u). f is interpolated by
 * quadratics through consecutive level triples (a linear piece for a last odd interval), so
 * f′ is linear on each piece and the integral needs only G = ∫T and H = ∫u·T. Any level set
 * works: the solver adds levels at the clamps' knees and marks them not `smooth`, so the
 * pieces around them are linear.
 */
export function surgeWeightsFor(
  levels: ArrayLike<number>,
  smooth?: ArrayLike<boolean>,
): Float64Array {
  const { g, h } = levelIntegrals();
  const n = levels.length;
  const weights = new Float64Array(n);
  weights[0] = SURGE_SPAN;
  let j = 0;
  const linear = (k: number) => {
    const a = levels[k];
    const c = levels[k + 1];
    const slope = (tableAt(g, c) - tableAt(g, a)) / (c - a);
    weights[k + 1] += slope;
    weights[k] -= slope;
  };
  while (j + 2 < n) {
    // Across a clamp's knee f bends sharply: linear pieces there (the knee levels are dense).
    if (smooth && !(smooth[j] && smooth[j + 1] && smooth[j + 2])) {
      linear(j);
      j += 1;
      continue;
    }
    const a = levels[j];
    const b = levels[j + 1];
    const c = levels[j + 2];
    const dG = tableAt(g, c) - tableAt(g, a);
    const dH = tableAt(h, c) - tableAt(h, a);
    // ∫ L′_k(u) T(u) du with L′_a = (2u − b − c)/((a − b)(a − c)), etc.
    weights[j] += (2 * dH - (b + c) * dG) / ((a - b) * (a - c));
    weights[j + 1] += (2 * dH - (a + c) * dG) / ((b - a) * (b - c));
    weights[j + 2] += (2 * dH - (a + b) * dG) / ((c - a) * (c - b));
    j += 2;
  }
  if (j + 1 < n) linear(j);
  return weights;
}
