import { describe, expect, it } from 'vitest';
import { mapExposures, type Exposure } from '@/lib/exposure';
import { dcSupply, input, mainsLine, term, wiring } from './fixtures';

// The likelihood classes and their default weights are our own (common practice, no source);
// these tests check that each wiring situation maps to the mechanism a practitioner would name.

function exposuresOf(map: ReturnType<typeof mapExposures>, terminalId: string): Exposure[] {
  const t = map.targets.find((x) => x.terminalId === terminalId);
  if (!t) throw new Error(`no target ${terminalId}`);
  return t.exposures;
}

const brief = (e: Exposure) => `${e.hazardTerminalId}:${e.route}:${e.likelihood}`;

describe('neighbour mechanism', () => {
  it('finds hazards at distance 1 (likely) and 2–3 (plausible), none at 4', () => {
    const map = mapExposures(
      wiring([
        mainsLine('L1', 1),
        input('AI1', 2),
        dcSupply('P24', 4),
        dcSupply('P24b', 5),
        mainsLine('L2', 6),
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual([
      'L1:adjacent:likely',
      'P24:near:plausible',
      'P24b:near:plausible',
    ]);
    expect(exposuresOf(map, 'AI1')[0]!.distance).toBe(1);
  });

  it('a barrier between the input and the hazard breaks the exposure, on that side only', () => {
    const map = mapExposures(
      wiring([
        mainsLine('L1', 1),
        input('AI1', 2),
        term({ id: 'B', position: 3, circuitClass: 'barrier' }),
        mainsLine('L2', 4),
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual(['L1:adjacent:likely']);
  });

  it('spares and earth terminals between do not break the exposure, they only add distance', () => {
    const map = mapExposures(
      wiring([
        mainsLine('L1', 1),
        term({ id: 'S', position: 2, circuitClass: 'spare' }),
        term({ id: 'PE', position: 3, circuitClass: 'earth' }),
        input('AI1', 4),
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual(['L1:near:plausible']);
  });

  it('a neighbour on another level of the next block is one class less likely', () => {
    const map = mapExposures(
      wiring([
        input('AI1', 2, { level: 1, blockId: 'K2' }),
        mainsLine('L1', 3, { level: 2, blockId: 'K3' }),
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual(['L1:adjacent:plausible']);
  });

  it('neighbours on another strip are not neighbours', () => {
    const map = mapExposures(
      wiring([input('AI1', 2), mainsLine('L1', 3, { stripId: 'X2', label: 'X2:3' })]),
    );
    expect(exposuresOf(map, 'AI1')).toEqual([]);
  });
});

describe('stacked mechanism', () => {
  it('another level of the same multi-level block is likely', () => {
    const map = mapExposures(
      wiring([
        input('AI1', 5, { level: 1, blockId: 'K5' }),
        mainsLine('L1', 5, { level: 2, blockId: 'K5' }),
        dcSupply('P', 5, { level: 3, blockId: 'K5' }),
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual([
      'L1:other-level:likely',
      'P:other-level:likely',
    ]);
    expect(exposuresOf(map, 'AI1')[0]!.mechanism).toBe('stacked');
  });

  it('without block ids, levels at the same position are the same block', () => {
    const map = mapExposures(
      wiring([input('AI1', 5, { level: 1 }), mainsLine('L1', 5, { level: 2 })]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual(['L1:other-level:likely']);
  });
});

describe('cable mechanism', () => {
  it('another core of the same multicore cable, even at the far end in another cabinet', () => {
    const map = mapExposures(
      wiring([
        input('AI1', 1, { cableId: 'W-114', cableCore: '1' }),
        mainsLine('L1', 40, { stripId: 'X5', label: 'X5:40', cableId: 'W-114', cableCore: '3' }),
        mainsLine('L2', 41, { stripId: 'X5', label: 'X5:41', cableId: 'W-115', cableCore: '3' }),
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual(['L1:cable-core:plausible']);
  });

  it('another pin of the same connector in the same cabinet', () => {
    const map = mapExposures(
      wiring([
        input('AI1', 1, { connector: 'XS3' }),
        dcSupply('P', 20, { connector: 'XS3' }),
        dcSupply('Q', 3, { stripId: 'X5', connector: 'XS3' }),
      ]),
    );
    // Q is in the other cabinet: a connector called XS3 there is a different connector.
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual(['P:connector-pin:plausible']);
  });
});

describe('look-alike mechanism', () => {
  it('the same terminal number on another strip of the same cabinet, not of another cabinet', () => {
    const map = mapExposures(
      wiring([
        input('AI1', 14, { stripId: 'X3', label: 'X3:14' }),
        mainsLine('L1', 14, { stripId: 'X4', label: 'X4:14' }),
        mainsLine('L2', 14, { stripId: 'X5', label: 'X5:14' }),
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual(['L1:terminal-number:plausible']);
  });

  it('identical and misreadable wire numbers in the same cabinet', () => {
    const map = mapExposures(
      wiring([
        input('AI1', 1, { stripId: 'X3', wireNumber: '1041' }),
        mainsLine('SWAP', 7, { stripId: 'X4', wireNumber: '1014' }), // adjacent transposition
        mainsLine('SAME', 8, { stripId: 'X4', wireNumber: ' 1041 ' }), // same after trimming
        mainsLine('NEXT', 9, { stripId: 'X4', wireNumber: '1042' }), // 1/2 are not misread
        mainsLine('FAR', 9, { stripId: 'X5', wireNumber: '1014' }), // other cabinet
      ]),
    );
    expect(exposuresOf(map, 'AI1').map(brief)).toEqual([
      'SAME:wire-number-same:likely',
      'SWAP:wire-number-similar:remote',
    ]);
  });
});

describe('bridge mechanism', () => {
  it('a jumper joining a hazard to an input, a comb passing over an input, and a comb end', () => {
    const map = mapExposures(
      wiring([
        dcSupply('P1', 1, { bridgeGroup: 'J1' }),
        input('UNDER', 2),
        dcSupply('P3', 3, { bridgeGroup: 'J1' }),
        input('MEMBER', 4, { bridgeGroup: 'J1' }),
        input('END', 5),
      ]),
    );
    expect(exposuresOf(map, 'MEMBER').map(brief)).toContain('P1:bridge-member:likely');
    expect(exposuresOf(map, 'UNDER').map(brief)).toContain('P1:bridge-span:plausible');
    expect(exposuresOf(map, 'END').map(brief)).toContain('P1:bridge-end:plausible');
  });

  it('an input common comb shifted onto a supply exposes every input of the comb; a barrier stops it', () => {
    const map = mapExposures(
      wiring([
        term({ id: 'R1', position: 1, circuitClass: 'return', bridgeGroup: 'COM' }),
        term({ id: 'R2', position: 2, circuitClass: 'return', bridgeGroup: 'COM' }),
        dcSupply('P', 3),
        term({ id: 'BR', position: 4, circuitClass: 'barrier' }),
        term({ id: 'R3', position: 6, circuitClass: 'return', bridgeGroup: 'COM2' }),
        dcSupply('Q', 5),
      ]),
    );
    const bridgeOnly = (id: string) =>
      exposuresOf(map, id)
        .filter((e) => e.mechanism === 'bridge')
        .map(brief);
    expect(bridgeOnly('R1')).toEqual(['P:bridge-end:plausible']);
    expect(bridgeOnly('R2')).toEqual(['P:bridge-end:plausible']);
    // COM2 is a one-terminal comb at 6: Q at 5 is its end; the barrier at 4 is not between them.
    expect(bridgeOnly('R3')).toEqual(['Q:bridge-end:plausible']);

    const blocked = mapExposures(
      wiring([
        term({ id: 'R1', position: 1, circuitClass: 'return', bridgeGroup: 'COM' }),
        term({ id: 'B', position: 2, circuitClass: 'barrier' }),
        dcSupply('P', 3),
      ]),
    );
    expect(exposuresOf(blocked, 'R1')).toEqual([]);
  });
});

describe('targets and ranking', () => {
  it('a 230 V line terminal beside a 4–20 mA input outranks a 24 V supply two positions away', () => {
    // The practitioner's pick: the mains conductor is one slip of the screwdriver away and
    // would put 325 V peak on a loop input; the 24 V supply is farther and far less severe.
    const map = mapExposures(wiring([dcSupply('P24', 1), mainsLine('L1', 4), input('AI1', 3)]));
    const list = exposuresOf(map, 'AI1');
    expect(list.map((e) => e.hazardTerminalId)).toEqual(['L1', 'P24']);
  });

  it('at equal likelihood the higher-voltage hazard ranks first', () => {
    const map = mapExposures(wiring([dcSupply('P24', 1), input('AI1', 2), mainsLine('L1', 3)]));
    expect(exposuresOf(map, 'AI1').map((e) => e.hazardTerminalId)).toEqual(['L1', 'P24']);
  });

  it('maps every sensitive and return terminal and every terminal a channel uses, with its channels', () => {
    const map = mapExposures(
      wiring(
        [
          input('AI1', 1),
          input('AI2', 2),
          term({ id: 'COM', position: 3, circuitClass: 'return' }),
          term({ id: 'ODD', position: 4, circuitClass: 'spare' }),
          mainsLine('L1', 5),
        ],
        {
          channels: [
            { id: 'ch1', tag: 'FT-101', signalTerminalId: 'AI1', returnTerminalId: 'COM' },
            { id: 'ch2', tag: 'FT-102', signalTerminalId: 'AI2', returnTerminalId: 'COM' },
            { id: 'ch3', tag: 'XS-103', signalTerminalId: 'ODD' },
          ],
        },
      ),
    );
    expect(map.targets.map((t) => [t.terminalId, t.channelIds])).toEqual([
      ['AI1', ['ch1']],
      ['AI2', ['ch2']],
      ['COM', ['ch1', 'ch2']],
      ['ODD', ['ch3']],
    ]);
    // L1 at 5: ODD d=1, COM d=2, AI2 d=3; AI1 is 4 away and not exposed.
    expect(map.countsByMechanism.neighbour).toBe(3);
  });

  it('project weights change the weight of each class; bad weights are refused by name', () => {
    const map = mapExposures(wiring([mainsLine('L1', 1), input('AI1', 3)]), {
      weights: { plausible: 0.5 },
    });
    expect(exposuresOf(map, 'AI1')[0]!.weight).toBe(0.5);
    expect(() => mapExposures(wiring([]), { weights: { likely: -1 } })).toThrow(
      /likelihood weight "likely"/,
    );
    expect(() => mapExposures(wiring([]), { weights: { remote: Number.NaN } })).toThrow(/"remote"/);
  });
});
