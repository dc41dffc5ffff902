/**
 * Every verdict class comes out of at least one network, with a reason naming the element.
 */
import { describe, expect, it } from 'vitest';
import { mainsCase, parseGuard, solveStress, type Guard } from '@/lib/stress';
import { CASES, CONDITIONS, NETWORKS, lone1kResistor } from './networks';

describe('verdict classes', () => {
  it('holds: 28.8 V DC on the 10 kΩ / 12 V zener guard', () => {
    const r = solveStress(NETWORKS.zener10k, CASES.dc24, CONDITIONS);
    expect(r.verdict).toBe('holds');
    expect(r.elements.every((e) => e.verdict === 'holds')).toBe(true);
  });

  it('marginal: a resistor between its derated and its absolute rating', () => {
    const guard: Guard = lone1kResistor();
    // 0.2 W in R1 at 25 °C: beyond 0.125 W derated, within 0.25 W
    const r = solveStress(
      guard,
      { kind: 'dc', voltage: Math.sqrt(0.2 * 1000), sourceResistance: 0 },
      { ...CONDITIONS, ambientC: 25 },
    );
    expect(r.verdict).toBe('marginal');
    expect(r.reason).toMatch(/^R1: 200 mW peak \/ 200 mW average against 125 mW derated/);
  });

  it('fails: mains on a 0603 100 Ω resistor', () => {
    const r = solveStress(NETWORKS.resistorFails, CASES.ac230, CONDITIONS);
    expect(r.verdict).toBe('fails');
    const r1 = r.elements.find((e) => e.elementId === 'R1')!;
    expect(r1.verdict).toBe('fails');
    expect(r.reason.startsWith('R1:')).toBe(true);
  });

  it('unprotected: a wire link in front of an IC input, and no guard at all', () => {
    const wire = solveStress(NETWORKS.wireOnly, CASES.ac230, CONDITIONS);
    expect(wire.verdict).toBe('unprotected');
    expect(wire.reason).toMatch(/nothing in the guard limits current/);
    const none = solveStress(NETWORKS.none, CASES.ac120, CONDITIONS);
    expect(none.verdict).toBe('unprotected');
    expect(none.reason).toMatch(/^no guard/);
  });

  it('incomplete: a zener without a power rating that conducts', () => {
    const guard: Guard = parseGuard({
      stages: [
        {
          series: {
            kind: 'resistor',
            id: 'R1',
            resistance: '10k',
            ratedPower: '2W',
            limitingVoltage: '500V',
          },
          shunts: [
            {
              kind: 'zener',
              id: 'Z1',
              bidirectional: true,
              zenerVoltage: '12V',
              dynamicImpedance: '9',
            },
          ],
        },
      ],
      // a ±15 V input: the clamped ±12.9 V stays within its rails
      input: { positiveRail: 15, negativeRail: -15, absMaxBeyondRail: 0.3, inputResistance: '1M' },
    });
    const r = solveStress(guard, mainsCase(120, 0.05, 60), CONDITIONS);
    expect(r.verdict).toBe('incomplete');
    expect(r.reason).toMatch(/^Z1: .*power rating not given/);
  });

  it('a missing rating is never a silent pass: a resistor without rated power under load is incomplete', () => {
    const guard: Guard = parseGuard({
      stages: [{ series: { kind: 'resistor', id: 'R1', resistance: '1k' }, shunts: [] }],
      input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3, inputResistance: '10k' },
    });
    const r = solveStress(guard, { kind: 'dc', voltage: 20, sourceResistance: 0 }, CONDITIONS);
    expect(r.verdict).toBe('incomplete');
    expect(r.reason).toMatch(/^R1: .*rated power not given/);
  });

  it('a fault that does not open the fuse says the rest must survive it continuously', () => {
    const r = solveStress(NETWORKS.varistorTerminal, CASES.ac24, CONDITIONS);
    const f1 = r.elements.find((e) => e.elementId === 'F1')!;
    expect(f1.reason).toMatch(/does not open the 100 mA fuse/);
    expect(f1.reason).toMatch(/withstand the fault continuously/);
  });

  it('a fuse that opens says how fast, from its melting I²t', () => {
    const guard: Guard = parseGuard({
      stages: [
        {
          series: {
            kind: 'fuse',
            id: 'F1',
            ratedCurrent: '100mA',
            voltageRating: '400V',
            meltingI2t: '0.02',
          },
          shunts: [
            {
              kind: 'zener',
              id: 'Z1',
              bidirectional: true,
              zenerVoltage: '24V',
              dynamicImpedance: '5',
              powerRating: '5W',
            },
          ],
        },
        {
          series: {
            kind: 'resistor',
            id: 'R1',
            resistance: '1k',
            ratedPower: '0.25W',
            limitingVoltage: '200V',
          },
          shunts: [],
        },
      ],
      input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3, inputResistance: '10k' },
    });
    const r = solveStress(
      guard,
      { kind: 'ac', rmsVoltage: 253, frequency: 50, sourceResistance: 20 },
      CONDITIONS,
    );
    const f1 = r.elements.find((e) => e.elementId === 'F1')!;
    expect(f1.reason).toMatch(/opens the 100 mA fuse in about/);
  });

  it('a DC fault that opens the fuse within its melting-I²t range: the rest is judged for that time only', () => {
    const guard: Guard = parseGuard({
      stages: [
        {
          series: {
            kind: 'fuse',
            id: 'F1',
            ratedCurrent: '100mA',
            voltageRating: '250V',
            meltingI2t: '0.02',
            resistance: '1.5',
          },
          shunts: [
            {
              kind: 'tvs',
              id: 'TV1',
              bidirectional: true,
              standoffVoltage: '33V',
              breakdownVoltage: '36.7V',
              clampVoltage: '53.3V',
              peakPulseCurrent: '11.3A',
            },
          ],
        },
      ],
      input: {
        positiveRail: 24,
        negativeRail: 0,
        absMaxBeyondRail: 0.3,
        inputResistance: '10k',
        internalClamps: true,
      },
    });
    const dc = solveStress(guard, { kind: 'dc', voltage: 60, sourceResistance: 2 }, CONDITIONS);
    const f1 = dc.elements.find((e) => e.elementId === 'F1')!;
    // I ≈ (60 − ~40 V) / 3.5 Ω ≈ 6 A: melting 0.02 A²s / 6² ≈ 0.6 ms
    expect(f1.reason).toMatch(
      /opens the 100 mA fuse in about .*s \(melting I²t 20 mA²s\); the rest of the network is judged for that time/,
    );
    const tvs = dc.elements.find((e) => e.elementId === 'TV1')!;
    expect(tvs.checks[0].quantity).toBe('pulsePower');
    expect(tvs.reason).toMatch(/until F1 opens\)$/);
    // the same fault on AC is not credited (the opening time depends on the phase)
    const ac = solveStress(
      guard,
      { kind: 'ac', rmsVoltage: 42, frequency: 50, sourceResistance: 2 },
      CONDITIONS,
    );
    expect(ac.elements.find((e) => e.elementId === 'TV1')!.checks[0].quantity).not.toBe(
      'pulsePower',
    );
  });

  it('rail pump-up: clamp current into a lightly loaded 5 V rail fails in a steady fault', () => {
    const r = solveStress(NETWORKS.esdCapRail, CASES.ac24, CONDITIONS);
    const positive = r.rails.find((x) => x.rail === 'positive')!;
    expect(positive.minLoad).toBe(0.002);
    expect(positive.injectedCurrent).toBeGreaterThan(0.002);
    expect(positive.pumpsUp).toBe(true);
    expect(['fails', 'unprotected']).toContain(r.verdict);
  });

  it('hazard on the return terminal reverses the polarity the guard sees', () => {
    const signal = solveStress(NETWORKS.tvsRail2, CASES.dc24, CONDITIONS);
    const reversed = solveStress(
      NETWORKS.tvsRail2,
      { kind: 'dc', voltage: -28.8, sourceResistance: 0.1 },
      CONDITIONS,
    );
    const returned = solveStress(NETWORKS.tvsRail2, CASES.dc24, {
      ...CONDITIONS,
      appliedTo: 'return',
    });
    expect(returned.sourcePeakCurrent).toBeCloseTo(reversed.sourcePeakCurrent, 12);
    expect(returned.sourcePeakCurrent).not.toBeCloseTo(signal.sourcePeakCurrent, 6);
    expect(returned.notes?.some((n) => n.includes('return terminal'))).toBe(true);
  });

  it('TVS on a continuous mains fault fails short (not rated for continuous conduction)', () => {
    const r = solveStress(NETWORKS.tvsBi, CASES.ac230, CONDITIONS);
    const tvs = r.elements.find((e) => e.elementId === 'TV1')!;
    expect(tvs.verdict).toBe('fails');
    expect(tvs.reason).toMatch(/not rated for a continuous fault/);
  });

  it('TVS surge rating: 8/20-class pulses use ×5 of the 10/1000 µs peak pulse power (REFERENCE.md conservative default)', () => {
    const r = solveStress(
      NETWORKS.tvsBi,
      { kind: 'surge', peakVoltage: 1000, couplingResistance: 40 },
      CONDITIONS,
    );
    const tvs = r.elements.find((e) => e.elementId === 'TV1')!;
    const check = tvs.checks.find((c) => c.quantity === 'pulsePower')!;
    expect(check.rating!).toBeGreaterThanOrEqual(600);
    expect(tvs.verdict).toBe('holds');
  });
});
