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
  (Math.log(SURGE_TAU_TAIL / SURGE_TAU_FRONT) * SURGE_TAU_FRONT * SURGE_TAU_TAIL) / (SURGE_TAU_TAIL - SURGE_TAU_FRONT);

/** Open-circuit surge voltage at time t for an open-circuit peak `peak`. */
export function surgeOpenCircuitVoltage(t: number, peak: number): number {
  if (t <= 0) return 0;
  return (peak / SURGE_SHAPE_PEAK) * (Math.exp(-t / SURGE_TAU_TAIL) - Math.exp(-t / SURGE_TAU_FRONT));
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
const SURGE_LEVEL_COUNT = 40;

let cachedLevels: { levels: Float64Array; weights: Float64Array; span: number } | null = null;

/**
 * Level weights of the normalised 1.2/50 µs shape over [0, SURGE_SPAN]: W_j = ∫ φ_j(s(t)) dt
 * with φ_j the piecewise-linear hat functions on levels u_j (denser towards 0 and 1, where
 * the shape lingers or turns). Then ∫ f(s(t)) dt ≈ Σ W_j f(u_j) for any f that is smooth
 * between levels. Computed once, by a fine time integration (10⁵ steps per branch).
 */
export function surgeLevelWeights(): { levels: Float64Array; weights: Float64Array; span: number } {
  if (cachedLevels) return cachedLevels;
  const m = SURGE_LEVEL_COUNT;
  const levels = new Float64Array(m + 1);
  for (let j = 0; j <= m; j++) levels[j] = 0.5 - 0.5 * Math.cos((Math.PI * j) / m); // Chebyshev–Lobatto spacing
  const weights = new Float64Array(m + 1);
  const shape = (t: number) => surgeOpenCircuitVoltage(t, 1);
  const addSegment = (t0: number, t1: number, steps: number) => {
    const dt = (t1 - t0) / steps;
    for (let k = 0; k < steps; k++) {
      const t = t0 + (k + 0.5) * dt; // midpoint rule
      const u = Math.min(Math.max(shape(t), 0), 1);
      // locate u between levels (binary search)
      let lo = 0;
      let hi = m;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (levels[mid] <= u) lo = mid;
        else hi = mid;
      }
      const frac = (u - levels[lo]) / (levels[hi] - levels[lo]);
      weights[lo] += (1 - frac) * dt;
      weights[hi] += frac * dt;
    }
  };
  addSegment(0, SURGE_PEAK_TIME, 100000);
  addSegment(SURGE_PEAK_TIME, SURGE_SPAN, 100000);
  cachedLevels = { levels, weights, span: SURGE_SPAN };
  return cachedLevels;
}
