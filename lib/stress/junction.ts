/**
 * The exponential junction with series resistance that every diode-like shunt is built from:
 *
 *   v = offset + n·Vt·ln(1 + i/Is) + i·Rs          (Shockley junction, ideality n, bulk Rs)
 *
 * solved explicitly for i with the Lambert W function (no inner iteration on the network):
 *
 *   i + Is = (n·Vt / Rs) · W( (Is·Rs / n·Vt) · exp((u + Is·Rs) / n·Vt) ),   u = v − offset
 *
 * The argument of W is carried as its logarithm, so no exponential can overflow.
 * This is the same equation as the SPICE level-1 diode (IS, N, RS) behind a DC source of
 * `offset` volts, which is how the test netlists reproduce it.
 */

/** kT/q at 27 °C (300.15 K), the nominal temperature SPICE uses (TNOM): 25.865 mV. */
export const THERMAL_VOLTAGE = 0.025864186;

/** Smallest series resistance used, so the Lambert form always applies (1 µΩ). */
export const MIN_SERIES_RESISTANCE = 1e-6;

export interface JunctionParams {
  saturationCurrent: number;
  emission: number;
  seriesResistance: number;
  /** Voltage offset in series (the breakdown knee of zeners and TVS, 0 for a forward diode). */
  offset: number;
}

/** W(e^x): the principal Lambert W of exp(x), for any real x, without forming exp(x) when large. */
export function lambertWOfExp(x: number): number {
  if (x < -40) return Math.exp(x); // W(z) = z − z² + … and z < 5e-18 here
  let w: number;
  if (x > 2) {
    // asymptotic start (de Bruijn): W ≈ L1 − L2 + L2/L1, L1 = x, L2 = ln x
    const l2 = Math.log(x);
    w = x - l2 + l2 / x;
  } else {
    // Winitzki's approximation W(z) ≈ L(1 − ln(1 + L)/(2 + L)), L = ln(1 + z): within 1 %.
    const l = Math.log1p(Math.exp(x));
    w = l * (1 - Math.log1p(l) / (2 + l));
  }
  // Halley on f(w) = w + ln w − x, f' = 1 + 1/w, f'' = −1/w²: cubic convergence.
  for (let k = 0; k < 20; k++) {
    const f = w + Math.log(w) - x;
    const d1 = 1 + 1 / w;
    const d2 = -1 / (w * w);
    const denominator = d1 - (0.5 * f * d2) / d1;
    const step = denominator > 0.5 * d1 ? f / denominator : f / d1;
    const next = w - step;
    w = next > 0 ? next : w / 4;
    // Halley converges cubically: a step below 1e-6·w leaves an error near 1e-18·w.
    if (Math.abs(step) <= 1e-6 * w) break;
  }
  return w;
}

/** Current through the junction (and its derivative di/dv) for a voltage u = v − offset. */
export function junctionCurrent(p: JunctionParams, u: number, out: { i: number; g: number }): void {
  const nvt = p.emission * THERMAL_VOLTAGE;
  const rs = p.seriesResistance;
  const isat = p.saturationCurrent;
  const x = Math.log((isat * rs) / nvt) + (u + isat * rs) / nvt;
  const w = lambertWOfExp(x);
  const total = (nvt / rs) * w; // i + Is
  out.i = total - isat;
  // dv/di = n·Vt/(i + Is) + Rs; total can underflow to 0 far in reverse: conductance 0 then.
  out.g = total > 0 ? 1 / (nvt / total + rs) : 0;
}

/**
 * The same with the constant parts precomputed (the solver's hot path):
 * logPrefactor = ln(Is·Rs/nVt) + Is·Rs/nVt, inverseNvt = 1/nVt.
 */
export function junctionCurrentFast(
  isat: number,
  rs: number,
  nvt: number,
  inverseNvt: number,
  logPrefactor: number,
  u: number,
  out: { i: number; g: number },
): void {
  const x = logPrefactor + u * inverseNvt;
  if (x < -40) {
    // far below the knee: W(e^x) = e^x to 1e-17, i + Is = Is·exp(u/nVt)
    const total = (nvt / rs) * Math.exp(x);
    out.i = total - isat;
    out.g = total * inverseNvt;
    return;
  }
  const total = (nvt / rs) * lambertWOfExp(x);
  out.i = total - isat;
  out.g = total > 0 ? 1 / (nvt / total + rs) : 0;
}

/** Voltage across the junction at a forward current i (> −Is): the explicit inverse. */
export function junctionVoltage(p: JunctionParams, i: number): number {
  const nvt = p.emission * THERMAL_VOLTAGE;
  return p.offset + nvt * Math.log1p(i / p.saturationCurrent) + i * p.seriesResistance;
}

/**
 * A forward diode from one datasheet point, VF at IF.
 * One point cannot fix three parameters, so two are chosen (from memory / common practice,
 * conservative for the clamped voltage at high current):
 *   - ideality n = 2 unless given (high-injection value; gives the higher voltage at surge currents);
 *   - bulk resistance Rs = 5 % of VF/IF unless given (a 1 A rectifier at 1.0 V: 50 mΩ);
 *   - Is so that the junction passes exactly through (VF, IF).
 */
export function forwardDiodeParams(
  forwardVoltage: number,
  forwardCurrent: number,
  emission = 2,
  seriesResistance?: number,
): JunctionParams {
  const rs = Math.max(
    seriesResistance ?? (0.05 * forwardVoltage) / forwardCurrent,
    MIN_SERIES_RESISTANCE,
  );
  const nvt = emission * THERMAL_VOLTAGE;
  const junctionDrop = forwardVoltage - forwardCurrent * rs;
  if (!(junctionDrop > 0)) {
    throw new RangeError(
      `forward voltage ${forwardVoltage} V is below the series drop at ${forwardCurrent} A`,
    );
  }
  const saturationCurrent = forwardCurrent / Math.expm1(junctionDrop / nvt);
  return { saturationCurrent, emission, seriesResistance: rs, offset: 0 };
}

/**
 * A breakdown branch (zener, TVS) from its knee point and one more figure:
 *   - the knee junction has ideality 1 and Is = 1e-9 × the test current, so the exponential
 *     part rises n·Vt·ln(1e9) ≈ 0.54 V from near-zero current to the test current and leaks
 *     only a nanoampere-scale fraction of it below the knee;
 *   - `slopeResistance` (Ω, beyond the junction) sets the rise at higher currents: for a zener
 *     Zzt − Vt/Iz (its dynamic impedance at Iz less the junction's own share), for a TVS from
 *     VC at IPP (see tvsBreakdownParams);
 *   - the offset puts the branch exactly through (V at the test current).
 * If the stated dynamic impedance is below the junction's own Vt/Iz, the ideality is lowered
 * instead so the impedance at Iz is still the stated one.
 */
export function breakdownParams(
  kneeVoltage: number,
  testCurrent: number,
  dynamicImpedance: number,
): JunctionParams {
  let emission = 1;
  let rs = dynamicImpedance - (emission * THERMAL_VOLTAGE) / testCurrent;
  if (rs < MIN_SERIES_RESISTANCE) {
    rs = MIN_SERIES_RESISTANCE;
    emission = Math.max(((dynamicImpedance - rs) * testCurrent) / THERMAL_VOLTAGE, 0.05);
  }
  const saturationCurrent = testCurrent * 1e-9;
  const p: JunctionParams = { saturationCurrent, emission, seriesResistance: rs, offset: 0 };
  p.offset = kneeVoltage - junctionVoltage(p, testCurrent);
  return p;
}

/** TVS: through VBR at the test current and VC at IPP. */
export function tvsBreakdownParams(
  breakdownVoltage: number,
  testCurrent: number,
  clampVoltage: number,
  peakPulseCurrent: number,
): JunctionParams {
  const saturationCurrent = testCurrent * 1e-9;
  const vt = THERMAL_VOLTAGE;
  const junctionRise =
    vt *
    (Math.log1p(peakPulseCurrent / saturationCurrent) -
      Math.log1p(testCurrent / saturationCurrent));
  const rs = Math.max(
    (clampVoltage - breakdownVoltage - junctionRise) / (peakPulseCurrent - testCurrent),
    MIN_SERIES_RESISTANCE,
  );
  const p: JunctionParams = { saturationCurrent, emission: 1, seriesResistance: rs, offset: 0 };
  p.offset = breakdownVoltage - junctionVoltage(p, testCurrent);
  return p;
}
