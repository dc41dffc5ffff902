/**
 * Sizing remedies: each is verified by re-solving, and the series resistance is the smallest
 * E24 value that holds.
 */
import { describe, expect, it } from 'vitest';
import { E24, E96, eSeriesAbove, suggestRemedies } from '@/lib/remedies';
import { parseGuard, solveStress, type Guard, type StressCase } from '@/lib/stress';
import { VERDICT_SEVERITY } from '@/lib/stress/types';
import { CONDITIONS, NETWORKS } from './networks';

function channelVerdict(guard: Guard, cases: StressCase[]) {
  return cases
    .map((c) => solveStress(guard, c, CONDITIONS).verdict)
    .reduce(
      (w, v) => (VERDICT_SEVERITY[v] > VERDICT_SEVERITY[w] ? v : w),
      'holds' as const as ReturnType<typeof solveStress>['verdict'],
    );
}

describe('E series (IEC 60063)', () => {
  it('E24 has 24 values per decade, E96 follows 10^(i/96) to three figures', () => {
    expect(E24).toHaveLength(24);
    expect(E96).toHaveLength(96);
    expect(E96.slice(0, 4)).toEqual([1, 1.02, 1.05, 1.07]);
    expect(E96[95]).toBe(9.76);
    expect(eSeriesAbove(4700, 10e3, 'E24')).toEqual([
      5100, 5600, 6200, 6800, 7500, 8200, 9100, 10000,
    ]);
  });
});

describe('suggestRemedies', () => {
  // A 24 V DC input behind 1 kΩ 0.125 W and a 26 V TVS, hit by 48 V DC (a wrong supply):
  // 22 V across the resistor, 0.48 W in it.
  const guard: Guard = parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '1k',
          ratedPower: '0.125W',
          limitingVoltage: '150V',
        },
        shunts: [
          {
            kind: 'tvs',
            id: 'TV1',
            bidirectional: false,
            standoffVoltage: '26V',
            breakdownVoltage: '28.9V',
            clampVoltage: '42.1V',
            peakPulseCurrent: '14.3A',
            steadyPower: '5W',
          },
        ],
      },
    ],
    input: { positiveRail: 48, negativeRail: 0, absMaxBeyondRail: 0.3, inputResistance: '10k' },
  });
  const cases: StressCase[] = [{ kind: 'dc', voltage: 48, sourceResistance: 0.1 }];

  it('nothing to suggest for a channel that holds', () => {
    expect(
      suggestRemedies(
        NETWORKS.zener10k,
        { kind: 'dc', voltage: 24, sourceResistance: 0 },
        CONDITIONS,
      ),
    ).toEqual([]);
  });

  it('power rating and series resistance, each verified by re-solving', () => {
    expect(channelVerdict(guard, cases)).toBe('fails');
    const remedies = suggestRemedies(guard, cases, CONDITIONS);
    expect(remedies.length).toBeGreaterThan(0);
    for (const r of remedies) expect(channelVerdict(r.guard, cases)).toBe(r.verdict);
    const power = remedies.find((r) => r.kind === 'resistorPower')!;
    expect(power.changes[0]).toMatchObject({ elementId: 'R1', field: 'ratedPower', from: 0.125 });
    // the next step down from the proposal would not hold (minimality)
    expect(power.verdict).toBe('holds');
    const series = remedies.find((r) => r.kind === 'seriesResistance')!;
    expect(series.verdict).toBe('holds');
    const value = series.changes[0].to;
    expect(value).toBeGreaterThan(1000);
    const lower = eSeriesAbove(1000, value, 'E24').filter((v) => v < value);
    if (lower.length > 0) {
      const previous = structuredClone(guard);
      (previous.stages[0].series as { resistance: number }).resistance = lower[lower.length - 1];
      expect(channelVerdict(previous, cases)).not.toBe('holds');
    }
    expect(series.description).toMatch(/^R1 resistance: 1 kΩ → /);
  });

  it('TVS pulse rating for a surge it cannot take', () => {
    const remedies = suggestRemedies(
      NETWORKS.tvsBi,
      { kind: 'surge', peakVoltage: 2000, couplingResistance: 10 },
      CONDITIONS,
    );
    const tvs = remedies.find((r) => r.kind === 'tvsPulsePower');
    expect(tvs).toBeDefined();
    expect(tvs!.changes[0].to).toBeGreaterThan(600);
    const after = solveStress(
      tvs!.guard,
      { kind: 'surge', peakVoltage: 2000, couplingResistance: 10 },
      CONDITIONS,
    );
    expect(after.elements.find((e) => e.elementId === 'TV1')!.verdict).toBe('holds');
  });
});
