import {
  hazardCurrentKind,
  isHazard,
  isTargetClass,
  nominalPeakVoltage,
  terminalNumberOf,
} from './hazard';
import { forEachSimilarWireNumber, normaliseWireNumber } from './lookalike';
import { barrierBetween, buildStripLayout, lowerBound, type StripLayout } from './strip-layout';
import {
  DEFAULT_LIKELIHOOD_WEIGHTS,
  LIKELIHOOD_CLASSES,
  MECHANISMS,
  type Exposure,
  type ExposureMap,
  type ExposureOptions,
  type ExposureRoute,
  type LikelihoodClass,
  type LikelihoodWeights,
  type Mechanism,
  type TargetExposures,
  type TerminalSnapshot,
  type WiringSnapshot,
} from './types';

/** The class each route carries (our own judgement; common practice, no source). */
export const ROUTE_LIKELIHOOD: Readonly<Record<ExposureRoute, LikelihoodClass>> = {
  adjacent: 'likely',
  near: 'plausible',
  'other-level': 'likely',
  'cable-core': 'plausible',
  'connector-pin': 'plausible',
  'terminal-number': 'plausible',
  'wire-number-same': 'likely',
  'wire-number-similar': 'remote',
  'bridge-member': 'likely',
  'bridge-span': 'plausible',
  'bridge-end': 'plausible',
};

const MECHANISM_ORDER: Readonly<Record<Mechanism, number>> = {
  neighbour: 0,
  stacked: 1,
  bridge: 2,
  'same-cable': 3,
  'look-alike': 4,
};

/** Project weights merged over the defaults; a bad weight is refused with its name. */
export function resolveWeights(partial?: Partial<LikelihoodWeights>): LikelihoodWeights {
  const weights: LikelihoodWeights = { ...DEFAULT_LIKELIHOOD_WEIGHTS };
  for (const c of LIKELIHOOD_CLASSES) {
    const w = partial?.[c];
    if (w === undefined) continue;
    if (typeof w !== 'number' || !Number.isFinite(w) || w < 0) {
      throw new RangeError(
        `likelihood weight "${c}" must be a finite number ≥ 0, got ${String(w)}`,
      );
    }
    weights[c] = w;
  }
  return weights;
}

function lowerClass(c: LikelihoodClass): LikelihoodClass {
  return c === 'likely' ? 'plausible' : 'remote';
}

export function describeHazard(h: TerminalSnapshot): string {
  const kind = h.hazardKind ?? 'hazard';
  const v = h.nominalVoltage;
  const volts =
    v === null || v === undefined ? 'voltage not given' : `${v} V ${hazardCurrentKind(h)}`;
  return `${kind} ${volts}`;
}

/** Everything the mapping looks terminals up by; built once, O(n). */
export interface WiringIndex {
  terminalById: Map<string, TerminalSnapshot>;
  stripName: Map<string, string>;
  cabinetOfStrip: Map<string, string>;
  layouts: Map<string, StripLayout>;
  channelsOfTerminal: Map<string, string[]>;
  /** strip → block id → hazards. */
  hazardsByBlock: Scoped;
  hazardsByCable: Map<string, TerminalSnapshot[]>;
  /** cabinet → connector → hazards. */
  hazardsByConnector: Scoped;
  /** cabinet → terminal number → hazards. */
  hazardsByNumber: Scoped;
  /** cabinet → normalised wire number → hazards. */
  hazardsByWire: Scoped;
  /** cabinet → every number `similar` to a hazard's wire number → those hazards. */
  hazardsBySimilarWire: Scoped;
  targetIds: string[];
}

/** Two-level index (scope, then key): look-ups without building composite key strings. */
type Scoped = Map<string, Map<string, TerminalSnapshot[]>>;

function pushScoped(m: Scoped, scope: string, key: string, t: TerminalSnapshot): void {
  let inner = m.get(scope);
  if (!inner) m.set(scope, (inner = new Map()));
  const list = inner.get(key);
  if (list) {
    if (list[list.length - 1] !== t) list.push(t);
  } else inner.set(key, [t]);
}

function getScoped(m: Scoped, scope: string, key: string): TerminalSnapshot[] | undefined {
  return m.get(scope)?.get(key);
}

function push<K, V>(m: Map<K, V[]>, k: K, v: V): void {
  const list = m.get(k);
  if (list) list.push(v);
  else m.set(k, [v]);
}

const present = (s: string | null | undefined): s is string =>
  s !== null && s !== undefined && s !== '';

export function buildWiringIndex(w: WiringSnapshot): WiringIndex {
  const terminalById = new Map<string, TerminalSnapshot>();
  const byStrip = new Map<string, TerminalSnapshot[]>();
  const stripName = new Map<string, string>();
  const cabinetOfStrip = new Map<string, string>();
  for (const s of w.strips) {
    stripName.set(s.id, s.tag);
    cabinetOfStrip.set(s.id, s.cabinetId);
  }
  const idx: WiringIndex = {
    terminalById,
    stripName,
    cabinetOfStrip,
    layouts: new Map(),
    channelsOfTerminal: new Map(),
    hazardsByBlock: new Map(),
    hazardsByCable: new Map(),
    hazardsByConnector: new Map(),
    hazardsByNumber: new Map(),
    hazardsByWire: new Map(),
    hazardsBySimilarWire: new Map(),
    targetIds: [],
  };
  const targets = new Set<string>();
  for (const t of w.terminals) {
    terminalById.set(t.id, t);
    push(byStrip, t.stripId, t);
    if (isTargetClass(t)) targets.add(t.id);
    if (!isHazard(t)) continue;
    const cabinet = cabinetOfStrip.get(t.stripId) ?? '';
    if (present(t.blockId)) pushScoped(idx.hazardsByBlock, t.stripId, t.blockId, t);
    if (present(t.cableId)) push(idx.hazardsByCable, t.cableId, t);
    if (present(t.connector)) pushScoped(idx.hazardsByConnector, cabinet, t.connector, t);
    const num = terminalNumberOf(t);
    if (num !== null) pushScoped(idx.hazardsByNumber, cabinet, num, t);
    const wire = normaliseWireNumber(t.wireNumber);
    if (wire !== null) {
      pushScoped(idx.hazardsByWire, cabinet, wire, t);
      // Similarity is symmetric, so indexing each hazard under its variants lets a target
      // find its look-alikes with one look-up (hazards are far fewer than targets).
      forEachSimilarWireNumber(wire, (variant) =>
        pushScoped(idx.hazardsBySimilarWire, cabinet, variant, t),
      );
    }
  }
  for (const [stripId, list] of byStrip) idx.layouts.set(stripId, buildStripLayout(list));
  for (const c of w.channels) {
    for (const tid of [c.signalTerminalId, c.returnTerminalId]) {
      if (!present(tid)) continue;
      targets.add(tid);
      push(idx.channelsOfTerminal, tid, c.id);
    }
  }
  idx.targetIds = [...targets].filter((id) => terminalById.has(id)).sort();
  return idx;
}

type Emit = (
  target: TerminalSnapshot,
  hazard: TerminalSnapshot,
  route: ExposureRoute,
  reason: string,
  cls?: LikelihoodClass,
  distance?: number,
) => void;

const MECHANISM_OF_ROUTE: Readonly<Record<ExposureRoute, Mechanism>> = {
  adjacent: 'neighbour',
  near: 'neighbour',
  'other-level': 'stacked',
  'cable-core': 'same-cable',
  'connector-pin': 'same-cable',
  'terminal-number': 'look-alike',
  'wire-number-same': 'look-alike',
  'wire-number-similar': 'look-alike',
  'bridge-member': 'bridge',
  'bridge-span': 'bridge',
  'bridge-end': 'bridge',
};

export function mechanismOfRoute(route: ExposureRoute): Mechanism {
  return MECHANISM_OF_ROUTE[route];
}

/** Neighbour exposures of one target: positions ±1…±3 on its strip, no barrier between. */
export function neighbourHazards(
  target: TerminalSnapshot,
  layout: StripLayout,
  emit: Emit,
  stripLabel: string,
): void {
  for (let d = -3; d <= 3; d++) {
    if (d === 0) continue;
    const at = layout.byPosition.get(target.position + d);
    if (!at) continue;
    let blocked: boolean | undefined;
    for (const h of at) {
      if (!isHazard(h)) continue;
      blocked ??= barrierBetween(layout, target.position, h.position);
      if (blocked) break;
      const distance = Math.abs(d);
      const route: ExposureRoute = distance === 1 ? 'adjacent' : 'near';
      const sameLevel = target.level == null || h.level == null || target.level === h.level;
      const base = ROUTE_LIKELIHOOD[route];
      const cls = sameLevel ? base : lowerClass(base);
      const levelNote = sameLevel ? '' : ` (level ${h.level} vs ${target.level})`;
      emit(
        target,
        h,
        route,
        `${h.label} (${describeHazard(h)}) is ${distance} position${distance > 1 ? 's' : ''} from ${target.label} on strip ${stripLabel}${levelNote}, no barrier between`,
        cls,
        distance,
      );
    }
  }
}

interface BridgePair {
  target: TerminalSnapshot;
  hazard: TerminalSnapshot;
  route: ExposureRoute;
  reason: string;
}

/**
 * Bridge exposures of one strip. A bridge group is one jumper or comb joining its members.
 *  - member: a hazard and an input in the same group are joined by design;
 *  - span: a non-member between the group's first and last position, on the comb's level, is
 *    one tooth (or a full comb fitted instead of a cut one) away from the group;
 *  - end: a non-member one position beyond either end is reached by a comb shifted by one or
 *    cut one tooth too long.
 * A barrier between the reached terminal and the nearest member breaks span and end reach.
 * Reach works both ways: a hazard comb reaching an input, or an input's comb (a 0 V common
 * comb, say) reaching a hazard, which then sits on every input of that comb.
 */
export function bridgePairs(layout: StripLayout, stripLabel: string): BridgePair[] {
  const groups = new Map<string, TerminalSnapshot[]>();
  for (const t of layout.ordered) if (present(t.bridgeGroup)) push(groups, t.bridgeGroup, t);
  const out: BridgePair[] = [];
  for (const [group, members] of [...groups].sort((a, b) => (a[0] < b[0] ? -1 : 1))) {
    const hazards = members.filter(isHazard);
    const targets = members.filter(isTargetClass);
    for (const t of targets) {
      for (const h of hazards) {
        out.push({
          target: t,
          hazard: h,
          route: 'bridge-member',
          reason: `${h.label} (${describeHazard(h)}) is jumpered to ${t.label} by bridge ${group} on strip ${stripLabel}`,
        });
      }
    }
    if (hazards.length === 0 && targets.length === 0) continue;
    const positions = [...new Set(members.map((m) => m.position))].sort((a, b) => a - b);
    const levels = new Set(members.map((m) => m.level ?? null));
    const combLevel = levels.size === 1 ? [...levels][0]! : null;
    const memberIds = new Set(members.map((m) => m.id));
    const first = positions[0]!;
    const last = positions[positions.length - 1]!;
    for (let p = first - 1; p <= last + 1; p++) {
      const at = layout.byPosition.get(p);
      if (!at) continue;
      const i = lowerBound(positions, p);
      const above = positions[i];
      const below = positions[i - 1];
      const nearest =
        above === undefined
          ? below!
          : below === undefined
            ? above
            : p - below <= above - p
              ? below
              : above;
      if (barrierBetween(layout, p, nearest)) continue;
      const route: ExposureRoute = p < first || p > last ? 'bridge-end' : 'bridge-span';
      const how = route === 'bridge-end' ? 'one position beyond the end of' : 'under the span of';
      for (const x of at) {
        if (memberIds.has(x.id)) continue;
        if (combLevel !== null && x.level != null && x.level !== combLevel) continue;
        if (isTargetClass(x)) {
          for (const h of hazards) {
            out.push({
              target: x,
              hazard: h,
              route,
              reason: `${x.label} is ${how} bridge ${group} that carries ${h.label} (${describeHazard(h)}) on strip ${stripLabel}`,
            });
          }
        } else if (isHazard(x)) {
          for (const t of targets) {
            out.push({
              target: t,
              hazard: x,
              route,
              reason: `${x.label} (${describeHazard(x)}) is ${how} bridge ${group} that joins ${t.label} on strip ${stripLabel}`,
            });
          }
        }
      }
    }
  }
  return out;
}

function compareIds(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * Every hazard terminal a wiring mistake could put onto each sensitive or return terminal.
 * Linear in the number of terminals: each target looks up its strip neighbours (±3 positions),
 * its block, cable, connector, terminal number and wire-number variants in hash indexes.
 */
export function mapExposures(w: WiringSnapshot, options: ExposureOptions = {}): ExposureMap {
  const weights = resolveWeights(options.weights);
  const idx = buildWiringIndex(w);
  const found = new Map<string, Exposure[]>();
  const peak = new Map<string, number>();
  const peakOf = (h: TerminalSnapshot): number => {
    let v = peak.get(h.id);
    if (v === undefined) peak.set(h.id, (v = nominalPeakVoltage(h)));
    return v;
  };
  const emit: Emit = (target, hazard, route, reason, cls, distance) => {
    if (target.id === hazard.id) return;
    const likelihood = cls ?? ROUTE_LIKELIHOOD[route];
    const e: Exposure = {
      targetTerminalId: target.id,
      hazardTerminalId: hazard.id,
      mechanism: MECHANISM_OF_ROUTE[route],
      route,
      likelihood,
      weight: weights[likelihood],
      reason,
    };
    if (distance !== undefined) e.distance = distance;
    push(found, target.id, e);
  };

  for (const layout of idx.layouts.values()) {
    const stripId = layout.ordered[0]!.stripId;
    for (const p of bridgePairs(layout, idx.stripName.get(stripId) ?? stripId)) {
      emit(p.target, p.hazard, p.route, p.reason);
    }
  }

  for (const id of idx.targetIds) {
    const t = idx.terminalById.get(id)!;
    const stripLabel = idx.stripName.get(t.stripId) ?? t.stripId;
    const layout = idx.layouts.get(t.stripId)!;
    const cabinet = idx.cabinetOfStrip.get(t.stripId) ?? '';
    neighbourHazards(t, layout, emit, stripLabel);

    // Stacked: another level of the same block (or of the same position, when no block id).
    const stacked = present(t.blockId)
      ? getScoped(idx.hazardsByBlock, t.stripId, t.blockId)
      : t.level != null
        ? layout.byPosition.get(t.position)?.filter((h) => isHazard(h) && h.level != null)
        : undefined;
    for (const h of stacked ?? []) {
      if ((h.level ?? null) === (t.level ?? null)) continue;
      emit(
        t,
        h,
        'other-level',
        `${h.label} (${describeHazard(h)}) is level ${h.level ?? '?'} of the block that holds ${t.label} (level ${t.level ?? '?'})`,
      );
    }

    if (present(t.cableId)) {
      for (const h of idx.hazardsByCable.get(t.cableId) ?? []) {
        emit(
          t,
          h,
          'cable-core',
          `${h.label} (${describeHazard(h)}) is core ${h.cableCore ?? '?'} of cable ${t.cableId}, which also carries ${t.label} (core ${t.cableCore ?? '?'})`,
        );
      }
    }
    if (present(t.connector)) {
      for (const h of getScoped(idx.hazardsByConnector, cabinet, t.connector) ?? []) {
        emit(
          t,
          h,
          'connector-pin',
          `${h.label} (${describeHazard(h)}) shares connector ${t.connector} with ${t.label}`,
        );
      }
    }

    const num = terminalNumberOf(t);
    if (num !== null) {
      for (const h of getScoped(idx.hazardsByNumber, cabinet, num) ?? []) {
        if (h.stripId === t.stripId) continue;
        emit(
          t,
          h,
          'terminal-number',
          `${h.label} (${describeHazard(h)}) carries the same terminal number ${num} as ${t.label} on strip ${idx.stripName.get(h.stripId) ?? h.stripId} of the same cabinet`,
        );
      }
    }
    const wire = normaliseWireNumber(t.wireNumber);
    if (wire !== null) {
      for (const h of getScoped(idx.hazardsByWire, cabinet, wire) ?? []) {
        emit(
          t,
          h,
          'wire-number-same',
          `${h.label} (${describeHazard(h)}) carries the same wire number ${wire} as ${t.label}`,
        );
      }
      for (const h of getScoped(idx.hazardsBySimilarWire, cabinet, wire) ?? []) {
        emit(
          t,
          h,
          'wire-number-similar',
          `${h.label} (${describeHazard(h)}) wire number ${normaliseWireNumber(h.wireNumber)} reads like ${wire} on ${t.label}`,
        );
      }
    }
  }

  const countsByMechanism = Object.fromEntries(MECHANISMS.map((m) => [m, 0])) as Record<
    Mechanism,
    number
  >;
  const targets: TargetExposures[] = idx.targetIds.map((id) => {
    const list = found.get(id) ?? [];
    let unique = list;
    if (list.length > 1) {
      const seen = new Set<string>();
      unique = list.filter((e) => {
        const k = `${e.hazardTerminalId}\u0000${e.route}`;
        if (seen.has(k)) return false;
        seen.add(k);
        return true;
      });
    }
    if (unique.length > 1)
      unique.sort((a, b) => {
        const ha = idx.terminalById.get(a.hazardTerminalId)!;
        const hb = idx.terminalById.get(b.hazardTerminalId)!;
        return (
          b.weight - a.weight ||
          peakOf(hb) - peakOf(ha) ||
          MECHANISM_ORDER[a.mechanism] - MECHANISM_ORDER[b.mechanism] ||
          compareIds(a.route, b.route) ||
          compareIds(ha.label, hb.label) ||
          compareIds(ha.id, hb.id)
        );
      });
    for (const e of unique) countsByMechanism[e.mechanism]++;
    return {
      terminalId: id,
      label: idx.terminalById.get(id)!.label,
      channelIds: [...(idx.channelsOfTerminal.get(id) ?? [])].sort(),
      exposures: unique,
    };
  });
  return { targets, countsByMechanism };
}
