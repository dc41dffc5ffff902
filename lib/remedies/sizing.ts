/**
 * Sizing remedies: for a channel that does not hold, the smallest change that would — each
 * candidate verified by re-solving every stress case given.
 *
 *  - minimum series resistance (the outermost series resistor, next value up in an E series);
 *  - minimum resistor power rating and limiting / overload voltage (standard rating steps);
 *  - minimum resistor single-pulse energy (no standard steps: rounded up to two figures);
 *  - minimum TVS peak pulse power (the usual 10/1000 µs classes), as a bigger part of the same
 *    clamping voltage: IPP = PPPM / VC, so its dynamic resistance falls too.
 * A remedy reports the channel's verdict after the change; one that fixes its own element but
 * leaves another failing says so in its verdict and reason.
 */
import { formatEng } from '../units';
import { compileGuard } from '../stress/network';
import { solveWithNetwork } from '../stress/solve';
import type {
  Guard,
  RatingCheck,
  ResistorElement,
  ShuntResistorElement,
  StressCase,
  StressConditions,
  StressResult,
  TvsElement,
  Verdict,
} from '../stress/types';
import { VERDICT_SEVERITY } from '../stress/types';

export type RemedyKind =
  | 'seriesResistance'
  | 'resistorPower'
  | 'resistorVoltage'
  | 'resistorOverloadVoltage'
  | 'resistorPulseEnergy'
  | 'tvsPulsePower'
  | 'combined';

export interface RemedyChange {
  elementId: string;
  stage: number;
  field: string;
  from: number | null;
  to: number;
  unit: 'Ω' | 'W' | 'V' | 'J';
}

export interface Remedy {
  kind: RemedyKind;
  /** The changes (one, or several for 'combined'). */
  changes: RemedyChange[];
  /** One line: what to change, from → to. */
  description: string;
  /** The channel's verdict over all cases after the change (re-solved). */
  verdict: Verdict;
  /** The reason of the worst remaining result after the change. */
  reason: string;
  /** The guard with the change applied. */
  guard: Guard;
}

/** E24 (IEC 60063): the historic values, not the formula. */
export const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
  6.2, 6.8, 7.5, 8.2, 9.1,
];
/** E96 (IEC 60063): 10^(i/96) rounded to three figures, which is how E48–E192 are defined. */
export const E96 = Array.from({ length: 96 }, (_, i) => Number((10 ** (i / 96)).toPrecision(3)));

/** Standard power ratings of resistors (W), chip and through-hole (common practice). */
export const POWER_STEPS = [
  0.063, 0.1, 0.125, 0.25, 0.4, 0.5, 0.6, 0.75, 1, 1.5, 2, 3, 5, 7, 10, 15, 20, 25, 50, 100,
];
/** Standard limiting element / overload voltages (V) seen on datasheets (common practice). */
export const VOLTAGE_STEPS = [
  50, 75, 100, 150, 200, 250, 300, 350, 400, 500, 750, 1000, 1500, 2000, 3000, 5000, 10000,
];
/** TVS peak pulse power classes on 10/1000 µs (W) (common practice; REFERENCE.md 400/600/1500 W). */
export const TVS_POWER_STEPS = [
  200, 300, 400, 500, 600, 1000, 1500, 3000, 5000, 8000, 15000, 30000,
];

const MAX_SERIES_RESISTANCE = 10e6;

export interface SizingOptions {
  series?: 'E24' | 'E96';
}

/** E-series values from `from` (exclusive) up to `to` (inclusive). */
export function eSeriesAbove(from: number, to: number, series: 'E24' | 'E96'): number[] {
  const mantissas = series === 'E24' ? E24 : E96;
  const out: number[] = [];
  const start = Math.floor(Math.log10(Math.max(from, 1e-3)));
  for (let decade = start; decade <= Math.ceil(Math.log10(to)); decade++) {
    for (const m of mantissas) {
      const value = Number((m * 10 ** decade).toPrecision(3));
      if (value > from * (1 + 1e-9) && value <= to) out.push(value);
    }
  }
  return out;
}

interface Evaluation {
  verdict: Verdict;
  reason: string;
  results: StressResult[];
}

function evaluate(guard: Guard, cases: StressCase[], conditions: StressConditions): Evaluation {
  const net = compileGuard(guard);
  const results = cases.map((c) => solveWithNetwork(guard, net, c, conditions));
  let worst = results[0];
  for (const r of results)
    if (VERDICT_SEVERITY[r.verdict] > VERDICT_SEVERITY[worst.verdict]) worst = r;
  return { verdict: worst.verdict, reason: worst.reason, results };
}

type ResistorLike = ResistorElement | ShuntResistorElement;

function locate(
  guard: Guard,
  id: string,
): {
  stage: number;
  element: Guard['stages'][number]['series'] | Guard['stages'][number]['shunts'][number];
} | null {
  for (let k = 0; k < guard.stages.length; k++) {
    const s = guard.stages[k];
    if (s.series.id === id) return { stage: k + 1, element: s.series };
    for (const sh of s.shunts) if (sh.id === id) return { stage: k + 1, element: sh };
  }
  return null;
}

function withChange(guard: Guard, changes: RemedyChange[]): Guard {
  const copy = structuredClone(guard);
  for (const change of changes) {
    const found = locate(copy, change.elementId);
    if (!found) continue;
    const element = found.element as unknown as Record<string, number>;
    element[change.field] = change.to;
    if (change.field === 'peakPulsePower' && found.element.kind === 'tvs') {
      // a bigger part of the same clamping voltage
      (found.element as TvsElement).peakPulseCurrent =
        change.to / (found.element as TvsElement).clampVoltage;
    }
  }
  return copy;
}

/** Element checks across all results, for one element. */
function checksOf(results: StressResult[], id: string) {
  return results.flatMap((r) =>
    r.elements.filter((e) => e.elementId === id).flatMap((e) => e.checks),
  );
}

function elementHolds(results: StressResult[], id: string): boolean {
  return results.every((r) =>
    r.elements.filter((e) => e.elementId === id).every((e) => e.verdict === 'holds'),
  );
}

function describe(changes: RemedyChange[], note = ''): string {
  const parts = changes.map(
    (c) =>
      `${c.elementId} ${c.field}: ${c.from === null ? 'not given' : formatEng(c.from, c.unit)} → ${formatEng(c.to, c.unit)}`,
  );
  return `${parts.join('; ')}${note}`;
}

function firstStep(steps: number[], needed: number): number | null {
  for (const s of steps) if (s >= needed * (1 - 1e-12)) return s;
  return null;
}

/** Two significant figures, rounded up. */
function roundUp2(x: number): number {
  if (!(x > 0)) return x;
  const p = 10 ** (Math.floor(Math.log10(x)) - 1);
  return Math.ceil(x / p - 1e-9) * p;
}

/**
 * The smallest standard ratings that would hold the stresses in `checks` (a resistor's own
 * checks); `complete` is false when some stress is beyond every standard step (the changes
 * then cover only the rest).
 */
function ratingChanges(
  r: ResistorLike,
  stage: number,
  checks: RatingCheck[],
  conditions: StressConditions,
): { changes: RemedyChange[]; complete: boolean } {
  const changes: RemedyChange[] = [];
  let complete = true;
  const need = (quantity: string) =>
    checks.filter((c) => c.quantity === quantity && c.verdict !== 'holds');
  const powerChecks = need('power');
  if (powerChecks.length > 0) {
    const stress = Math.max(...powerChecks.map((c) => c.value));
    const ratio =
      powerChecks
        .map((c) => (c.rating && c.deratedRating ? c.deratedRating / c.rating : null))
        .find((f) => f !== null) ?? conditions.powerDerating;
    const step = ratio > 0 ? firstStep(POWER_STEPS, stress / ratio) : null;
    if (step === null) complete = false;
    else
      changes.push({
        elementId: r.id,
        stage,
        field: 'ratedPower',
        from: r.ratedPower ?? null,
        to: step,
        unit: 'W',
      });
  }
  const voltageChecks = need('voltage');
  const steadyVoltage = voltageChecks.filter((c) => c.reason?.includes('pulse') !== true);
  const pulseVoltage = voltageChecks.filter((c) => c.reason?.includes('pulse') === true);
  if (steadyVoltage.length > 0) {
    const step = firstStep(
      VOLTAGE_STEPS,
      Math.max(...steadyVoltage.map((c) => c.value)) / conditions.voltageDerating,
    );
    if (step === null) complete = false;
    else
      changes.push({
        elementId: r.id,
        stage,
        field: 'limitingVoltage',
        from: r.limitingVoltage ?? null,
        to: step,
        unit: 'V',
      });
  }
  if (pulseVoltage.length > 0) {
    const step = firstStep(
      VOLTAGE_STEPS,
      Math.max(...pulseVoltage.map((c) => c.value)) / conditions.voltageDerating,
    );
    if (step === null) complete = false;
    else
      changes.push({
        elementId: r.id,
        stage,
        field: 'overloadVoltage',
        from: r.overloadVoltage ?? null,
        to: step,
        unit: 'V',
      });
  }
  const energyChecks = need('energy');
  if (energyChecks.length > 0) {
    if (r.kind !== 'resistor') complete = false;
    else
      changes.push({
        elementId: r.id,
        stage,
        field: 'pulseEnergy',
        from: r.pulseEnergy ?? null,
        to: roundUp2(Math.max(...energyChecks.map((c) => c.value)) / conditions.powerDerating),
        unit: 'J',
      });
  }
  return { changes, complete };
}

/**
 * Remedies for a guard under one or more stress cases. Empty when the channel already holds.
 */
export function suggestRemedies(
  guard: Guard,
  stressCases: StressCase | StressCase[],
  conditions: StressConditions,
  options: SizingOptions = {},
): Remedy[] {
  const cases = Array.isArray(stressCases) ? stressCases : [stressCases];
  if (cases.length === 0) return [];
  const base = evaluate(guard, cases, conditions);
  if (base.verdict === 'holds') return [];
  const remedies: Remedy[] = [];
  const series = options.series ?? 'E24';
  const push = (kind: RemedyKind, changes: RemedyChange[], note = ''): Evaluation => {
    const changed = withChange(guard, changes);
    const after = evaluate(changed, cases, conditions);
    remedies.push({
      kind,
      changes,
      description: describe(changes, note),
      verdict: after.verdict,
      reason: after.reason,
      guard: changed,
    });
    return after;
  };
  const perElement: RemedyChange[] = [];

  // ---- ratings of each resistor that does not hold: the smallest standard step that would
  guard.stages.forEach((stage, k) => {
    const resistors: ResistorLike[] = [];
    if (stage.series.kind === 'resistor') resistors.push(stage.series);
    for (const sh of stage.shunts) if (sh.kind === 'shuntResistor') resistors.push(sh);
    for (const r of resistors) {
      if (elementHolds(base.results, r.id)) continue;
      const { changes } = ratingChanges(r, k + 1, checksOf(base.results, r.id), conditions);
      for (const change of changes) {
        const kind: RemedyKind =
          change.field === 'ratedPower'
            ? 'resistorPower'
            : change.field === 'limitingVoltage'
              ? 'resistorVoltage'
              : change.field === 'overloadVoltage'
                ? 'resistorOverloadVoltage'
                : 'resistorPulseEnergy';
        push(kind, [change]);
      }
      perElement.push(...changes);
    }
  });

  // ---- TVS pulse rating
  guard.stages.forEach((stage, k) => {
    for (const sh of stage.shunts) {
      if (sh.kind !== 'tvs' || elementHolds(base.results, sh.id)) continue;
      const pulse = checksOf(base.results, sh.id).filter(
        (c) => c.quantity === 'pulsePower' && c.verdict !== 'holds',
      );
      if (pulse.length === 0) continue; // steady faults: no pulse rating can help
      const current = sh.peakPulsePower ?? sh.clampVoltage * sh.peakPulseCurrent;
      for (const step of TVS_POWER_STEPS) {
        if (step <= current) continue;
        const change: RemedyChange = {
          elementId: sh.id,
          stage: k + 1,
          field: 'peakPulsePower',
          from: current,
          to: step,
          unit: 'W',
        };
        const after = evaluate(withChange(guard, [change]), cases, conditions);
        if (elementHolds(after.results, sh.id)) {
          push(
            'tvsPulsePower',
            [change],
            ' (10/1000 µs; a larger part of the same clamping voltage)',
          );
          perElement.push(change);
          break;
        }
      }
    }
  });

  // ---- minimum series resistance: the outermost series resistor, next E value that holds
  const outer = guard.stages.findIndex((s) => s.series.kind === 'resistor');
  if (outer >= 0) {
    const resistor = guard.stages[outer].series as ResistorElement;
    const candidates = eSeriesAbove(resistor.resistance, MAX_SERIES_RESISTANCE, series);
    const valueChange = (value: number): RemedyChange => ({
      elementId: resistor.id,
      stage: outer + 1,
      field: 'resistance',
      from: resistor.resistance,
      to: value,
      unit: 'Ω',
    });
    /** The value alone, or (withRatings) the value with the resistor's own ratings sized to the stress at that value. */
    const attempt = (
      value: number,
      withRatings: boolean,
    ): { changes: RemedyChange[]; result: Evaluation } | null => {
      const changes = [valueChange(value)];
      if (withRatings) {
        const probe = evaluate(withChange(guard, changes), cases, conditions);
        const extra = ratingChanges(
          resistor,
          outer + 1,
          checksOf(probe.results, resistor.id),
          conditions,
        );
        if (!extra.complete) return null;
        changes.push(...extra.changes);
      }
      return { changes, result: evaluate(withChange(guard, changes), cases, conditions) };
    };
    // binary search for the smallest candidate that holds (the stress falls as R rises);
    // the answer is always a verified one
    const search = (withRatings: boolean) => {
      const holds = (k: number) => attempt(candidates[k], withRatings)?.result.verdict === 'holds';
      if (candidates.length === 0 || !holds(candidates.length - 1)) return null;
      let lo = -1;
      let hi = candidates.length - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (holds(mid)) hi = mid;
        else lo = mid;
      }
      return attempt(candidates[hi], withRatings);
    };
    const alone = search(false);
    if (alone) {
      push('seriesResistance', alone.changes, ` (${series}; check the signal still works)`);
    } else {
      const rated = search(true);
      if (rated)
        push(
          'seriesResistance',
          rated.changes,
          ` (${series}, with its ratings sized to the new stress; check the signal still works)`,
        );
    }
  }

  // ---- every per-element fix together
  if (perElement.length > 1) push('combined', perElement, ' (all of the above together)');

  // smallest useful first: those that make the channel hold, then by how many changes
  return remedies.sort(
    (a, b) =>
      VERDICT_SEVERITY[a.verdict] - VERDICT_SEVERITY[b.verdict] ||
      a.changes.length - b.changes.length,
  );
}
