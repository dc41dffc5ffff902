/**
 * Inner node voltages for the plots are derived from the engine's terminal voltage and series
 * currents by Ohm's law; carried to the last node they must land on the engine's own input
 * trace, which checks both the derivation and the naming of the engine's traces.
 */
import { describe, expect, it } from 'vitest';
import { innerNodeTraces, lastNodeByOhm } from '@/lib/report/node-traces';
import { solveStress } from '@/lib/stress/solve';
import type { Guard, StressCase } from '@/lib/stress/types';

// Two-stage guard: 100 Ω + TVS, then 1 kΩ + rail diodes (common practice, no source).
const guard: Guard = {
  stages: [
    {
      series: { kind: 'resistor', id: 'R1', resistance: 100, ratedPower: 0.5 },
      shunts: [
        {
          kind: 'tvs',
          id: 'T1',
          bidirectional: true,
          standoffVoltage: 26,
          breakdownVoltage: 28.9,
          clampVoltage: 42.1,
          peakPulseCurrent: 14.3,
        },
      ],
    },
    {
      series: { kind: 'resistor', id: 'R2', resistance: 1000, ratedPower: 0.25 },
      shunts: [{ kind: 'railDiodes', id: 'D2', forwardVoltage: 1, forwardCurrent: 0.01 }],
    },
  ],
  input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3, inputResistance: 5e3 },
};
const conditions = { ambientC: 40, powerDerating: 0.5, voltageDerating: 0.8 };

describe('inner node traces', () => {
  // IEC 60038 230 V + 10 %; IEC 61000-4-5 1 kV with 40 Ω coupling; IEC 61000-4-2 4 kV contact.
  const cases: StressCase[] = [
    { kind: 'ac', rmsVoltage: 253, frequency: 50, sourceResistance: 0.1 },
    { kind: 'surge', peakVoltage: 1000, couplingResistance: 40 },
    { kind: 'esd', voltage: 4000 },
  ];
  for (const c of cases) {
    it(`${c.kind}: Ohm's law along the ladder lands on the engine's input voltage`, () => {
      const { waveform } = solveStress(guard, c, conditions, { waveform: true });
      const input = waveform!.traces.find((t) => t.name === 'input')!.values;
      const derived = lastNodeByOhm(guard, waveform!)!;
      const scale = Math.max(...input.map(Math.abs), 1e-9);
      for (let i = 0; i < input.length; i++)
        expect(Math.abs(derived[i]! - input[i]!) / scale).toBeLessThan(1e-6);
      const inner = innerNodeTraces(guard, waveform!);
      expect(inner.map((t) => t.name)).toEqual(['node 1 (after R1)']);
      // The TVS node is clamped: it never exceeds the terminal in magnitude.
      const terminal = waveform!.traces.find((t) => t.name === 'terminal')!.values;
      const node1 = inner[0]!.values;
      expect(Math.max(...node1.map(Math.abs))).toBeLessThanOrEqual(
        Math.max(...terminal.map(Math.abs)) + 1e-9,
      );
    });
  }

  it('no inner node for a single stage, and none past a PTC', () => {
    const one: Guard = { stages: [guard.stages[0]!], input: guard.input };
    const { waveform } = solveStress(one, cases[0]!, conditions, { waveform: true });
    expect(innerNodeTraces(one, waveform!)).toEqual([]);
    const ptc: Guard = structuredClone(guard);
    ptc.stages[0]!.series = {
      kind: 'ptc',
      id: 'F1',
      resistance: 10,
      holdCurrent: 0.05,
      tripCurrent: 0.1,
      maxVoltage: 265,
    };
    const w = solveStress(ptc, cases[0]!, conditions, { waveform: true }).waveform!;
    expect(innerNodeTraces(ptc, w)).toEqual([]);
  });
});
