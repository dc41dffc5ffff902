import { mapExposures } from '../exposure/map';
import { checkSegregation } from '../exposure/segregation';
import { checkWireColours } from '../exposure/colour';
import {
  MECHANISMS,
  type Exposure,
  type Mechanism,
  type TerminalSnapshot,
} from '../exposure/types';
import { applyGuardOverrides } from '../presets/overrides';
import {
  VERDICT_SEVERITY,
  type Guard,
  type HazardTerminal,
  type StressConditions,
  type Verdict,
} from '../stress/types';
import { canonicalJson } from './canonical';
import { hazardCase, transientCases, type HazardCaseResult } from './cases';
import { snapshotHash, AUDIT_VERSION } from './hash';
import { hazardScore, marginOf, utilisationOf } from './score';
import type {
  AuditCase,
  AuditOptions,
  AuditResult,
  AuditSummary,
  ChannelAudit,
  ChannelSnapshot,
  Finding,
  NearestHazard,
  ProjectSnapshot,
  StressSolver,
} from './types';
import { assertAuditable } from './validate';

const zeroVerdicts = (): Record<Verdict, number> => ({
  holds: 0,
  marginal: 0,
  fails: 0,
  unprotected: 0,
  incomplete: 0,
});

interface PreparedHazardCase {
  built: HazardCaseResult;
  /** Cache key of the case (stress and terminal side), computed once per hazard and side. */
  caseKey: string;
  /** Cabinet tag / terminal label: unique across the project, stable across runs. */
  hazardRef: string;
}

/** What a finding takes from the engine; shared by every finding with the same inputs. */
type Judgement = Pick<
  Finding,
  | 'verdict'
  | 'reason'
  | 'margin'
  | 'utilisation'
  | 'elements'
  | 'input'
  | 'rails'
  | 'sourcePeakCurrent'
>;

function compareStrings(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * Runs the audit with the given engine. Validates the whole snapshot first (bad input throws
 * AuditInputError and computes nothing), maps exposures, builds every channel's stress cases,
 * solves each distinct (guard, case, terminal) once and judges every finding.
 */
export function runAuditWith(
  snapshot: ProjectSnapshot,
  solve: StressSolver,
  options: AuditOptions = {},
): AuditResult {
  const report = options.onProgress ?? (() => {});
  assertAuditable(snapshot);
  const settings = snapshot.settings;
  const hash = snapshotHash(snapshot);

  report({ phase: 'exposures', done: 0, total: 1 });
  const exposures = mapExposures(snapshot, { weights: settings.likelihoodWeights ?? undefined });
  report({ phase: 'exposures', done: 1, total: 1 });
  const exposuresOf = new Map(exposures.targets.map((t) => [t.terminalId, t.exposures]));

  const terminalById = new Map(snapshot.terminals.map((t) => [t.id, t]));
  const cabinetTagOfStrip = new Map<string, string>();
  const cabinetTag = new Map(snapshot.cabinets.map((c) => [c.id, c.tag]));
  for (const s of snapshot.strips)
    cabinetTagOfStrip.set(s.id, cabinetTag.get(s.cabinetId) ?? s.cabinetId);
  const recipes = new Map(snapshot.guards.map((g) => [g.id, g.guard]));

  const conditions: Record<HazardTerminal, StressConditions> = {
    signal: {
      ambientC: settings.ambientC,
      powerDerating: settings.powerDerating,
      voltageDerating: settings.voltageDerating,
      appliedTo: 'signal',
    },
    return: {
      ambientC: settings.ambientC,
      powerDerating: settings.powerDerating,
      voltageDerating: settings.voltageDerating,
      appliedTo: 'return',
    },
  };
  const transients = transientCases(settings);
  const transientKeys = transients.map((c) => `${JSON.stringify(c.stress)}\u0000${c.appliedTo}`);

  // Many channels share a recipe: one guard object and one solution per distinct input.
  const guards = new Map<string, Guard>();
  const solved = new Map<string, Judgement>();
  const hazardCases = new Map<string, PreparedHazardCase>();
  let solverCalls = 0;

  const guardOf = (c: ChannelSnapshot): { key: string; guard: Guard } | null => {
    if (c.guardRecipeId == null) return null;
    const overrides = c.guardOverrides;
    const hasOverrides = overrides != null && canonicalJson(overrides) !== '{}';
    const key = hasOverrides
      ? `${c.guardRecipeId}\u0000${canonicalJson(overrides)}`
      : c.guardRecipeId;
    let guard = guards.get(key);
    if (!guard) {
      const recipe = recipes.get(c.guardRecipeId)!;
      // Validated above: applying cannot fail here.
      guard = hasOverrides ? applyGuardOverrides(recipe, overrides).guard! : recipe;
      guards.set(key, guard);
    }
    return { key, guard };
  };

  const solveCached = (
    g: { key: string; guard: Guard },
    ac: AuditCase,
    caseKey: string,
  ): Judgement => {
    const key = `${g.key}\u0000${caseKey}`;
    let s = solved.get(key);
    if (!s) {
      solverCalls++;
      try {
        const result = solve(g.guard, ac.stress, conditions[ac.appliedTo]);
        s = {
          verdict: result.verdict,
          reason: result.reason,
          margin: marginOf(result),
          utilisation: utilisationOf(result),
          elements: result.elements,
          input: result.input,
          rails: result.rails,
          sourcePeakCurrent: result.sourcePeakCurrent,
        };
      } catch (err) {
        s = {
          verdict: 'incomplete',
          reason: `the engine could not solve ${ac.label}: ${err instanceof Error ? err.message : String(err)}`,
          margin: null,
          utilisation: 0,
          elements: [],
          input: null,
          rails: [],
          sourcePeakCurrent: null,
        };
      }
      solved.set(key, s);
    }
    return s;
  };

  const judged = (
    channel: ChannelSnapshot,
    g: { key: string; guard: Guard } | null,
    ac: AuditCase,
    caseKey: string,
  ): Judgement => {
    if (g) return solveCached(g, ac, caseKey);
    return {
      verdict: 'unprotected',
      reason: `${channel.tag} has no guard: ${ac.label} reaches the input with nothing to limit it`,
      margin: null,
      utilisation: 0,
      elements: [],
      input: null,
      rails: [],
      sourcePeakCurrent: null,
    };
  };

  const findings: Finding[] = [];
  const channelAudits: ChannelAudit[] = [];
  const findingsByMechanism: Record<Mechanism | 'transient', number> = {
    transient: 0,
    ...(Object.fromEntries(MECHANISMS.map((m) => [m, 0])) as Record<Mechanism, number>),
  };
  const channels = [...snapshot.channels].sort(
    (a, b) => compareStrings(a.tag, b.tag) || compareStrings(a.id, b.id),
  );
  const step = Math.max(1, Math.ceil(channels.length / 100));
  report({ phase: 'stress', done: 0, total: channels.length });

  channels.forEach((channel, n) => {
    const g = guardOf(channel);
    const own: Finding[] = [];

    transients.forEach((ac, i) => {
      const j = judged(channel, g, ac, transientKeys[i]!);
      own.push({
        key: `${channel.tag}|${ac.id}`,
        channelId: channel.id,
        channelTag: channel.tag,
        caseId: ac.id,
        caseLabel: ac.label,
        basis: ac.basis,
        stress: ac.stress,
        appliedTo: ac.appliedTo,
        exposure: null,
        score: null,
        verdict: j.verdict,
        reason: j.reason,
        margin: j.margin,
        utilisation: j.utilisation,
        elements: j.elements,
        input: j.input,
        rails: j.rails,
        sourcePeakCurrent: j.sourcePeakCurrent,
      });
      findingsByMechanism.transient++;
    });

    const exposed: { finding: Finding; peak: number }[] = [];
    const sides: [string | null | undefined, HazardTerminal][] = [
      [channel.signalTerminalId, 'signal'],
      [channel.returnTerminalId, 'return'],
    ];
    for (const [terminalId, appliedTo] of sides) {
      if (terminalId == null) continue;
      const target = terminalById.get(terminalId)!;
      for (const e of exposuresOf.get(terminalId) ?? []) {
        const hazard = terminalById.get(e.hazardTerminalId)!;
        const hcKey = `${hazard.id}\u0000${appliedTo}`;
        let hc = hazardCases.get(hcKey);
        if (!hc) {
          const built = hazardCase(hazard, settings, appliedTo);
          hc = {
            built,
            caseKey: built.ok ? `${JSON.stringify(built.case.stress)}\u0000${appliedTo}` : '',
            hazardRef: `${cabinetTagOfStrip.get(hazard.stripId) ?? ''}/${hazard.label}`,
          };
          hazardCases.set(hcKey, hc);
        }
        const finding = exposureFinding(channel, g, target, hazard, e, appliedTo, hc, judged);
        exposed.push({ finding, peak: hc.built.ok ? hc.built.case.peakVoltage : 0 });
        findingsByMechanism[e.mechanism]++;
      }
    }
    exposed.sort(
      (a, b) =>
        b.finding.score! - a.finding.score! ||
        b.peak - a.peak ||
        compareStrings(a.finding.key, b.finding.key),
    );
    for (const x of exposed) own.push(x.finding);

    let worst: Verdict = 'holds';
    for (const f of own)
      if (VERDICT_SEVERITY[f.verdict] > VERDICT_SEVERITY[worst]) worst = f.verdict;
    const top = exposed[0]?.finding;
    const nearestHazard: NearestHazard | null = top
      ? {
          findingKey: top.key,
          hazardTerminalId: top.exposure!.hazardTerminalId,
          hazardLabel: top.exposure!.hazardLabel,
          mechanism: top.exposure!.mechanism,
          route: top.exposure!.route,
          likelihood: top.exposure!.likelihood,
          verdict: top.verdict,
          score: top.score!,
        }
      : null;
    channelAudits.push({
      channelId: channel.id,
      tag: channel.tag,
      worstVerdict: worst,
      exposureCount: exposed.length,
      nearestHazard,
    });
    for (const f of own) findings.push(f);
    if ((n + 1) % step === 0 || n + 1 === channels.length)
      report({ phase: 'stress', done: n + 1, total: channels.length });
  });

  report({ phase: 'checks', done: 0, total: 1 });
  const checks = [
    ...checkSegregation(snapshot.strips, snapshot.terminals),
    ...checkWireColours(snapshot.strips, snapshot.terminals, settings.wireColourConvention),
  ];
  report({ phase: 'checks', done: 1, total: 1 });

  const summary: AuditSummary = {
    channels: channels.length,
    findings: findings.length,
    findingsByVerdict: zeroVerdicts(),
    channelsByVerdict: zeroVerdicts(),
    exposuresByMechanism: exposures.countsByMechanism,
    findingsByMechanism,
    checksByKind: { segregation: 0, colour: 0 },
    solverCalls,
  };
  for (const f of findings) summary.findingsByVerdict[f.verdict]++;
  for (const c of channelAudits) summary.channelsByVerdict[c.worstVerdict]++;
  for (const c of checks) summary.checksByKind[c.kind]++;
  report({ phase: 'done', done: 1, total: 1 });
  return {
    version: AUDIT_VERSION,
    hash,
    findings,
    checks,
    channels: channelAudits,
    exposures,
    summary,
  };
}

function exposureFinding(
  channel: ChannelSnapshot,
  g: { key: string; guard: Guard } | null,
  target: TerminalSnapshot,
  hazard: TerminalSnapshot,
  e: Exposure,
  appliedTo: HazardTerminal,
  hc: PreparedHazardCase,
  judged: (
    channel: ChannelSnapshot,
    g: { key: string; guard: Guard } | null,
    ac: AuditCase,
    caseKey: string,
  ) => Judgement,
): Finding {
  const built = hc.built;
  const caseId = built.ok ? built.case.id : `${hazard.hazardKind ?? 'other'}:unknown`;
  const exposure = {
    hazardTerminalId: hazard.id,
    hazardLabel: hazard.label,
    targetTerminalId: target.id,
    targetLabel: target.label,
    mechanism: e.mechanism,
    route: e.route,
    likelihood: e.likelihood,
    weight: e.weight,
    reason: e.reason,
  };
  const key = `${channel.tag}|${caseId}|${hc.hazardRef}|${e.mechanism}:${e.route}|${appliedTo}`;
  if (!built.ok) {
    return {
      key,
      channelId: channel.id,
      channelTag: channel.tag,
      caseId,
      caseLabel: `${hazard.label}: no stress case`,
      basis: 'the hazard terminal lacks the facts to build one',
      stress: null,
      appliedTo,
      exposure,
      verdict: 'incomplete',
      reason: built.reason,
      margin: null,
      utilisation: 0,
      score: hazardScore(e.weight, 'incomplete', 0),
      elements: [],
      input: null,
      rails: [],
      sourcePeakCurrent: null,
    };
  }
  const j = judged(channel, g, built.case, hc.caseKey);
  return {
    key,
    channelId: channel.id,
    channelTag: channel.tag,
    caseId,
    caseLabel: built.case.label,
    basis: built.case.basis,
    stress: built.case.stress,
    appliedTo,
    exposure,
    verdict: j.verdict,
    reason: j.reason,
    margin: j.margin,
    utilisation: j.utilisation,
    score: hazardScore(e.weight, j.verdict, j.utilisation),
    elements: j.elements,
    input: j.input,
    rails: j.rails,
    sourcePeakCurrent: j.sourcePeakCurrent,
  };
}
