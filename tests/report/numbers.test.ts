/**
 * What the channel page prints equals the engine's JSON for the same case: every number with a
 * unit in the rendered calculations is formatEng (3 significant figures) of a figure the engine
 * returned or of an input it was given, and each calculation line lands on the engine's value.
 */
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { CaseCalculations } from '@/components/report/case-calculations';
import { checkCells, formatMargin, QUANTITY_UNIT } from '@/lib/report/format';
import { formulasFor, sourceOf } from '@/lib/report/formulas';
import { solveStress } from '@/lib/stress/solve';
import type {
  Guard,
  StressCase,
  StressConditions,
  StressResult,
  Waveform,
} from '@/lib/stress/types';
import { formatEng } from '@/lib/units';

// A 10 kΩ / 0.25 W series resistor and a bidirectional 12 V zener in front of a 24 V input:
// a typical digital-input guard (common practice, no source).
const guard: Guard = {
  stages: [
    {
      series: {
        kind: 'resistor',
        id: 'R1',
        resistance: 10e3,
        ratedPower: 0.25,
        limitingVoltage: 200,
        overloadVoltage: 400,
        pulseEnergy: 0.5,
      },
      shunts: [
        {
          kind: 'zener',
          id: 'D1',
          bidirectional: true,
          zenerVoltage: 12,
          dynamicImpedance: 9,
          testCurrent: 5e-3,
          powerRating: 0.5,
        },
      ],
    },
  ],
  input: {
    positiveRail: 24,
    negativeRail: 0,
    absMaxBeyondRail: 0.3,
    inputResistance: 1e6,
    internalClamps: true,
  },
};
const conditions: StressConditions = {
  ambientC: 40,
  powerDerating: 0.5,
  voltageDerating: 0.8,
  appliedTo: 'signal',
};

const CASES: StressCase[] = [
  // 230 V + 10 % (IEC 60038) line-to-earth at 50 Hz.
  { kind: 'ac', rmsVoltage: 253, frequency: 50, sourceResistance: 0.1 },
  // 28.8 V: 24 V + 20 % (IEC 61131-2 upper limit).
  { kind: 'dc', voltage: 28.8, sourceResistance: 0.1 },
  // IEC 61000-4-5 level 2 (1 kV) with the 40 Ω signal-line coupling.
  { kind: 'surge', peakVoltage: 1000, couplingResistance: 40 },
  // IEC 61000-4-2 level 4 contact discharge, negative.
  { kind: 'esd', voltage: -8000 },
];

const NUMBER_WITH_UNIT = /(-?\d+(?:\.\d+)?) ([GMkmµnp]?)(A²s|V|A|W|Ω|J|Hz|s)(?![a-zA-Z²])/g;

/** Every figure the page may legitimately print, formatted as the page formats it. */
function allowedTexts(result: StressResult, c: StressCase, waveform?: Waveform): Set<string> {
  const out = new Set<string>();
  const add = (v: number | null | undefined, unit: string) => {
    if (typeof v === 'number' && Number.isFinite(v)) out.add(formatEng(v, unit));
  };
  for (const e of result.elements) {
    add(e.peakVoltage, 'V');
    add(e.peakCurrent, 'A');
    add(e.averagePower, 'W');
    add(e.pulseEnergy, 'J');
    add(e.peakPower, 'W');
    add(e.rmsVoltage, 'V');
    add(e.rmsCurrent, 'A');
    for (const k of e.checks) {
      const u = QUANTITY_UNIT[k.quantity];
      add(k.value, u);
      add(k.rating, u);
      add(k.deratedRating, u);
      add(k.temperatureRating, u);
    }
  }
  add(result.input.peakVoltage, 'V');
  add(result.input.peakCurrent, 'A');
  add(result.sourcePeakCurrent, 'A');
  for (const r of result.rails) {
    add(r.injectedCurrent, 'A');
    add(r.minLoad, 'A');
  }
  // Inputs: the case and the guard it was solved for.
  const src = sourceOf(c);
  add(src.peak, 'V');
  add(src.resistance + 10e3, 'Ω'); // ΣR = source + R1
  add(10e3, 'Ω');
  if (c.kind === 'ac') {
    add(c.rmsVoltage, 'V');
    add(c.frequency, 'Hz');
    add(c.sourceResistance, 'Ω');
  }
  if (c.kind === 'dc') {
    add(c.voltage, 'V');
    add(c.sourceResistance, 'Ω');
  }
  if (waveform) {
    // The hand form reads the source and node voltages at the sample of the largest source current.
    const tr = (n: string) => waveform.traces.find((t) => t.name === n)!.values;
    const i = tr('source current');
    let k = 0;
    for (let j = 1; j < i.length; j++) if (Math.abs(i[j]!) > Math.abs(i[k]!)) k = j;
    add(tr('source')[k], 'V');
    add(tr('input')[k], 'V');
  }
  if (c.kind === 'surge') {
    out.add('50 µs'); // the waveform's name, "1.2/50 µs" (IEC 61000-4-5)
    add(c.peakVoltage, 'V');
    add(c.couplingResistance, 'Ω');
    out.add('2 Ω');
  }
  if (c.kind === 'esd') {
    add(c.voltage, 'V');
    out.add('150 pF').add('330 Ω');
  }
  return out;
}

describe('channel page numbers equal the engine’s', () => {
  for (const c of CASES) {
    it(`${c.kind}: every number shown is the engine's figure, same rounding`, () => {
      const result = solveStress(guard, c, conditions);
      const { waveform } = solveStress(guard, c, conditions, { waveform: true });
      const html = renderToStaticMarkup(
        createElement(CaseCalculations, { guard, result, conditions, waveform }),
      );
      const text = html
        .replace(/<[^>]+>/g, ' ')
        .replace(/&#x27;|&quot;|&amp;/g, "'")
        .replace(/\s+/g, ' ');
      const allowed = allowedTexts(result, c, waveform);
      // Reasons are the engine's own sentences; take them out before checking our figures.
      let ours = text;
      for (const reason of [
        result.reason,
        result.input.reason,
        ...result.elements.map((e) => e.reason),
      ])
        ours = ours.split(reason).join(' ');
      const shownNumbers = [...ours.matchAll(NUMBER_WITH_UNIT)].map(
        (m) => `${m[1]} ${m[2]}${m[3]}`,
      );
      expect(shownNumbers.length).toBeGreaterThan(4);
      const strangers = shownNumbers.filter((n) => !allowed.has(n));
      expect(strangers).toEqual([]);
      // The engine's one-line reason is printed verbatim.
      expect(text).toContain(result.reason.replace(/\s+/g, ' '));
    });

    it(`${c.kind}: each calculation ends on the engine's value`, () => {
      const result = solveStress(guard, c, conditions);
      const lines = formulasFor(guard, result);
      const peak = lines.find((l) => l.id === 'peak-current')!;
      expect(peak.result.text).toBe(formatEng(result.sourcePeakCurrent, 'A'));
      expect(peak.result.value).toBe(result.sourcePeakCurrent);
      for (const e of result.elements) {
        for (const [i, k] of e.checks.entries()) {
          const cells = checkCells(k);
          expect(cells.value).toBe(formatEng(k.value, QUANTITY_UNIT[k.quantity]));
          expect(cells.margin).toBe(formatMargin(k.margin));
          const marginLine = lines.find((l) => l.id === `margin-${e.elementId}-${i}`);
          if (marginLine) {
            // The margin's definition (lib/stress/ratings.ts check()): the substitution is exact.
            expect((k.deratedRating! - k.value) / k.deratedRating!).toBeCloseTo(k.margin!, 12);
            expect(marginLine.result.text).toBe(formatMargin(k.margin));
          }
          const deratedLine = lines.find((l) => l.id === `derated-${e.elementId}-${i}`);
          if (deratedLine)
            expect(deratedLine.result.text).toBe(
              formatEng(k.deratedRating!, QUANTITY_UNIT[k.quantity]),
            );
        }
      }
    });
  }

  it('AC mains through 10 kΩ into a 12 V zener: Ohm’s law by hand agrees with the engine', () => {
    // Hand calculation (Ohm's law): the largest current flows on the negative half-cycle, where
    // the input's own clamp (0.7 V at 1 mA plus its bulk resistance, common practice) holds the
    // node a volt or two below 0 V: (357.8 − 0…4) V / 10 kΩ = 35.4…35.8 mA, against ≈ 34.5 mA
    // on the positive half where the 12 V zener holds it.
    const result = solveStress(guard, CASES[0]!, conditions);
    expect(result.sourcePeakCurrent).toBeGreaterThan(0.0352);
    expect(result.sourcePeakCurrent).toBeLessThan(0.0358);
    const { waveform } = solveStress(guard, CASES[0]!, conditions, { waveform: true });
    const line = formulasFor(guard, result, waveform).find((l) => l.id === 'peak-current')!;
    expect(line.note).toBeUndefined();
    expect(line.substituted).toMatch(
      new RegExp(
        `^\\|-${formatEng(253 * Math.SQRT2, 'V')} − \\(-[0-9.]+ m?V\\)\\| / ${formatEng(10e3 + 0.1, 'Ω')}$`,
      ),
    );
    // Without the waveform the peaks do not coincide: the line says so instead of pretending.
    expect(formulasFor(guard, result).find((l) => l.id === 'peak-current')!.note).toMatch(
      /peaks as simultaneous/,
    );
    // P = I_rms² R for the resistor equals the engine's integrated average power.
    const power = formulasFor(guard, result).find((l) => l.id === 'power-R1')!;
    expect(power.note).toBeUndefined();
    expect(power.result.text).toBe(formatEng(result.elements[0]!.averagePower!, 'W'));
  });
});

describe('margin wording', () => {
  it('reads as a percentage near the rating and as a multiple far beyond it', () => {
    // margin = (derated − stress) / derated (lib/stress/ratings.ts), so stress / derated = 1 − margin.
    expect(formatMargin(0.7781)).toBe('77.8 %');
    expect(formatMargin(0)).toBe('0.0 %');
    expect(formatMargin(-0.566)).toBe('-56.6 %');
    expect(formatMargin(-8.99)).toBe('-899.0 %');
    expect(formatMargin(-9.5)).toBe('10.5× derated');
    expect(formatMargin(-2008.588)).toBe('2010× derated');
    expect(formatMargin(null)).toBe('—');
    expect(formatMargin(-1e9)).toBe('far over');
  });
});
