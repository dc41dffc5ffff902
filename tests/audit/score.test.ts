import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hazardScore } from '@/lib/audit';
import { VERDICT_SEVERITY, type Verdict } from '@/lib/stress/types';

// The nearest-hazard score is our own definition (lib/audit/score.ts); these pin its promises.
const verdicts = Object.keys(VERDICT_SEVERITY) as Verdict[];

describe('nearest-hazard score', () => {
  it('with the default weights (0.3, 1), a plausible failure outranks a likely hold, however hard pressed', () => {
    expect(hazardScore(0.3, 'fails', 0)).toBeGreaterThan(hazardScore(1, 'holds', 1e9));
  });

  it('at equal likelihood, a worse verdict always outranks a better one', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...verdicts),
        fc.constantFrom(...verdicts),
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        (a, b, ua, ub) => {
          if (VERDICT_SEVERITY[a] > VERDICT_SEVERITY[b])
            expect(hazardScore(1, a, ua)).toBeGreaterThan(hazardScore(1, b, ub));
        },
      ),
    );
  });

  it('within a verdict, the harder-pressed guard scores higher', () => {
    expect(hazardScore(1, 'fails', 40)).toBeGreaterThan(hazardScore(1, 'fails', 3));
    expect(hazardScore(1, 'holds', 0.9)).toBeGreaterThan(hazardScore(1, 'holds', 0.2));
  });

  it('scales with the likelihood weight', () => {
    expect(hazardScore(0.5, 'marginal', 1)).toBeCloseTo(hazardScore(1, 'marginal', 1) / 2, 12);
  });
});
