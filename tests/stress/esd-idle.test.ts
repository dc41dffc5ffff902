import { describe, expect, it } from 'vitest';
import { solveStress } from '@/lib/stress';
import type { Guard, StressConditions } from '@/lib/stress/types';

// A network that dissipates at rest: a rail-diode pair whose datasheet point (0.57 V at 1 A)
// implies microamps of reverse leakage from a 10 V rail. Pulse energy is what the discharge
// adds; found by the fast-check property (FC_SEED exploration), where it came out negative.
const leaky: Guard = {
  stages: [
    {
      series: {
        kind: 'fuse',
        id: 'F1',
        ratedCurrent: 1,
        resistance: 1,
        voltageRating: 250,
        meltingI2t: 0.01,
      },
      shunts: [
        {
          kind: 'shuntResistor',
          id: 'R2',
          resistance: 100,
          ratedPower: 0.25,
          limitingVoltage: 200,
        },
      ],
    },
    {
      series: {
        kind: 'resistor',
        id: 'R3',
        resistance: 470,
        ratedPower: 0.25,
        limitingVoltage: 200,
      },
      shunts: [
        {
          kind: 'railDiodes',
          id: 'D1',
          forwardVoltage: 0.57,
          forwardCurrent: 1,
          averageCurrent: 0.2,
          surgeCurrent: 2,
        },
        {
          kind: 'shuntResistor',
          id: 'R4',
          resistance: 100,
          ratedPower: 0.25,
          limitingVoltage: 200,
        },
      ],
    },
  ],
  input: {
    positiveRail: 10,
    negativeRail: 0,
    absMaxBeyondRail: 0.3,
    internalClamps: false,
    inputResistance: 250,
    positiveRailMinLoad: 0.001,
  },
};
const conditions: StressConditions = { ambientC: 40, powerDerating: 0.5, voltageDerating: 0.8 };

const d1 = (r: ReturnType<typeof solveStress>) => r.elements.find((e) => e.elementId === 'D1')!;

describe('ESD pulse energy in a network that dissipates at rest', () => {
  it('is positive and grows with the charge voltage, down to tens of volts', () => {
    const energies = [-30, -77, -300, -1000].map(
      (voltage) => d1(solveStress(leaky, { kind: 'esd', voltage }, conditions)).pulseEnergy!,
    );
    for (const e of energies) expect(e).toBeGreaterThan(0);
    for (let k = 1; k < energies.length; k++) expect(energies[k]).toBeGreaterThan(energies[k - 1]);
  });

  for (const voltage of [-1000, 4000, 8000]) {
    it(`${voltage} V: the quadrature agrees with time stepping less the idle dissipation`, () => {
      const quadrature = d1(solveStress(leaky, { kind: 'esd', voltage }, conditions)).pulseEnergy!;
      const stepped = solveStress(leaky, { kind: 'esd', voltage }, conditions, {
        forceTimeStepping: true,
      });
      const idle = d1(
        solveStress(leaky, { kind: 'dc', voltage: 0, sourceResistance: 330 }, conditions),
      ).averagePower!;
      // The stepped run integrates over about 10 τ of the 150 pF / 330 Ω source, idle included.
      const expected = d1(stepped).pulseEnergy! - idle * 10 * 150e-12 * 330;
      // Self-consistency of two integration methods (no outside source): within 3 %.
      expect(Math.abs(quadrature - expected) / expected).toBeLessThan(0.03);
    });
  }
});
