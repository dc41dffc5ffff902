import { describe, expect, it } from 'vitest';
import { AuditInputError, assertAuditable, snapshotProblems } from '@/lib/audit';
import { kestrelSnapshot } from './fixtures';

describe('audit input validation', () => {
  it('accepts the fixture project', () => {
    expect(snapshotProblems(kestrelSnapshot())).toEqual({});
  });

  it('names each bad field and why', () => {
    const s = kestrelSnapshot();
    s.settings.supplyTolerance = 2;
    s.channels[0]!.signalTerminalId = 'nope';
    s.channels[1]!.tag = 'AI-101';
    s.terminals[0]!.position = 1.5;
    s.channels[0]!.guardOverrides = { elements: { R9: { resistance: 1 } } };
    const p = snapshotProblems(s);
    expect(p['settings.supplyTolerance']).toEqual(['must be a fraction from 0 to 0.5']);
    expect(p['channels[AI-101].signalTerminalId']).toEqual(['no terminal "nope"']);
    expect(p['channels[AI-101].tag']).toEqual(['tag is used by another channel']);
    expect(p['terminals[t4].position']).toEqual(['must be a whole number']);
    expect(p['channels[AI-101].guardOverrides']![0]).toMatch(/no element "R9"/);
  });

  it('an override of a figure with the wrong type is refused', () => {
    const s = kestrelSnapshot();
    s.channels[0]!.guardOverrides = { elements: { R1: { resistance: Number.NaN } } };
    expect(() => assertAuditable(s)).toThrow(AuditInputError);
    try {
      assertAuditable(s);
    } catch (e) {
      expect((e as AuditInputError).fieldErrors['channels[AI-101].guardOverrides']![0]).toMatch(
        /resistance/,
      );
    }
  });
});
