/**
 * Facts of the trade (common practice, no source) and the worked example they make up.
 */
import { describe, expect, it } from 'vitest';
import { mainsCase, solveStress } from '@/lib/stress';
import { CONDITIONS, NETWORKS } from './networks';

describe('trade facts (common practice, no source)', () => {
  const result = solveStress(NETWORKS.zener10k, mainsCase(120, 0, 60), CONDITIONS);
  const r1 = result.elements.find((e) => e.elementId === 'R1')!;
  const d1 = result.elements.find((e) => e.elementId === 'D1')!;

  it('a 120 V rms supply peaks near 170 V', () => {
    expect(120 * Math.SQRT2).toBeGreaterThan(169);
    expect(120 * Math.SQRT2).toBeLessThan(171);
    // the 10 kΩ resistor sees the peak less the clamp: the source side reaches 169.7 V
    expect(r1.peakVoltage + d1.peakVoltage).toBeGreaterThan(169);
    expect(r1.peakVoltage + d1.peakVoltage).toBeLessThan(171);
  });
  it('170 V into 10 kΩ held at about 13.2 V', () => {
    expect(d1.peakVoltage).toBeGreaterThan(13.2 * 0.95);
    expect(d1.peakVoltage).toBeLessThan(13.2 * 1.05);
  });
  it('draws about 16 mA', () => {
    expect(result.sourcePeakCurrent).toBeGreaterThan(0.016 * 0.95);
    expect(result.sourcePeakCurrent).toBeLessThan(0.016 * 1.05);
  });
  it('about 2.5 W peak in the resistors', () => {
    expect(r1.peakPower!).toBeGreaterThan(2.5 * 0.95);
    expect(r1.peakPower!).toBeLessThan(2.5 * 1.05);
  });
  it('about 0.2 W (peak) in a 12 V zener', () => {
    expect(d1.peakPower!).toBeGreaterThan(0.2 * 0.9);
    expect(d1.peakPower!).toBeLessThan(0.2 * 1.1);
  });
  it('the reason names the resistor and its figures, and a 0.25 W part fails', () => {
    expect(result.verdict).toBe('fails');
    expect(result.reason).toMatch(/^R1: 2\.46 W peak \/ 1\.18 W average against 125 mW derated/);
  });
});
