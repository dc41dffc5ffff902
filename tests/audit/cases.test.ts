import { describe, expect, it } from 'vitest';
import { hazardCase, transientCases } from '@/lib/audit';
import type { TerminalSnapshot } from '@/lib/exposure';
import { settings230 } from './fixtures';

const line = (v: number, extra: Partial<TerminalSnapshot> = {}): TerminalSnapshot => ({
  id: 'h',
  stripId: 's',
  position: 1,
  label: 'X1:1',
  circuitClass: 'hazard',
  hazardKind: 'mains-line',
  nominalVoltage: v,
  currentKind: 'ac',
  frequency: 50,
  ...extra,
});

function ok(r: ReturnType<typeof hazardCase>) {
  if (!r.ok) throw new Error(r.reason);
  return r.case;
}

describe('hazard → worst-case stress', () => {
  it('230 V mains at +10 % is 253 V rms line-to-earth (IEC 60038), 358 V peak', () => {
    const c = ok(hazardCase(line(230), settings230, 'signal'));
    expect(c.stress).toEqual({ kind: 'ac', rmsVoltage: 253, frequency: 50, sourceResistance: 0.1 });
    expect(c.basis).toMatch(/^IEC 60038: 230 V \+10 % → 253 V rms/);
    expect(c.peakVoltage).toBeCloseTo(357.8, 1); // REFERENCE.md: 253 V → 358 V peak
    expect(c.id).toBe('mains-line:line-earth');
  });

  it('120 V at +5 % is 126 V rms, ANSI C84.1 Range A; 480 V → 504 V tagged memory ⚠', () => {
    const us = {
      ...settings230,
      mainsSystem: '120/208V 60Hz',
      nominalVoltage: 120,
      frequency: 60,
      supplyTolerance: 0.05,
    };
    const c = ok(hazardCase(line(120, { frequency: 60 }), us, 'signal'));
    expect(c.stress).toMatchObject({ kind: 'ac', rmsVoltage: 126, frequency: 60 });
    expect(c.basis).toMatch(/^ANSI C84\.1 Range A: 120 V \+5 % → 126 V rms/);
    expect(c.peakVoltage).toBeCloseTo(178.2, 1); // REFERENCE.md: 126 V → 178 V peak
    const c480 = ok(
      hazardCase(
        line(277, { frequency: 60 }),
        { ...us, faultMode: 'line-line', mainsSystem: '277/480V 60Hz' },
        'signal',
      ),
    );
    // Line-to-line from the 277/480 system: 480 × 1.05 = 504 V (REFERENCE.md, memory ⚠).
    expect(c480.stress).toMatchObject({ rmsVoltage: 504 });
    expect(c480.peakVoltage).toBeCloseTo(712.8, 1); // REFERENCE.md: 504 V → 713 V peak
  });

  it('line-to-line per the fault mode: 230/400 V system gives 440 V (IEC 60038 400 V +10 %)', () => {
    const c = ok(hazardCase(line(230), { ...settings230, faultMode: 'line-line' }, 'signal'));
    expect(c.stress).toMatchObject({ rmsVoltage: 440 });
    expect(c.id).toBe('mains-line:line-line');
    expect(c.label).toMatch(/line-to-line/);
  });

  it('without a named system, line-to-line is √3 × line-to-earth', () => {
    const c = ok(
      hazardCase(
        line(230),
        { ...settings230, mainsSystem: null, faultMode: 'line-line' },
        'signal',
      ),
    );
    expect((c.stress as { rmsVoltage: number }).rmsVoltage).toBeCloseTo(
      230 * Math.sqrt(3) * 1.1,
      6,
    );
  });

  it('a neutral is taken at line potential and stays line-to-earth', () => {
    const c = ok(
      hazardCase(
        line(230, { hazardKind: 'mains-neutral' }),
        { ...settings230, faultMode: 'line-line' },
        'return',
      ),
    );
    expect(c.stress).toMatchObject({ rmsVoltage: 253 });
    expect(c.appliedTo).toBe('return');
    expect(c.basis).toMatch(/neutral taken at line potential/);
  });

  it('a mains terminal with no voltage uses the project nominal; other hazards without one cannot be judged', () => {
    expect(
      ok(hazardCase(line(230, { nominalVoltage: null }), settings230, 'signal')).stress,
    ).toMatchObject({ rmsVoltage: 253 });
    const r = hazardCase(
      line(0, { hazardKind: 'other', nominalVoltage: null }),
      settings230,
      'signal',
    );
    expect(r.ok).toBe(false);
  });

  it('24 V DC supply at its maximum: 28.8 V (IEC 61131-2 +20 %); 48 V scales to 57.6 V', () => {
    const dc = (v: number) =>
      line(v, {
        hazardKind: 'dc-supply',
        currentKind: 'dc',
        frequency: null,
        sourceImpedance: 0.05,
      });
    const c = ok(hazardCase(dc(24), settings230, 'signal'));
    expect(c.stress).toEqual({ kind: 'dc', voltage: 28.8, sourceResistance: 0.05 });
    expect(c.basis).toMatch(/^IEC 61131-2: 24 V DC \+20 % → 28\.8 V/);
    expect(ok(hazardCase(dc(48), settings230, 'signal')).stress).toMatchObject({ voltage: 57.6 });
  });
});

describe('project-wide transients', () => {
  it('surge at the level with the coupling resistance (IEC 61000-4-5: signal 40 Ω, line-earth 10 Ω, line-line 0)', () => {
    const signal = transientCases(settings230);
    expect(signal.map((c) => c.id)).toEqual(['surge+', 'surge-', 'esd+', 'esd-']);
    expect(signal[0]!.stress).toEqual({ kind: 'surge', peakVoltage: 1000, couplingResistance: 40 });
    expect(signal[1]!.stress).toEqual({
      kind: 'surge',
      peakVoltage: -1000,
      couplingResistance: 40,
    });
    expect(
      transientCases({ ...settings230, surgeCoupling: 'line-earth', surgeLevelKv: 2 })[0]!.stress,
    ).toEqual({ kind: 'surge', peakVoltage: 2000, couplingResistance: 10 });
    expect(transientCases({ ...settings230, surgeCoupling: 'line-line' })[0]!.stress).toMatchObject(
      { couplingResistance: 0 },
    );
  });

  it('ESD at the contact level (IEC 61000-4-2), positive only when asked', () => {
    const cases = transientCases({ ...settings230, transientPolarity: 'positive' });
    expect(cases.map((c) => c.id)).toEqual(['surge+', 'esd+']);
    expect(cases[1]!.stress).toEqual({ kind: 'esd', voltage: 4000 });
    expect(cases[1]!.basis).toMatch(/IEC 61000-4-2/);
  });
});
