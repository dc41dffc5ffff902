/**
 * The channel page's remedies: the sizing (lib/remedies) runs per terminal side and the
 * suggestions are merged; a merged suggestion that says "holds" must hold when every case of
 * the channel, on both sides, is re-solved with it, as the "what if" does.
 */
import { describe, expect, it } from 'vitest';
import { withEdits } from '@/components/report/what-if';
import { remedyOptions } from '@/lib/report/remedies';
import { solveStress } from '@/lib/stress/solve';
import type { Guard, HazardTerminal, StressCase, StressConditions } from '@/lib/stress/types';

// A 4–20 mA input: 100 Ω series resistor, 250 Ω burden, 30 V input stage (common practice, no source).
const guard: Guard = {
  stages: [
    {
      series: {
        kind: 'resistor',
        id: 'R1',
        resistance: 100,
        ratedPower: 0.25,
        limitingVoltage: 200,
      },
      shunts: [
        { kind: 'shuntResistor', id: 'RB', resistance: 250, ratedPower: 0.6, limitingVoltage: 350 },
      ],
    },
  ],
  input: { positiveRail: 30, negativeRail: 0, absMaxBeyondRail: 5, inputResistance: 1e6 },
};
const base = { ambientC: 40, powerDerating: 0.5, voltageDerating: 0.8 };
const conditions: Record<HazardTerminal, StressConditions> = {
  signal: { ...base, appliedTo: 'signal' },
  return: { ...base, appliedTo: 'return' },
};
// 28.8 V: the 24 V DC supply at its IEC 61131-2 maximum; on the signal and on the return terminal.
const dc: StressCase = { kind: 'dc', voltage: 28.8, sourceResistance: 0.1 };
const signalSide = [{ stress: dc, appliedTo: 'signal' as const }];
const bothSides = [
  { stress: dc, appliedTo: 'signal' as const },
  { stress: dc, appliedTo: 'return' as const },
];
const cases = signalSide;

describe('remedies on the channel page', () => {
  it('a suggestion marked as holding holds on every case of the channel when re-solved', () => {
    const before = cases.map((c) => solveStress(guard, c.stress, conditions[c.appliedTo]).verdict);
    expect(before.some((v) => v !== 'holds')).toBe(true);
    const options = remedyOptions(guard, cases, conditions);
    expect(options.length).toBeGreaterThan(0);
    const holding = options.filter((o) => /: holds\.$/.test(o.detail));
    expect(holding.length).toBeGreaterThan(0);
    // Larger series resistance is the change that helps against mains (Ohm's law: less current).
    expect(
      holding.some((o) => o.changes.some((c) => c.elementId === 'R1' && c.field === 'resistance')),
    ).toBe(true);
    for (const o of holding) {
      const edits: Record<string, Record<string, number>> = {};
      for (const c of o.changes) (edits[c.elementId] ??= {})[c.field] = c.to;
      const trial = withEdits(guard, edits);
      for (const c of cases)
        expect(solveStress(trial, c.stress, conditions[c.appliedTo]).verdict).toBe('holds');
    }
    // The page's guard is never touched by a trial.
    expect(guard.stages[0]!.series).toMatchObject({ resistance: 100, ratedPower: 0.25 });
  });

  it('a suggestion made for one side is judged on both: the verdict shown is the re-solved one', () => {
    // On the return terminal the 28.8 V pulls the input 20 V below its negative rail whatever R1
    // is, so the signal side's larger resistor cannot make this channel hold.
    const options = remedyOptions(guard, bothSides, conditions);
    expect(options.length).toBeGreaterThan(0);
    for (const o of options) {
      const edits: Record<string, Record<string, number>> = {};
      for (const c of o.changes) (edits[c.elementId] ??= {})[c.field] = c.to;
      const trial = withEdits(guard, edits);
      const verdicts = bothSides.map(
        (c) => solveStress(trial, c.stress, conditions[c.appliedTo]).verdict,
      );
      const holds = verdicts.every((v) => v === 'holds');
      expect(/: holds\.$/.test(o.detail)).toBe(holds);
    }
    expect(options.some((o) => /: holds\.$/.test(o.detail))).toBe(false);
  });

  it('a channel that already holds gets no suggestion', () => {
    const strong: Guard = structuredClone(guard);
    Object.assign(strong.stages[0]!.series, { resistance: 10e3, ratedPower: 2 });
    const verdicts = signalSide.map(
      (c) => solveStress(strong, c.stress, conditions[c.appliedTo]).verdict,
    );
    expect(verdicts).toEqual(['holds']);
    expect(remedyOptions(strong, signalSide, conditions)).toEqual([]);
  });
});
