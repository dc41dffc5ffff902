/**
 * Axis arithmetic for the waveform plots: "nice" tick steps (1, 2, 5 × 10ⁿ), the engineering
 * prefix an axis reads in, and the linear map from values to drawing coordinates. Pure, so
 * the scaling is unit-tested apart from the SVG.
 */

const PREFIXES: [number, string][] = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

/** The prefix an axis spanning up to `maxAbs` is labelled in: 0.0167 → milli (labels 0…20). */
export function axisPrefix(maxAbs: number): { factor: number; prefix: string } {
  if (!Number.isFinite(maxAbs) || maxAbs === 0) return { factor: 1, prefix: '' };
  for (const [factor, prefix] of PREFIXES) if (maxAbs / factor >= 1) return { factor, prefix };
  const last = PREFIXES[PREFIXES.length - 1]!;
  return { factor: last[0], prefix: last[1] };
}

/** A step of 1, 2 or 5 × 10ⁿ giving about `target` intervals over `span`. */
export function niceStep(span: number, target = 5): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, target);
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / power;
  const nice = m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10;
  return nice * power;
}

export interface Axis {
  /** Domain after widening to whole steps. */
  min: number;
  max: number;
  step: number;
  ticks: number[];
  factor: number;
  prefix: string;
}

/** Widen [lo, hi] to whole nice steps and list the ticks; a flat range gets a span around it. */
export function niceAxis(lo: number, hi: number, target = 5): Axis {
  let a = Math.min(lo, hi);
  let b = Math.max(lo, hi);
  if (!Number.isFinite(a) || !Number.isFinite(b)) {
    a = 0;
    b = 1;
  }
  if (a === b) {
    const pad = a === 0 ? 1 : Math.abs(a) * 0.1;
    a -= pad;
    b += pad;
  }
  const step = niceStep(b - a, target);
  const min = Math.floor(a / step + 1e-9) * step;
  const max = Math.ceil(b / step - 1e-9) * step;
  const ticks: number[] = [];
  const n = Math.round((max - min) / step);
  // Multiply rather than accumulate, so 0.1 + 0.2 never shows up as a label.
  for (let k = 0; k <= n; k++) ticks.push(Number((min + k * step).toPrecision(12)));
  const { factor, prefix } = axisPrefix(Math.max(Math.abs(min), Math.abs(max)));
  return { min, max, step, ticks, factor, prefix };
}

/** Linear map from [d0, d1] onto [r0, r1]. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (x: number) => number {
  const span = d1 - d0;
  if (span === 0) return () => (r0 + r1) / 2;
  return (x) => r0 + ((x - d0) / span) * (r1 - r0);
}

/** Tick label in the axis's prefix: 0.015 on a milli axis → "15". */
export function tickLabel(value: number, axis: Pick<Axis, 'factor' | 'step'>): string {
  const scaled = value / axis.factor;
  const stepScaled = axis.step / axis.factor;
  const decimals = Math.max(0, Math.min(6, -Math.floor(Math.log10(stepScaled) + 1e-9)));
  const text = scaled.toFixed(decimals);
  return text === '-0' || /^-0\.0*$/.test(text) ? text.slice(1) : text;
}

/**
 * At most `max` points of a trace for drawing, keeping each bucket's minimum and maximum so a
 * narrow spike is never thinned away.
 */
export function decimate(t: number[], v: number[], max: number): { t: number[]; v: number[] } {
  if (t.length <= max) return { t, v };
  const buckets = Math.max(1, Math.floor(max / 2));
  const size = t.length / buckets;
  const ot: number[] = [];
  const ov: number[] = [];
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor(b * size);
    const to = Math.min(t.length, Math.floor((b + 1) * size));
    if (to <= from) continue;
    let lo = from;
    let hi = from;
    for (let k = from; k < to; k++) {
      if (v[k]! < v[lo]!) lo = k;
      if (v[k]! > v[hi]!) hi = k;
    }
    for (const k of lo <= hi ? [lo, hi] : [hi, lo]) {
      if (ot.length && ot[ot.length - 1] === t[k]) continue;
      ot.push(t[k]!);
      ov.push(v[k]!);
    }
  }
  return { t: ot, v: ov };
}
