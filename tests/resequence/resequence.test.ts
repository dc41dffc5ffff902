import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { stripOrderExposures } from '@/lib/exposure/strip-count';
import type { CircuitClass, TerminalSnapshot } from '@/lib/exposure';
import { proposeResequence } from '@/lib/remedies/resequence';

// The exposure rules are the mapping's own (lib/exposure); the separator cost and the
// "moved terminal" measure are our own definitions (lib/remedies/resequence.ts).

function t(
  id: string,
  position: number,
  circuitClass: CircuitClass,
  extra: Partial<TerminalSnapshot> = {},
): TerminalSnapshot {
  const hazard =
    circuitClass === 'hazard'
      ? { hazardKind: 'mains-line' as const, nominalVoltage: 230, currentKind: 'ac' as const }
      : {};
  return { id, stripId: 'X1', position, label: `X1:${id}`, circuitClass, ...hazard, ...extra };
}

/** The proposal laid out as terminals, to recount with the mapping's rules. */
function laidOut(
  terminals: TerminalSnapshot[],
  p: ReturnType<typeof proposeResequence>,
): TerminalSnapshot[] {
  const byId = new Map(terminals.map((x) => [x.id, x]));
  return p.order.map((s, i) =>
    s.kind === 'terminal'
      ? { ...byId.get(s.terminalId)!, position: s.position }
      : {
          id: `new${i}`,
          stripId: 'X1',
          position: s.position,
          label: `new${i}`,
          circuitClass: s.kind,
        },
  );
}

describe('re-sequencing a strip', () => {
  it('leaves a strip with no order-caused exposure alone', () => {
    const strip = [
      t('a', 1, 'sensitive'),
      t('b', 2, 'sensitive'),
      t('x', 3, 'barrier'),
      t('L', 4, 'hazard'),
    ];
    const p = proposeResequence(strip);
    expect(p.changed).toBe(false);
    expect(p.before.exposures).toBe(0);
    expect(p.moves).toEqual([]);
  });

  it('a lone mains terminal among inputs is moved to the end behind one barrier, not fenced with two', () => {
    // I1 I2 L I3 I4 I5: fencing L in place needs two plates (cost 4); moving L to the end and
    // one plate costs 3.
    const strip = [
      t('I1', 1, 'sensitive'),
      t('I2', 2, 'sensitive'),
      t('L', 3, 'hazard'),
      t('I3', 4, 'sensitive'),
      t('I4', 5, 'sensitive'),
      t('I5', 6, 'sensitive'),
    ];
    const p = proposeResequence(strip);
    expect(p.before.exposures).toBe(5); // I1 d2, I2 d1, I3 d1, I4 d2, I5 d3
    expect(p.after.exposures).toBe(0);
    expect(p.moves.map((m) => m.terminalId)).toEqual(['L']);
    expect(p.addedSeparators).toHaveLength(1);
    expect(p.order.map((s) => (s.kind === 'terminal' ? s.terminalId : s.kind))).toEqual([
      'I1',
      'I2',
      'I3',
      'I4',
      'I5',
      'barrier',
      'L',
    ]);
    expect(stripOrderExposures(laidOut(strip, p))).toHaveLength(0);
  });

  it('two groups that only touch get a single barrier and no move', () => {
    const strip = [
      t('I1', 1, 'sensitive'),
      t('I2', 2, 'sensitive'),
      t('L1', 3, 'hazard'),
      t('L2', 4, 'hazard'),
    ];
    const p = proposeResequence(strip);
    expect(p.after.exposures).toBe(0);
    expect(p.moves).toEqual([]);
    expect(p.addedSeparators).toEqual([{ kind: 'barrier', position: 3 }]);
    expect(p.renumbered.map((m) => [m.terminalId, m.from, m.to])).toEqual([
      ['L1', 3, 4],
      ['L2', 4, 5],
    ]);
  });

  it('with spares instead of barriers, three spare positions put the groups out of reach', () => {
    const strip = [t('I1', 1, 'sensitive'), t('L1', 2, 'hazard')];
    const p = proposeResequence(strip, { separator: 'spare' });
    expect(p.after.exposures).toBe(0);
    expect(p.order.map((s) => s.kind)).toEqual(['terminal', 'spare', 'spare', 'spare', 'terminal']);
  });

  it('keeps a multi-level block and a bridge group together as one unit', () => {
    const strip = [
      t('I1', 1, 'sensitive'),
      t('Ka', 2, 'hazard', { blockId: 'K2', level: 1 }),
      t('Kb', 2, 'spare', { blockId: 'K2', level: 2 }),
      t('I2', 3, 'sensitive'),
      t('Ja', 4, 'hazard', { bridgeGroup: 'J1' }),
      t('Jb', 5, 'hazard', { bridgeGroup: 'J1' }),
      t('I3', 6, 'sensitive'),
    ];
    const p = proposeResequence(strip);
    expect(p.after.exposures).toBe(0);
    const pos = new Map(
      p.order.flatMap((s) => (s.kind === 'terminal' ? [[s.terminalId, s.position] as const] : [])),
    );
    expect(pos.get('Ka')).toBe(pos.get('Kb'));
    expect(pos.get('Jb')! - pos.get('Ja')!).toBe(1);
  });

  it('exposures inside a unit remain and are reported honestly', () => {
    // A jumper joining a mains terminal to an input: the pair moves as one unit, so its
    // neighbour and member exposures stay; the other input's (distance 2 and comb end) go.
    const strip = [
      t('Ja', 1, 'hazard', { bridgeGroup: 'J' }),
      t('Jb', 2, 'sensitive', { bridgeGroup: 'J' }),
      t('I', 3, 'sensitive'),
    ];
    const p = proposeResequence(strip);
    expect(p.before.exposures).toBe(4); // Jb: adjacent + member; I: near (d2) + comb end
    expect(p.after.exposures).toBe(2); // Jb: adjacent + member, inside the unit
    expect(p.note).toMatch(/inside blocks or bridge groups/);
  });

  it('is deterministic', () => {
    const strip = [
      t('L1', 1, 'hazard'),
      t('I1', 2, 'sensitive'),
      t('L2', 3, 'hazard'),
      t('I2', 4, 'return'),
      t('L3', 5, 'hazard'),
      t('I3', 6, 'sensitive'),
    ];
    expect(proposeResequence(strip)).toEqual(proposeResequence([...strip].reverse()));
  });

  it('refuses terminals of several strips, naming one', () => {
    expect(() =>
      proposeResequence([t('a', 1, 'sensitive'), { ...t('b', 2, 'hazard'), stripId: 'X9' }]),
    ).toThrow(/X1:b is on strip X9/);
  });
});

const classArb = fc.constantFrom<CircuitClass>(
  'hazard',
  'sensitive',
  'return',
  'spare',
  'earth',
  'barrier',
);

/** Random strips: classes, some multi-level blocks and bridge groups. */
const stripArb = fc
  .array(
    fc.record({
      cls: classArb,
      levels: fc.constantFrom(1, 1, 1, 2),
      bridge: fc.constantFrom(null, null, null, 'J1', 'J2'),
    }),
    { minLength: 1, maxLength: 14 },
  )
  .map((rows) => {
    const out: TerminalSnapshot[] = [];
    rows.forEach((r, i) => {
      for (let lv = 1; lv <= r.levels; lv++) {
        const id = `t${i}-${lv}`;
        const cls = lv === 1 ? r.cls : r.cls === 'barrier' ? 'spare' : r.cls;
        out.push(
          t(id, i + 1, cls, {
            level: r.levels > 1 ? lv : null,
            blockId: r.levels > 1 ? `K${i}` : null,
            bridgeGroup: lv === 1 && cls !== 'barrier' ? r.bridge : null,
          }),
        );
      }
    });
    return out;
  });

describe('re-sequencing properties (fast-check)', () => {
  it('never increases the exposures, and the reported counts are the recount', () => {
    fc.assert(
      fc.property(
        stripArb,
        fc.constantFrom<'barrier' | 'spare'>('barrier', 'spare'),
        (strip, separator) => {
          const p = proposeResequence(strip, { separator });
          expect(p.before.exposures).toBe(stripOrderExposures(strip).length);
          expect(p.after.exposures).toBeLessThanOrEqual(p.before.exposures);
          expect(stripOrderExposures(laidOut(strip, p))).toHaveLength(p.after.exposures);
          // Every terminal appears exactly once.
          expect(
            p.order
              .filter((s) => s.kind === 'terminal')
              .map((s) => (s as { terminalId: string }).terminalId)
              .sort(),
          ).toEqual(strip.map((x) => x.id).sort());
        },
      ),
      { numRuns: 300, seed: 20261201 },
    );
  });

  it('finds a zero-exposure order whenever blocks and bridge groups do not mix hazards and inputs', () => {
    // Without mixed units a zero-exposure order with barriers always exists (put a barrier
    // between every hazard unit and input unit), so the proposal must reach zero.
    const clean = stripArb.filter((strip) => {
      const unitHas = new Map<string, Set<string>>();
      for (const x of strip) {
        for (const k of [x.blockId, x.bridgeGroup, `p${x.position}`]) {
          if (!k) continue;
          const s = unitHas.get(k) ?? new Set<string>();
          s.add(
            x.circuitClass === 'hazard'
              ? 'h'
              : x.circuitClass === 'sensitive' || x.circuitClass === 'return'
                ? 'i'
                : 'n',
          );
          unitHas.set(k, s);
        }
      }
      return [...unitHas.values()].every((s) => !(s.has('h') && s.has('i')));
    });
    fc.assert(
      fc.property(clean, (strip) => {
        const p = proposeResequence(strip);
        expect(p.after.exposures).toBe(0);
      }),
      { numRuns: 300, seed: 7 },
    );
  });
});
