/**
 * Engineering notation: the letter-as-decimal-point form is the RKM code of IEC 60062.
 */
import { describe, expect, it } from 'vitest';
import { EngParseError, formatEng, parseEng } from '@/lib/units';
import { parseGuard, parseStressRequest, StressInputError } from '@/lib/stress';

describe('parseEng', () => {
  const cases: [string, number][] = [
    ['4k99', 4990],
    ['10k', 10e3],
    ['0.25W', 0.25],
    ['100n', 100e-9],
    ['2M2', 2.2e6],
    ['1m', 1e-3],
    ['470u', 470e-6],
    ['470µ', 470e-6],
    ['2.2µF', 2.2e-6],
    ['4R7', 4.7],
    ['0R1', 0.1],
    ['10 kΩ', 10e3],
    ['10kohm', 10e3],
    ['1e-3', 1e-3],
    ['-5', -5],
    ['4.7 V', 4.7],
    ['1meg', 1e6],
    ['1.5 mA', 1.5e-3],
    ['20ms', 20e-3],
    ['50Hz', 50],
    ['0.02A²s', 0.02],
    ['3.3nF', 3.3e-9],
    ['1.5kJ', 1500],
  ];
  for (const [text, value] of cases) {
    it(`${text} → ${value}`, () => {
      expect(parseEng(text)).toBeCloseTo(value, 15);
      expect(Math.abs(parseEng(text) - value)).toBeLessThanOrEqual(Math.abs(value) * 1e-15);
    });
  }
  it('passes finite numbers through and rejects others', () => {
    expect(parseEng(12.5)).toBe(12.5);
    expect(() => parseEng(Number.NaN)).toThrow(EngParseError);
    expect(() => parseEng(Number.POSITIVE_INFINITY)).toThrow(/finite/);
  });
  const garbage: [string, RegExp][] = [
    ['', /empty/],
    ['abc', /does not start with a number/],
    ['10x', /unknown unit or suffix "x"/],
    ['1..2', /unknown unit or suffix/],
    ['4k9k', /unknown unit or suffix/],
    ['1e999', /out of range/],
  ];
  for (const [text, message] of garbage) {
    it(`rejects "${text}" with a clear message`, () => {
      expect(() => parseEng(text)).toThrow(message);
    });
  }
  it('rejects a unit other than the one expected', () => {
    expect(() => parseEng('10 V', 'Ω')).toThrow('expected a value in Ω, got V');
    expect(parseEng('10k', 'Ω')).toBe(10e3);
  });
});

describe('formatEng', () => {
  it('three significant figures with an SI prefix', () => {
    expect(formatEng(0.0167, 'A')).toBe('16.7 mA');
    expect(formatEng(2.46, 'W')).toBe('2.46 W');
    expect(formatEng(4990, 'Ω')).toBe('4.99 kΩ');
    expect(formatEng(999.96, 'V')).toBe('1 kV');
    expect(formatEng(0, 'A')).toBe('0 A');
    expect(formatEng(-1.5e-9, 'F')).toBe('-1.5 nF');
    expect(formatEng(150e-12, 'F')).toBe('150 pF');
  });
});

describe('stress JSON schema', () => {
  it('accepts numbers or engineering strings and produces SI numbers', () => {
    const guard = parseGuard({
      stages: [
        {
          series: { kind: 'resistor', id: 'R1', resistance: '4k99', ratedPower: '0.25W' },
          shunts: [{ kind: 'capacitor', id: 'C1', capacitance: '100n' }],
        },
      ],
      input: { positiveRail: '24V', negativeRail: 0, absMaxBeyondRail: 0.3 },
    });
    expect(guard.stages[0].series).toMatchObject({ resistance: 4990, ratedPower: 0.25 });
    expect(guard.stages[0].shunts[0]).toMatchObject({ capacitance: 100e-9 });
  });
  it('names the field path of every error', () => {
    try {
      parseStressRequest({
        guard: {
          stages: [
            {
              series: { kind: 'resistor', id: 'R1', resistance: '10kV' },
              shunts: [{ kind: 'zener', id: 'Z1', bidirectional: true, zenerVoltage: '12' }],
            },
          ],
          input: { positiveRail: 5, negativeRail: 10, absMaxBeyondRail: 0.3 },
        },
        case: { kind: 'surge', peakVoltage: 'lots' },
      });
      expect.unreachable('should have thrown');
    } catch (error) {
      expect(error).toBeInstanceOf(StressInputError);
      const paths = (error as StressInputError).issues.map((i) => i.path);
      expect(paths).toContain('guard.stages.0.series.resistance');
      expect(paths).toContain('guard.stages.0.shunts.0.dynamicImpedance');
      expect(paths).toContain('case.peakVoltage');
      expect(paths).toContain('case.couplingResistance');
      expect((error as Error).message).toMatch(
        /guard\.stages\.0\.series\.resistance: "10kV": expected a value in Ω, got V/,
      );
    }
  });
  it('rejects negative or zero where a part figure must be positive, and unknown kinds', () => {
    expect(() =>
      parseGuard({
        stages: [{ series: { kind: 'resistor', id: 'R1', resistance: '-1k' }, shunts: [] }],
        input: { positiveRail: 5, negativeRail: 0, absMaxBeyondRail: 0.3 },
      }),
    ).toThrow(/guard\.stages\.0\.series\.resistance: must not be negative/);
    expect(() =>
      parseGuard({
        stages: [{ series: { kind: 'diode', id: 'D' }, shunts: [] }],
        input: { positiveRail: 5, negativeRail: 0, absMaxBeyondRail: 0.3 },
      }),
    ).toThrow(/unknown series element kind "diode"/);
    expect(() =>
      parseGuard({
        stages: [],
        input: { positiveRail: 0, negativeRail: 5, absMaxBeyondRail: 0.3 },
      }),
    ).toThrow(/guard\.input\.positiveRail: positive rail must be above/);
  });
  it('rejects duplicate element ids and unknown fields', () => {
    expect(() =>
      parseGuard({
        stages: [
          { series: { kind: 'wire', id: 'X', resistance: 0 }, shunts: [] },
          { series: { kind: 'wire', id: 'X', resistance: 0 }, shunts: [] },
        ],
        input: { positiveRail: 5, negativeRail: 0, absMaxBeyondRail: 0.3 },
      }),
    ).toThrow(/duplicate element id "X"/);
    expect(() =>
      parseGuard({
        stages: [],
        input: { positiveRail: 5, negativeRail: 0, absMaxBeyondRail: 0.3, colour: 'red' },
      }),
    ).toThrow(/colour/);
  });
});
