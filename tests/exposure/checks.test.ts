import { describe, expect, it } from 'vitest';
import {
  checkSegregation,
  checkWireColours,
  parseWireColour,
  type StripSnapshot,
} from '@/lib/exposure';
import { dcSupply, input, mainsLine, term } from './fixtures';

const strips: StripSnapshot[] = [{ id: 'X1', cabinetId: 'C1', tag: 'X1' }];

describe('segregation check', () => {
  // IEC 60204-1 13.1.3 (memory) and NEC 300.3(C)(1) (memory): circuits of different voltage may share
  // only when insulated for the highest voltage or separated by a barrier; on a strip the
  // practice is voltage groups with a partition plate between them (common practice).
  it('mains next to 24 V inputs with no barrier is one finding, with its clause', () => {
    const found = checkSegregation(strips, [
      mainsLine('L1', 1),
      mainsLine('N1', 2, { hazardKind: 'mains-neutral' }),
      input('AI1', 3),
      dcSupply('P', 4),
    ]);
    expect(found).toHaveLength(1);
    expect(found[0]!.terminalIds).toEqual(['N1', 'AI1']);
    expect(found[0]!.clause).toMatch(/IEC 60204-1 13\.1\.3 \(memory\)/);
    expect(found[0]!.clause).toMatch(/NEC 300\.3\(C\)\(1\)/);
    expect(found[0]!.key).toBe('segregation|X1|X1:2|X1:3');
  });

  it('a barrier between the groups satisfies it; an earth terminal alone does not', () => {
    expect(
      checkSegregation(strips, [
        mainsLine('L1', 1),
        term({ id: 'B', position: 2, circuitClass: 'barrier' }),
        input('AI1', 3),
      ]),
    ).toEqual([]);
    expect(
      checkSegregation(strips, [
        mainsLine('L1', 1),
        term({ id: 'PE', position: 2, circuitClass: 'earth' }),
        input('AI1', 3),
      ]),
    ).toHaveLength(1);
  });

  it('ELV band limits: 48 V AC and 110 V DC are ELV, 120 V AC is not (IEC 60449 band I: memory)', () => {
    const elvAc = term({
      id: 'A',
      position: 1,
      circuitClass: 'hazard',
      hazardKind: 'other',
      nominalVoltage: 48,
      currentKind: 'ac',
    });
    const elvDc = term({
      id: 'D',
      position: 2,
      circuitClass: 'hazard',
      hazardKind: 'dc-supply',
      nominalVoltage: 110,
      currentKind: 'dc',
    });
    expect(checkSegregation(strips, [elvAc, elvDc, input('AI', 3)])).toEqual([]);
    const lvAc = term({
      id: 'H',
      position: 1,
      circuitClass: 'hazard',
      hazardKind: 'mains-line',
      nominalVoltage: 120,
      currentKind: 'ac',
    });
    expect(checkSegregation(strips, [lvAc, input('AI', 2)])).toHaveLength(1);
  });

  it('every interleaving is reported, not only the first', () => {
    expect(
      checkSegregation(strips, [
        mainsLine('L1', 1),
        input('A', 2),
        mainsLine('L2', 3),
        input('B', 4),
      ]),
    ).toHaveLength(3);
  });
});

describe('wire-colour check', () => {
  it('parses words, IEC 60757 letter codes (memory) and striped colours', () => {
    expect(parseWireColour('GNYE')).toBe('green-yellow');
    expect(parseWireColour('gn/ye')).toBe('green-yellow');
    expect(parseWireColour('Green-Yellow')).toBe('green-yellow');
    expect(parseWireColour('light blue')).toBe('light-blue');
    expect(parseWireColour('WH/BU')).toBe('white-blue');
    expect(parseWireColour('BK')).toBe('black');
    expect(parseWireColour('tartan')).toBeNull();
  });

  it('IEC 60204-1 13.2.2: protective conductor green-and-yellow, and that colour nowhere else', () => {
    const found = checkWireColours(
      strips,
      [
        term({ id: 'PE', position: 1, circuitClass: 'earth', wireColour: 'BK' }),
        input('AI', 2, { wireColour: 'GNYE' }),
        term({ id: 'PE2', position: 3, circuitClass: 'earth', wireColour: 'GNYE' }),
      ],
      'iec60204-1',
    );
    expect(found.map((f) => [f.terminalIds[0], f.clause, f.severity])).toEqual([
      ['AI', 'IEC 60204-1 13.2.2', 'violation'],
      ['PE', 'IEC 60204-1 13.2.2', 'violation'],
    ]);
  });

  it('IEC 60204-1 13.2.3: neutral light blue (blue accepted), brown is flagged', () => {
    const ok = mainsLine('N1', 1, { hazardKind: 'mains-neutral', wireColour: 'light blue' });
    const bad = mainsLine('N2', 2, { hazardKind: 'mains-neutral', wireColour: 'BN' });
    const found = checkWireColours(strips, [ok, bad], 'iec60204-1');
    expect(found).toHaveLength(1);
    expect(found[0]!.clause).toMatch(/^IEC 60204-1 13\.2\.3/);
  });

  it('IEC 60204-1 13.2.4 (recommended): black power, red AC control, blue DC control', () => {
    const found = checkWireColours(
      strips,
      [
        mainsLine('L1', 1, { wireColour: 'RD' }),
        mainsLine('M1', 2, { hazardKind: 'motor-output', wireColour: 'BK' }),
        input('DI1', 3, { wireColour: 'BU' }),
        input('DI2', 4, { wireColour: 'RD' }),
        input('DI3', 5, { currentKind: 'ac', wireColour: 'RD' }),
        dcSupply('P', 6, { wireColour: 'BU' }),
      ],
      'iec60204-1',
    );
    expect(found.map((f) => f.terminalIds[0])).toEqual(['DI2', 'L1']);
    expect(
      found.every(
        (f) => f.clause === 'IEC 60204-1 13.2.4 (recommended)' && f.severity === 'advisory',
      ),
    ).toBe(true);
  });

  it('NFPA 79: white/grey grounded AC, white-with-blue DC return, green only for ground', () => {
    const found = checkWireColours(
      strips,
      [
        mainsLine('N1', 1, { hazardKind: 'mains-neutral', wireColour: 'WH' }),
        term({
          id: 'COM',
          position: 2,
          circuitClass: 'return',
          currentKind: 'dc',
          wireColour: 'WH/BU',
        }),
        mainsLine('L1', 3, { wireColour: 'GN' }),
        term({ id: 'PE', position: 4, circuitClass: 'earth', wireColour: 'GN' }),
        mainsLine('N2', 5, { hazardKind: 'mains-neutral', wireColour: 'BU' }),
      ],
      'nfpa79',
    );
    expect(found.map((f) => f.terminalIds[0])).toEqual(['L1', 'N2']);
    expect(found[0]!.message).toMatch(/reserved/);
    expect(found.every((f) => f.clause.startsWith('NFPA 79'))).toBe(true);
  });

  it('convention "none" checks nothing; unknown colours are named', () => {
    expect(checkWireColours(strips, [mainsLine('L1', 1, { wireColour: 'GN' })], 'none')).toEqual(
      [],
    );
    const found = checkWireColours(
      strips,
      [mainsLine('L1', 1, { wireColour: 'tartan' })],
      'iec60204-1',
    );
    expect(found[0]!.message).toMatch(/"tartan"/);
  });
});
