/** fast-check generators of valid guards and cases (SI numbers, as the schema outputs). */
import fc from 'fast-check';
import type { Guard, GuardStage, SeriesElement, ShuntElement, StressCase } from '@/lib/stress';

const logUniform = (lo: number, hi: number) =>
  fc
    .double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true })
    .map((x) => Number((10 ** x).toPrecision(4)));

export const seriesArb = (id: string): fc.Arbitrary<SeriesElement> =>
  fc.oneof(
    logUniform(1, 100e3).map((r) => ({
      kind: 'resistor' as const,
      id,
      resistance: r,
      ratedPower: 0.25,
      limitingVoltage: 200,
    })),
    logUniform(0.01, 10).map((r) => ({ kind: 'wire' as const, id, resistance: r })),
    fc.tuple(logUniform(0.05, 2), logUniform(0.5, 50)).map(([i, r]) => ({
      kind: 'fuse' as const,
      id,
      ratedCurrent: i,
      resistance: r,
      voltageRating: 250,
      meltingI2t: 0.01,
    })),
    fc.tuple(logUniform(1, 50), logUniform(0.02, 0.5)).map(([r, i]) => ({
      kind: 'ptc' as const,
      id,
      resistance: r,
      holdCurrent: i,
      tripCurrent: 2 * i,
      maxVoltage: 60,
    })),
  );

export const shuntArb = (id: string): fc.Arbitrary<ShuntElement> =>
  fc.oneof(
    fc
      .tuple(fc.double({ min: 0.5, max: 1.2, noNaN: true }), logUniform(1e-3, 1))
      .map(([vf, i]) => ({
        kind: 'railDiodes' as const,
        id,
        forwardVoltage: vf,
        forwardCurrent: i,
        averageCurrent: 0.2,
        surgeCurrent: 2,
      })),
    fc
      .tuple(fc.boolean(), fc.double({ min: 3.3, max: 47, noNaN: true }), logUniform(1, 100))
      .map(([bi, vz, z]) => ({
        kind: 'zener' as const,
        id,
        bidirectional: bi,
        zenerVoltage: vz,
        testCurrent: 5e-3,
        dynamicImpedance: z,
        powerRating: 0.5,
      })),
    fc
      .tuple(
        fc.boolean(),
        fc.double({ min: 5, max: 60, noNaN: true }),
        fc.double({ min: 1.3, max: 1.7, noNaN: true }),
      )
      .map(([bi, vwm, ratio]) => ({
        kind: 'tvs' as const,
        id,
        bidirectional: bi,
        standoffVoltage: vwm,
        breakdownVoltage: vwm * 1.11,
        clampVoltage: vwm * ratio,
        peakPulseCurrent: 600 / (vwm * ratio),
      })),
    fc
      .tuple(
        fc.double({ min: 20, max: 500, noNaN: true }),
        fc.double({ min: 1.5, max: 2.2, noNaN: true }),
      )
      .map(([v1, ratio]) => ({
        kind: 'varistor' as const,
        id,
        maxContinuousVoltage: v1 * 0.6,
        varistorVoltage: v1,
        clampVoltage: v1 * ratio,
        clampCurrent: 5,
        surgeCurrent: 500,
        surgeEnergy: 2,
      })),
    logUniform(100, 1e6).map((r) => ({
      kind: 'shuntResistor' as const,
      id,
      resistance: r,
      ratedPower: 0.25,
      limitingVoltage: 200,
    })),
  );

/** Guards without capacitors (the static solver); `withCapacitor` adds one somewhere. */
export const guardArb = (options: { withCapacitor?: boolean } = {}): fc.Arbitrary<Guard> =>
  fc
    .tuple(
      fc.integer({ min: 1, max: 3 }),
      fc.array(fc.tuple(seriesArb('S'), fc.array(shuntArb('H'), { maxLength: 2 })), {
        minLength: 3,
        maxLength: 3,
      }),
      fc.constantFrom(5, 10, 24),
      fc.boolean(),
      fc.option(logUniform(250, 1e6), { nil: undefined }),
      logUniform(1e-9, 1e-6),
    )
    .map(([count, raw, rail, clamps, rin, cap]) => {
      const stages: GuardStage[] = raw.slice(0, count).map(([series, shunts], k) => ({
        series: { ...series, id: `S${k + 1}` },
        shunts: shunts.map((s, j) => ({ ...s, id: `H${k + 1}${j + 1}` })),
      }));
      if (options.withCapacitor)
        stages[stages.length - 1].shunts.push({
          kind: 'capacitor',
          id: 'C1',
          capacitance: cap,
          voltageRating: 100,
        });
      return {
        stages,
        input: {
          positiveRail: rail,
          negativeRail: 0,
          absMaxBeyondRail: 0.3,
          internalClamps: clamps,
          inputResistance: rin,
          positiveRailMinLoad: 1e-3,
        },
      };
    });

export const caseArb: fc.Arbitrary<StressCase> = fc.oneof(
  fc
    .tuple(fc.double({ min: -500, max: 500, noNaN: true }), logUniform(0.01, 100))
    .map(([v, r]) => ({ kind: 'dc' as const, voltage: v, sourceResistance: r })),
  fc
    .tuple(
      fc.double({ min: 1, max: 480, noNaN: true }),
      fc.constantFrom(50, 60, 400),
      logUniform(0.01, 10),
    )
    .map(([v, f, r]) => ({
      kind: 'ac' as const,
      rmsVoltage: v,
      frequency: f,
      sourceResistance: r,
    })),
  fc
    .tuple(fc.double({ min: -4000, max: 4000, noNaN: true }), fc.constantFrom(0, 10, 40))
    .map(([v, c]) => ({ kind: 'surge' as const, peakVoltage: v, couplingResistance: c })),
  fc
    .double({ min: -8000, max: 8000, noNaN: true })
    .map((v) => ({ kind: 'esd' as const, voltage: v })),
);

/** Same case with its source scaled by k (k > 1: a stronger hazard). */
export function scaled(c: StressCase, k: number): StressCase {
  switch (c.kind) {
    case 'dc':
      return { ...c, voltage: c.voltage * k };
    case 'ac':
      return { ...c, rmsVoltage: c.rmsVoltage * k };
    case 'surge':
      return { ...c, peakVoltage: c.peakVoltage * k };
    case 'esd':
      return { ...c, voltage: c.voltage * k };
  }
}
