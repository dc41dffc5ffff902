/**
 * Re-sequencing proposal for one terminal strip: a new order, with barrier (or spare)
 * positions, that removes the exposures the order causes (neighbour and bridge reach, counted
 * by the mapping's own rules) while moving as few terminals as possible.
 *
 * Units. Terminals that must stay together move as one unit: the levels of a multi-level block
 * (same block id, or same position), and the members of a bridge group (a jumper or comb).
 * A unit keeps its inner order; its positions close up (a comb is re-cut to fit).
 *
 * Cost. A terminal is "moved" when it is lifted and landed elsewhere in the order: the
 * terminals outside the heaviest common subsequence of the old and new unit orders. Sliding a
 * terminal along the rail to make room for a plate is not a move. Each added separator costs
 * `separatorCost` moved terminals (default 2: our own judgement, common practice, no source).
 *
 * Search (deterministic). For any order, the fewest separators that break every exposure
 * between different units is an interval-stabbing problem, solved exactly by the greedy
 * earliest-right-end rule. So every order can reach the minimum possible count (the
 * exposures inside units, which no order changes); the search minimises the cost over: the
 * original order; every "group by class" order (inputs on one side, hazards on the other,
 * neutral units left where they are relative to a cut); then single-unit relocations while
 * they lower the cost. The proposal is checked with the mapping's rules and falls back to the
 * original order if it would not lower the count.
 */
import { isHazard, isTargetClass } from '../exposure/hazard';
import { stripOrderExposures } from '../exposure/strip-count';
import type { TerminalSnapshot } from '../exposure/types';

export type Separator = 'barrier' | 'spare';

export interface ResequenceOptions {
  /** What to insert between groups: a barrier plate (one position) or three spare positions. */
  separator?: Separator;
  /** Cost of one added separator in moved terminals (default 2). */
  separatorCost?: number;
}

export type ProposedSlot =
  | {
      kind: 'terminal';
      position: number;
      terminalId: string;
      label: string;
      level: number | null;
      fromPosition: number;
    }
  | { kind: 'barrier' | 'spare'; position: number; added: true };

export interface ResequenceMove {
  terminalId: string;
  label: string;
  from: number;
  to: number;
}

export interface ResequenceProposal {
  stripId: string;
  changed: boolean;
  before: { exposures: number };
  after: { exposures: number };
  /** Terminals lifted and landed elsewhere in the order. */
  moves: ResequenceMove[];
  /** Every terminal whose position number changes (moved or slid along the rail). */
  renumbered: ResequenceMove[];
  addedSeparators: { kind: Separator; position: number }[];
  /** The proposed strip, position by position (levels of a block share a position). */
  order: ProposedSlot[];
  note: string;
}

/** Spare positions that make one spare separator: distance 4 is beyond neighbour reach (3). */
const SPARE_WIDTH = 3;

interface Unit {
  index: number;
  terminals: TerminalSnapshot[];
  /** Offset of each terminal's position inside the unit (gaps closed up). */
  offsets: Map<string, number>;
  width: number;
  weight: number;
  hasHazard: boolean;
  hasTarget: boolean;
}

function buildUnits(terminals: readonly TerminalSnapshot[]): Unit[] {
  const parent = new Map<string, string>();
  const find = (x: string): string => {
    let r = x;
    while (parent.get(r) !== r) r = parent.get(r)!;
    let y = x;
    while (parent.get(y) !== r) {
      const next = parent.get(y)!;
      parent.set(y, r);
      y = next;
    }
    return r;
  };
  const union = (a: string, b: string) => {
    const ra = find(a);
    const rb = find(b);
    if (ra !== rb) parent.set(ra < rb ? rb : ra, ra < rb ? ra : rb);
  };
  const firstBy = new Map<string, string>();
  for (const t of terminals) parent.set(t.id, t.id);
  for (const t of terminals) {
    const keys = [`p\u0000${t.position}`];
    if (t.blockId != null && t.blockId !== '') keys.push(`k\u0000${t.blockId}`);
    if (t.bridgeGroup != null && t.bridgeGroup !== '') keys.push(`b\u0000${t.bridgeGroup}`);
    for (const k of keys) {
      const first = firstBy.get(k);
      if (first === undefined) firstBy.set(k, t.id);
      else union(first, t.id);
    }
  }
  const groups = new Map<string, TerminalSnapshot[]>();
  for (const t of terminals) {
    const r = find(t.id);
    const list = groups.get(r);
    if (list) list.push(t);
    else groups.set(r, [t]);
  }
  const units = [...groups.values()].map((list) => {
    list.sort(
      (a, b) =>
        a.position - b.position || (a.level ?? 0) - (b.level ?? 0) || (a.id < b.id ? -1 : 1),
    );
    const positions = [...new Set(list.map((t) => t.position))].sort((a, b) => a - b);
    const rank = new Map(positions.map((p, i) => [p, i]));
    return {
      index: 0,
      terminals: list,
      offsets: new Map(list.map((t) => [t.id, rank.get(t.position)!])),
      width: positions.length,
      weight: list.length,
      hasHazard: list.some(isHazard),
      hasTarget: list.some(isTargetClass),
      firstPosition: positions[0]!,
      firstId: list[0]!.id,
    };
  });
  units.sort((a, b) => a.firstPosition - b.firstPosition || (a.firstId < b.firstId ? -1 : 1));
  units.forEach((u, i) => (u.index = i));
  return units;
}

function place(
  units: Unit[],
  order: readonly number[],
  cuts: ReadonlySet<number>,
  start: number,
  separator: Separator,
) {
  const placed: TerminalSnapshot[] = [];
  /** placed plus the added separators as terminals, for recounting. */
  const strip: TerminalSnapshot[] = [];
  const slots: ProposedSlot[] = [];
  const stripId = units[0]?.terminals[0]?.stripId ?? '';
  const itemOf = new Map<string, number>();
  let pos = start;
  order.forEach((u, item) => {
    const unit = units[u]!;
    for (const t of unit.terminals) {
      const position = pos + unit.offsets.get(t.id)!;
      const moved = { ...t, position };
      placed.push(moved);
      strip.push(moved);
      itemOf.set(t.id, item);
      slots.push({
        kind: 'terminal',
        position,
        terminalId: t.id,
        label: t.label,
        level: t.level ?? null,
        fromPosition: t.position,
      });
    }
    pos += unit.width;
    if (cuts.has(item)) {
      if (separator === 'barrier') {
        slots.push({ kind: 'barrier', position: pos, added: true });
        strip.push({
          id: `\u0000added-${pos}`,
          stripId,
          position: pos,
          label: 'added barrier',
          circuitClass: 'barrier',
        });
        pos += 1;
      } else {
        for (let k = 0; k < SPARE_WIDTH; k++)
          slots.push({ kind: 'spare', position: pos + k, added: true });
        pos += SPARE_WIDTH;
      }
    }
  });
  return { placed, strip, slots, itemOf };
}

/** Fewest gaps that separate every exposed pair of different items (greedy stabbing, exact). */
function stab(units: Unit[], order: readonly number[], start: number): number[] {
  const { placed, itemOf } = place(units, order, new Set(), start, 'barrier');
  const intervals: [number, number][] = [];
  for (const p of stripOrderExposures(placed)) {
    const a = itemOf.get(p.targetId)!;
    const b = itemOf.get(p.hazardId)!;
    if (a !== b) intervals.push([Math.min(a, b), Math.max(a, b) - 1]);
  }
  intervals.sort((x, y) => x[1] - y[1] || x[0] - y[0]);
  const cuts: number[] = [];
  let last = -1;
  for (const [lo, hi] of intervals) {
    if (last >= lo && last <= hi) continue;
    last = hi;
    cuts.push(hi);
  }
  return cuts;
}

/** Units (by index) kept in place: the heaviest common subsequence of old and new orders. */
function keptUnits(units: Unit[], order: readonly number[]): Set<number> {
  // Old order is 0…n−1, so the common subsequence is the heaviest increasing subsequence.
  const n = order.length;
  const best = new Array<number>(n).fill(0);
  const prev = new Array<number>(n).fill(-1);
  let top = -1;
  for (let i = 0; i < n; i++) {
    best[i] = units[order[i]!]!.weight;
    for (let j = 0; j < i; j++) {
      if (order[j]! < order[i]! && best[j]! + units[order[i]!]!.weight > best[i]!) {
        best[i] = best[j]! + units[order[i]!]!.weight;
        prev[i] = j;
      }
    }
    if (top < 0 || best[i]! > best[top]!) top = i;
  }
  const kept = new Set<number>();
  for (let i = top; i >= 0; i = prev[i]!) kept.add(order[i]!);
  return kept;
}

function movedWeight(units: Unit[], order: readonly number[]): number {
  const kept = keptUnits(units, order);
  let w = 0;
  for (const u of order) if (!kept.has(u)) w += units[u]!.weight;
  return w;
}

export function proposeResequence(
  terminals: readonly TerminalSnapshot[],
  options: ResequenceOptions = {},
): ResequenceProposal {
  const separator = options.separator ?? 'barrier';
  const separatorCost = options.separatorCost ?? 2;
  if (separator !== 'barrier' && separator !== 'spare')
    throw new RangeError(`separator must be "barrier" or "spare", got ${String(separator)}`);
  if (!Number.isFinite(separatorCost) || separatorCost < 0)
    throw new RangeError(`separatorCost must be a finite number ≥ 0, got ${separatorCost}`);
  const stripId = terminals[0]?.stripId ?? '';
  for (const t of terminals) {
    if (t.stripId !== stripId)
      throw new RangeError(
        `terminal ${t.label} is on strip ${t.stripId}, not ${stripId}: propose one strip at a time`,
      );
    if (!Number.isInteger(t.position))
      throw new RangeError(
        `terminal ${t.label}: position must be a whole number, got ${t.position}`,
      );
  }
  const before = stripOrderExposures(terminals).length;
  const identity = (note: string): ResequenceProposal => ({
    stripId,
    changed: false,
    before: { exposures: before },
    after: { exposures: before },
    moves: [],
    renumbered: [],
    addedSeparators: [],
    order: [...terminals]
      .sort(
        (a, b) =>
          a.position - b.position || (a.level ?? 0) - (b.level ?? 0) || (a.id < b.id ? -1 : 1),
      )
      .map((t) => ({
        kind: 'terminal',
        position: t.position,
        terminalId: t.id,
        label: t.label,
        level: t.level ?? null,
        fromPosition: t.position,
      })),
    note,
  });
  if (before === 0) return identity('no exposure caused by the order of this strip');

  const units = buildUnits(terminals);
  const start = Math.min(...terminals.map((t) => t.position));
  const n = units.length;

  const evaluate = (order: number[]) => {
    const cuts = stab(units, order, start);
    return { order, cuts, cost: movedWeight(units, order) + separatorCost * cuts.length };
  };
  let best = evaluate(units.map((u) => u.index));
  const consider = (order: number[]) => {
    const c = evaluate(order);
    if (c.cost < best.cost || (c.cost === best.cost && c.cuts.length < best.cuts.length)) best = c;
  };

  // Group by class: one side inputs, other side hazards; neutral and mixed units by a cut.
  for (const inputsFirst of [true, false]) {
    for (let cut = 0; cut <= n; cut++) {
      const first: number[] = [];
      const second: number[] = [];
      for (const u of units) {
        const pure = u.hasHazard !== u.hasTarget;
        const goesFirst = pure ? (inputsFirst ? u.hasTarget : u.hasHazard) : u.index < cut;
        (goesFirst ? first : second).push(u.index);
      }
      consider([...first, ...second]);
    }
  }

  // Single-unit relocations while they lower the cost.
  for (let round = 0; round < n; round++) {
    const current = best;
    for (let i = 0; i < current.order.length; i++) {
      const u = current.order[i]!;
      if (!units[u]!.hasHazard && !units[u]!.hasTarget) continue;
      const rest = current.order.filter((_, k) => k !== i);
      const gaps = new Set<number>([0, rest.length]);
      if (rest.length <= 60) for (let g = 0; g <= rest.length; g++) gaps.add(g);
      else
        for (const c of current.cuts)
          for (const g of [c, c + 1, c + 2]) if (g <= rest.length) gaps.add(g);
      for (const g of [...gaps].sort((a, b) => a - b)) {
        if (g === i) continue;
        consider([...rest.slice(0, g), u, ...rest.slice(g)]);
      }
    }
    if (best === current) break;
  }

  const cutSet = new Set(best.cuts);
  const { placed, strip, slots } = place(units, best.order, cutSet, start, separator);
  const after = stripOrderExposures(strip).length;
  if (after >= before)
    return identity('no order with fewer exposures was found; the strip is left as it is');

  const kept = keptUnits(units, best.order);
  const newPosition = new Map(placed.map((t) => [t.id, t.position]));
  const movedIds = new Set(
    best.order.filter((u) => !kept.has(u)).flatMap((u) => units[u]!.terminals.map((t) => t.id)),
  );
  const moves: ResequenceMove[] = [];
  const renumbered: ResequenceMove[] = [];
  for (const s of slots) {
    if (s.kind !== 'terminal') continue;
    const m = {
      terminalId: s.terminalId,
      label: s.label,
      from: s.fromPosition,
      to: newPosition.get(s.terminalId)!,
    };
    if (movedIds.has(s.terminalId)) moves.push(m);
    if (m.from !== m.to) renumbered.push(m);
  }
  const addedSeparators = slots
    .filter((s): s is Extract<ProposedSlot, { added: true }> => s.kind !== 'terminal')
    .map((s) => ({ kind: s.kind, position: s.position }));
  const note =
    after === 0
      ? `removes every order-caused exposure: ${moves.length} terminal(s) moved, ${best.cuts.length} ${separator === 'barrier' ? 'barrier(s)' : 'spare group(s)'} added`
      : `${after} exposure(s) remain inside blocks or bridge groups that move as one unit`;
  return {
    stripId,
    changed: true,
    before: { exposures: before },
    after: { exposures: after },
    moves,
    renumbered,
    addedSeparators,
    order: slots,
    note,
  };
}
