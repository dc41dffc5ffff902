import { isTargetClass } from './hazard';
import { bridgePairs, neighbourHazards } from './map';
import { buildStripLayout } from './strip-layout';
import type { TerminalSnapshot } from './types';

export interface StripPair {
  targetId: string;
  hazardId: string;
}

/**
 * The exposures on one strip that depend on the order of its terminals — neighbour and bridge
 * — by the very rules of the full mapping (same functions), as target/hazard pairs, one per
 * route. Used by re-sequencing to count before and after.
 */
export function stripOrderExposures(terminals: readonly TerminalSnapshot[]): StripPair[] {
  if (terminals.length === 0) return [];
  const layout = buildStripLayout(terminals);
  const out: StripPair[] = [];
  for (const t of layout.ordered) {
    if (!isTargetClass(t)) continue;
    neighbourHazards(
      t,
      layout,
      (target, hazard) => out.push({ targetId: target.id, hazardId: hazard.id }),
      '',
    );
  }
  for (const p of bridgePairs(layout, ''))
    out.push({ targetId: p.target.id, hazardId: p.hazard.id });
  return out;
}
