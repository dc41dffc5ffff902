import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { mapExposures, type CircuitClass, type TerminalSnapshot } from '@/lib/exposure';
import { wiring } from './fixtures';

// Same wiring in any row order → the same map (the database may return rows in any order,
// and the audit hash treats such snapshots as equal). Common practice, no source.
const rowArb = fc.record({
  cls: fc.constantFrom<CircuitClass>('hazard', 'sensitive', 'return', 'spare', 'barrier', 'earth'),
  strip: fc.constantFrom('X1', 'X2', 'X5'),
  position: fc.integer({ min: 1, max: 12 }),
  level: fc.constantFrom(1, 1, 2),
  wire: fc.constantFrom(null, '1041', '1014', '1069', '6901', '117'),
  cable: fc.constantFrom(null, null, 'W-1'),
  bridge: fc.constantFrom(null, null, 'J1', 'COM'),
});

describe('mapping determinism', () => {
  it('does not depend on the order of the terminal rows', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(rowArb, {
          minLength: 1,
          maxLength: 30,
          selector: (r) => `${r.strip}:${r.position}:${r.level}`,
        }),
        fc.integer(),
        (rows, seed) => {
          const terminals: TerminalSnapshot[] = rows.map((r, i) => ({
            id: `t${i}`,
            stripId: r.strip,
            position: r.position,
            level: r.level,
            label: `${r.strip}:${r.position}${r.level > 1 ? `.${r.level}` : ''}`,
            circuitClass: r.cls,
            wireNumber: r.wire,
            cableId: r.cable,
            bridgeGroup: r.bridge,
            ...(r.cls === 'hazard'
              ? { hazardKind: 'dc-supply' as const, nominalVoltage: 24, currentKind: 'dc' as const }
              : {}),
          }));
          const shuffled = [...terminals];
          let s = seed;
          for (let i = shuffled.length - 1; i > 0; i--) {
            s = (s * 1103515245 + 12345) | 0;
            const j = Math.abs(s) % (i + 1);
            [shuffled[i], shuffled[j]] = [shuffled[j]!, shuffled[i]!];
          }
          expect(mapExposures(wiring(shuffled))).toEqual(mapExposures(wiring(terminals)));
        },
      ),
      { numRuns: 200, seed: 42 },
    );
  });
});
