/**
 * The calculations behind a stress result, written out with the engine's numbers substituted.
 * Every number comes from the engine's result (or the case and guard it was solved for); the
 * printed result of each line is the engine's figure, never a second computation. Where the
 * hand form is only an approximation of what the engine integrated, the line says by how much
 * the two differ, so a reader is never shown arithmetic that silently does not add up.
 */
import { formatEng } from '../units';
import { seriesResistanceOf } from '../stress/network';
import type {
  ElementStress,
  Guard,
  RatingCheck,
  StressCase,
  StressResult,
  Waveform,
} from '../stress/types';
import { formatMargin, QUANTITY_UNIT, shown, type ShownNumber } from './format';

export interface FormulaLine {
  id: string;
  title: string;
  /** The formula in symbols, e.g. "I_pk = (V_pk − V_node) / ΣR". */
  symbolic: string;
  /** The same with numbers, e.g. "(179.6 − 13.2) V / 9.98 kΩ". */
  substituted: string;
  /** The engine's figure the line arrives at. */
  result: ShownNumber;
  /** Every engine figure the line prints, for checking. */
  terms: ShownNumber[];
  note?: string;
}

/** Open-circuit peak of the case's source (magnitude) and its internal resistance. */
export function sourceOf(c: StressCase): {
  peak: number;
  resistance: number;
  resistanceText: string;
} {
  switch (c.kind) {
    case 'dc':
      return {
        peak: Math.abs(c.voltage),
        resistance: c.sourceResistance,
        resistanceText: 'R_source',
      };
    case 'ac':
      return {
        peak: c.rmsVoltage * Math.SQRT2,
        resistance: c.sourceResistance,
        resistanceText: 'R_source',
      };
    case 'surge':
      // IEC 61000-4-5: 2 Ω generator plus the coupling resistance.
      return {
        peak: Math.abs(c.peakVoltage),
        resistance: 2 + c.couplingResistance,
        resistanceText: 'R_gen',
      };
    case 'esd':
      // IEC 61000-4-2: 330 Ω discharge resistor.
      return { peak: Math.abs(c.voltage), resistance: 330, resistanceText: 'R_esd' };
  }
}

/** Relative difference beyond which the hand form gets a note (rounding of three figures is ≤ 0.5 %). */
const HAND_TOLERANCE = 0.02;

function differs(hand: number, engine: number): number {
  const scale = Math.max(Math.abs(engine), 1e-30);
  return Math.abs(hand - engine) / scale;
}

/** Signed voltage as a term: negative values in brackets so the subtraction reads right. */
function signedText(v: ShownNumber): string {
  return v.value < 0 ? `(${v.text})` : v.text;
}

/**
 * The instant of the largest source current in the engine's waveform, with the source and
 * node voltages then. Only for a single-stage guard, where the protected input sits on the
 * clamping node, so the waveform's "input" trace is that node.
 */
function atPeakCurrent(
  guard: Guard,
  waveform: Waveform | undefined,
): { vs: number; vn: number } | null {
  if (!waveform || guard.stages.length !== 1) return null;
  const trace = (name: string) => waveform.traces.find((t) => t.name === name)?.values;
  const vs = trace('source');
  const vn = trace('input');
  const is = trace('source current');
  if (!vs || !vn || !is || is.length === 0) return null;
  let k = 0;
  for (let j = 1; j < is.length; j++) if (Math.abs(is[j]!) > Math.abs(is[k]!)) k = j;
  return { vs: vs[k]!, vn: vn[k]! };
}

/** Peak current drawn from the source: the series path up to the first clamping node. */
function peakCurrentLine(guard: Guard, result: StressResult, waveform?: Waveform): FormulaLine {
  const src = sourceOf(result.case);
  const byId = new Map(result.elements.map((e) => [e.elementId, e]));
  const names: string[] = [src.resistanceText];
  let sumR = src.resistance;
  let node: { name: string; volts: number } | null = null;
  for (const stage of guard.stages) {
    sumR += seriesResistanceOf(stage.series);
    names.push(stage.series.id);
    const clamps = stage.shunts
      .map((s) => byId.get(s.id))
      .filter((e): e is ElementStress => e !== undefined);
    if (clamps.length > 0) {
      const top = clamps.reduce((a, b) => (b.peakVoltage > a.peakVoltage ? b : a));
      node = { name: `V(${top.elementId})`, volts: top.peakVoltage };
      break;
    }
  }
  if (!node) node = { name: 'V(input)', volts: result.input.peakVoltage };

  // Prefer the voltages at the instant of the peak (the clamp that conducts then may be the
  // input's own on the other half-cycle); otherwise the peaks, which may not coincide.
  const instant = atPeakCurrent(guard, waveform);
  const vpk = shown(instant ? instant.vs : src.peak, 'V');
  const vnode = shown(instant ? instant.vn : node.volts, 'V');
  const nodeName = instant ? 'V_node' : node.name;
  const r = shown(sumR, 'Ω');
  const ipk = shown(result.sourcePeakCurrent, 'A');
  const hand = Math.abs(vpk.value - vnode.value) / sumR;
  const gap = differs(hand, result.sourcePeakCurrent);
  return {
    id: 'peak-current',
    title: 'Peak current from the source',
    symbolic: `|I_pk| = |V_s − ${nodeName}| / ΣR,  ΣR = ${names.join(' + ')}`,
    substituted: `|${vpk.text} − ${signedText(vnode)}| / ${r.text}`,
    result: ipk,
    terms: [vpk, vnode, r, ipk],
    note:
      gap > HAND_TOLERANCE
        ? `The hand form gives ${formatEng(hand, 'A')}, ${(gap * 100).toFixed(0)} % from the engine's ${ipk.text}: it takes the peaks as simultaneous and the source as a plain resistance, while the engine solves the case's waveform sample by sample. The engine's figure is the one judged.`
        : undefined,
  };
}

/** Average power in a series resistor over whole cycles: P = I_rms² · R (steady cases only). */
function resistorPowerLines(guard: Guard, result: StressResult): FormulaLine[] {
  const lines: FormulaLine[] = [];
  for (const stage of guard.stages) {
    const el = stage.series;
    if (el.kind !== 'resistor') continue;
    const s = result.elements.find((e) => e.elementId === el.id);
    if (!s || s.averagePower === null || s.rmsCurrent == null) continue;
    const irms = shown(s.rmsCurrent, 'A');
    const r = shown(el.resistance, 'Ω');
    const p = shown(s.averagePower, 'W');
    const hand = s.rmsCurrent * s.rmsCurrent * el.resistance;
    const gap = differs(hand, s.averagePower);
    lines.push({
      id: `power-${el.id}`,
      title: `Average power in ${el.id}`,
      symbolic: `P(${el.id}) = I_rms² · R`,
      substituted: `(${irms.text})² × ${r.text}`,
      result: p,
      terms: [irms, r, p],
      note:
        gap > HAND_TOLERANCE
          ? `The hand form gives ${formatEng(hand, 'W')}; the engine's figure is the integral over the cycle.`
          : undefined,
    });
  }
  return lines;
}

/** Derating and margin of one rating check: derated = rating × k_T × k_d, margin = (derated − stress) / derated. */
export function checkLines(elementId: string, c: RatingCheck, index: number): FormulaLine[] {
  if (c.rating === null || c.deratedRating === null || c.margin === null) return [];
  const unit = QUANTITY_UNIT[c.quantity];
  const rating = shown(c.rating, unit);
  const atT = c.temperatureRating ?? c.rating;
  const kT = c.rating !== 0 ? atT / c.rating : 1;
  const kd = atT !== 0 ? c.deratedRating / atT : 1;
  const derated = shown(c.deratedRating, unit);
  const value = shown(c.value, unit);
  const factors =
    kT !== 1
      ? `${rating.text} × ${kT.toPrecision(3)} × ${kd.toPrecision(3)}`
      : `${rating.text} × ${kd.toPrecision(3)}`;
  const marginText = formatMargin(c.margin);
  return [
    {
      id: `derated-${elementId}-${index}`,
      title: `${elementId}: derated ${c.quantity === 'i2t' ? 'I²t' : c.quantity}`,
      symbolic:
        kT !== 1
          ? 'derated = rating × k_T (ambient) × k_d (derating)'
          : 'derated = rating × k_d (derating)',
      substituted: factors,
      result: derated,
      terms: [rating, derated],
    },
    {
      id: `margin-${elementId}-${index}`,
      title: `${elementId}: margin`,
      symbolic: 'margin = (derated − stress) / derated',
      substituted: `(${derated.text} − ${value.text}) / ${derated.text}`,
      result: { value: c.margin, unit: '%', text: marginText },
      terms: [derated, value],
    },
  ];
}

/** Every line for one solved case (the waveform, where given, places the peak in time): the source current, resistor powers, then each element's derating and margin. */
export function formulasFor(
  guard: Guard,
  result: StressResult,
  waveform?: Waveform,
): FormulaLine[] {
  if (guard.stages.length === 0) return [];
  const lines = [peakCurrentLine(guard, result, waveform), ...resistorPowerLines(guard, result)];
  for (const e of result.elements) {
    // The worst-margin check of each element is the one that decides it.
    const judged = e.checks.filter((c) => c.margin !== null);
    if (judged.length === 0) continue;
    let k = 0;
    for (let i = 1; i < judged.length; i++) if (judged[i]!.margin! < judged[k]!.margin!) k = i;
    lines.push(...checkLines(e.elementId, judged[k]!, e.checks.indexOf(judged[k]!)));
  }
  return lines;
}
