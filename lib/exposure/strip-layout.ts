import type { TerminalSnapshot } from './types';

/** One strip's terminals indexed by position, with its barriers, for O(1) neighbour look-ups. */
export interface StripLayout {
  byPosition: Map<number, TerminalSnapshot[]>;
  /** Positions of barrier terminals, ascending. */
  barrierPositions: number[];
  /** Terminals sorted by position then level then id. */
  ordered: TerminalSnapshot[];
}

export function compareOnStrip(a: TerminalSnapshot, b: TerminalSnapshot): number {
  return (
    a.position - b.position ||
    (a.level ?? 0) - (b.level ?? 0) ||
    (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)
  );
}

export function buildStripLayout(terminals: readonly TerminalSnapshot[]): StripLayout {
  const byPosition = new Map<number, TerminalSnapshot[]>();
  const barrierPositions: number[] = [];
  for (const t of terminals) {
    const at = byPosition.get(t.position);
    if (at) at.push(t);
    else byPosition.set(t.position, [t]);
    if (t.circuitClass === 'barrier') barrierPositions.push(t.position);
  }
  barrierPositions.sort((a, b) => a - b);
  const ordered = [...terminals].sort(compareOnStrip);
  return { byPosition, barrierPositions, ordered };
}

/** Index of the first element ≥ value in an ascending array. */
export function lowerBound(sorted: readonly number[], value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Index of the first element > value in an ascending array. */
export function upperBound(sorted: readonly number[], value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! <= value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** True when a barrier stands strictly between positions a and b. */
export function barrierBetween(layout: StripLayout, a: number, b: number): boolean {
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const first = layout.barrierPositions[upperBound(layout.barrierPositions, lo)];
  return first !== undefined && first > lo && first < hi;
}
