import { describe, expect, it } from 'vitest';
import { rotatedReading, similarWireNumbers, wireNumberLikeness } from '@/lib/exposure';

// Our own look-alike definition (lib/exposure/lookalike.ts; common practice, no source).
describe('look-alike wire numbers', () => {
  it('identical after trimming and case folding is "same"', () => {
    expect(wireNumberLikeness('w-101', ' W-101 ')).toBe('same');
  });

  it('one commonly misread character is "similar" (1/7, 3/8, 0/O)', () => {
    expect(wireNumberLikeness('117', '717')).toBe('similar');
    expect(wireNumberLikeness('2038', '2088')).toBe('similar');
    expect(wireNumberLikeness('K10', 'K1O')).toBe('similar');
  });

  it('one adjacent transposition is "similar"; two are not', () => {
    expect(wireNumberLikeness('1041', '1014')).toBe('similar');
    expect(wireNumberLikeness('1234', '2143')).toBeNull();
  });

  it('a sleeve read upside down is "similar": reversed with 6↔9', () => {
    expect(rotatedReading('1069')).toBe('6901');
    expect(wireNumberLikeness('1069', '6901')).toBe('similar');
    expect(rotatedReading('1234')).toBeNull();
  });

  it('sequential numbers are not look-alikes', () => {
    expect(wireNumberLikeness('101', '102')).toBeNull();
    expect(wireNumberLikeness('101', '1010')).toBeNull();
  });

  it('is symmetric on a sample of numbers', () => {
    for (const a of ['1041', '6981', 'K17', '880', '5S5']) {
      for (const b of similarWireNumbers(a)) expect(similarWireNumbers(b)).toContain(a);
    }
  });

  it('single characters and missing numbers never match', () => {
    expect(similarWireNumbers('1')).toEqual([]);
    expect(wireNumberLikeness(null, '1')).toBeNull();
    expect(wireNumberLikeness('', '')).toBeNull();
  });
});
