/**
 * Everything the channel page and the strip overlay show, loaded for the acting user: the
 * channel, its strip(s) as they stand, its guard (recipe + overrides) as the latest audit run
 * froze it, that run's findings for the channel (the engine's figures, unchanged), a waveform
 * for each distinct stress case, and the sizing remedies.
 */
import { Op } from 'sequelize';
import type { ActingUser } from './membership';
import { loadStanding } from './membership';
import { getAuditStatus, getRunSnapshot, latestRunId } from './audits';
import { buildProjectSnapshot } from './audit-snapshot';
import { proposeForStrip, type ResequenceView } from './resequence';
import { loadTerminalRows, type TerminalRow as DbTerminalRow } from './schedule/terminals';
import { can, type ProjectStanding } from '@/lib/auth/permissions';
import { getDb } from '@/lib/db';
import { NotFoundError } from '@/lib/errors';
import type { Finding, ProjectSnapshot } from '@/lib/audit/types';
import type { CheckFinding, LikelihoodClass } from '@/lib/exposure/types';
import { applyGuardOverrides, type GuardOverrides } from '@/lib/presets/overrides';
import { solveStress } from '@/lib/stress/solve';
import { remedyOptions, type RemedyOptionData } from '@/lib/report/remedies';
import { VERDICT_SEVERITY, type Guard, type StressConditions, type Verdict, type Waveform } from '@/lib/stress/types';
import type { ExposureMechanism } from '@/models/enums';

/** JSON-safe shapes the client components take (dates as strings). */
export interface StripView {
  id: number;
  cabinetId: number;
  tag: string;
  name: string | null;
  order: number;
  version: number;
  terminalCount: number;
}
export type TerminalView = Omit<DbTerminalRow, 'createdAt' | 'updatedAt'> & { createdAt?: string; updatedAt?: string };

export interface OverlayExposure {
  from: number;
  to: number;
  mechanism: ExposureMechanism;
  likelihood: LikelihoodClass;
}

export interface ChannelCaseView {
  finding: Finding;
  /** Key into ChannelDetail.waveforms; null when the case could not be solved. */
  waveformKey: string | null;
}

export interface ChannelDetail {
  projectId: number;
  standing: ProjectStanding;
  channel: {
    id: number;
    tag: string;
    name: string | null;
    signalType: string;
    cabinetId: number;
    cabinetTag: string;
    guardRecipeName: string | null;
    overrides: GuardOverrides | null;
    signalTerminalId: number | null;
    returnTerminalId: number | null;
  };
  run: { id: number; stale: boolean } | null;
  /** The guard as audited (from the run's frozen inputs), or as it stands when no run exists. */
  guard: Guard | null;
  overriddenIds: string[];
  conditions: Record<'signal' | 'return', StressConditions>;
  settings: ProjectSnapshot['settings'];
  worstVerdict: Verdict | null;
  cases: ChannelCaseView[];
  waveforms: Record<string, Waveform>;
  strips: StripView[];
  terminals: TerminalView[];
  verdicts: Record<number, Verdict>;
  exposures: OverlayExposure[];
}

const WAVEFORM_POINTS = 700;

function conditionsOf(settings: ProjectSnapshot['settings']): Record<'signal' | 'return', StressConditions> {
  // As lib/audit/run.ts builds them, so the re-solved waveform is the audited case.
  const base = { ambientC: settings.ambientC, powerDerating: settings.powerDerating, voltageDerating: settings.voltageDerating };
  return { signal: { ...base, appliedTo: 'signal' }, return: { ...base, appliedTo: 'return' } };
}

function worse(a: Verdict | undefined, b: Verdict): Verdict {
  return a === undefined || VERDICT_SEVERITY[b] > VERDICT_SEVERITY[a] ? b : a;
}

function terminalView(t: DbTerminalRow): TerminalView {
  const { createdAt, updatedAt, ...rest } = t;
  return { ...rest, createdAt: createdAt?.toISOString(), updatedAt: updatedAt?.toISOString() };
}

async function stripViews(stripIds: number[]): Promise<StripView[]> {
  const { models } = getDb();
  if (stripIds.length === 0) return [];
  const strips = await models.Strip.findAll({ where: { id: { [Op.in]: stripIds } }, order: [['order', 'ASC']] });
  const counts = await Promise.all(strips.map((s) => models.Terminal.count({ where: { stripId: s.id } })));
  return strips.map((s, k) => ({
    id: s.id,
    cabinetId: s.cabinetId,
    tag: s.tag,
    name: s.name,
    order: s.order,
    version: s.version,
    terminalCount: counts[k]!,
  }));
}

async function terminalsOfStrips(projectId: number, stripIds: number[]): Promise<TerminalView[]> {
  const { models } = getDb();
  if (stripIds.length === 0) return [];
  const ids = await models.Terminal.findAll({ where: { stripId: { [Op.in]: stripIds } }, attributes: ['id'], order: [['position', 'ASC'], ['level', 'ASC']] });
  return (await loadTerminalRows(projectId, ids.map((t) => t.id))).map(terminalView);
}

/** Stored findings of one run, optionally for one channel, as the engine produced them. */
async function runFindings(runId: number, where: { channelId?: number }): Promise<{ finding: Finding; stripId: string | null }[]> {
  const { models } = getDb();
  const rows = await models.Finding.findAll({ where: { auditRunId: runId, kind: 'stress', ...where }, order: [['id', 'ASC']] });
  return rows
    .map((r) => r.figures as { finding?: Finding; stripId?: string | null })
    .filter((f): f is { finding: Finding; stripId: string | null } => f.finding !== undefined)
    .map((f) => ({ finding: f.finding, stripId: f.stripId ?? null }));
}

type ChannelModel = { id: number; guardOverrides: unknown };

/** The channel's guard and the assumptions as the run froze them; without a run, as they stand now. */
async function auditedGuard(
  projectId: number,
  runId: number | null,
  channel: ChannelModel,
  recipe: { guard: unknown } | null,
): Promise<{ guard: Guard | null; overrides: GuardOverrides | null; settings: ProjectSnapshot['settings'] }> {
  const snapshot = runId !== null ? await getRunSnapshot(projectId, runId) : null;
  let guard: Guard | null = null;
  let overrides: GuardOverrides | null = (channel.guardOverrides as GuardOverrides | null) ?? null;
  const frozen = snapshot?.channels.find((c) => c.id === String(channel.id));
  if (frozen) {
    overrides = frozen.guardOverrides ?? null;
    const frozenRecipe = snapshot!.guards.find((g) => g.id === frozen.guardRecipeId);
    if (frozenRecipe) guard = applyGuardOverrides(frozenRecipe.guard, overrides).guard;
  } else if (recipe) {
    guard = applyGuardOverrides(recipe.guard as Guard, overrides).guard;
  }
  const settings = snapshot?.settings ?? (await buildProjectSnapshot(projectId)).settings;
  return { guard, overrides, settings };
}

/**
 * The sizing remedies for a channel under every case of the latest run (empty when it holds,
 * has no guard or no run). Separate from the page's data: the sizing re-solves every case for
 * each candidate and can take seconds, so the page does not wait for it. The caller has
 * checked the user's access to the project (route wrapper).
 */
export async function getChannelRemedies(projectId: number, channelId: number): Promise<RemedyOptionData[]> {
  const { models } = getDb();
  const channel = await models.Channel.findOne({ where: { id: channelId, projectId } });
  if (!channel) throw new NotFoundError(`Channel ${channelId} not found in this project.`);
  const runId = await latestRunId(projectId);
  if (runId === null) return [];
  const recipe = channel.guardRecipeId != null ? await models.GuardRecipe.findByPk(channel.guardRecipeId, { attributes: ['id', 'guard'] }) : null;
  const { guard, settings } = await auditedGuard(projectId, runId, channel, recipe);
  const findings = (await runFindings(runId, { channelId })).map((s) => s.finding);
  if (!guard || findings.every((f) => f.verdict === 'holds')) return [];
  return remedyOptions(
    guard,
    findings.filter((f) => f.stress).map((f) => ({ stress: f.stress!, appliedTo: f.appliedTo })),
    conditionsOf(settings),
  );
}

/** The channel page's data, or null when the user may not read the project's audit or the channel is not in it. */
export async function getChannelDetail(user: ActingUser, projectId: number, channelId: number): Promise<ChannelDetail | null> {
  const standing = await loadStanding(user, projectId);
  if (!standing || !can(standing, 'audit:read')) return null;
  const { models } = getDb();
  const channel = await models.Channel.findOne({ where: { id: channelId, projectId } });
  if (!channel) return null;
  const cabinet = await models.Cabinet.findByPk(channel.cabinetId, { attributes: ['id', 'tag'] });
  const recipe = channel.guardRecipeId != null ? await models.GuardRecipe.findByPk(channel.guardRecipeId, { attributes: ['id', 'name', 'guard'] }) : null;

  const runId = await latestRunId(projectId);
  const status = runId !== null ? await getAuditStatus(projectId) : null;
  const { guard, overrides, settings } = await auditedGuard(projectId, runId, channel, recipe);
  const conditions = conditionsOf(settings);

  const stored = runId !== null ? await runFindings(runId, { channelId }) : [];
  const findings = stored.map((s) => s.finding);
  const waveforms: Record<string, Waveform> = {};
  const cases: ChannelCaseView[] = findings.map((finding) => {
    if (!guard || !finding.stress || finding.elements.length === 0) return { finding, waveformKey: null };
    const key = `${JSON.stringify(finding.stress)}|${finding.appliedTo}`;
    if (!waveforms[key]) {
      try {
        const solved = solveStress(guard, finding.stress, conditions[finding.appliedTo], { waveform: true, maxWaveformPoints: WAVEFORM_POINTS });
        if (solved.waveform) waveforms[key] = solved.waveform;
      } catch {
        return { finding, waveformKey: null };
      }
    }
    return { finding, waveformKey: waveforms[key] ? key : null };
  });
  let worst: Verdict | undefined;
  for (const f of findings) worst = worse(worst, f.verdict);

  // The strips the channel and its hazards sit on, as they stand now.
  const involved = new Set<number>();
  for (const id of [channel.signalTerminalId, channel.returnTerminalId]) if (id != null) involved.add(id);
  for (const f of findings) if (f.exposure) involved.add(Number(f.exposure.hazardTerminalId));
  const stripIdRows = involved.size
    ? await models.Terminal.findAll({ where: { id: { [Op.in]: [...involved] } }, attributes: ['stripId'] })
    : [];
  const stripIds = [...new Set(stripIdRows.map((t) => t.stripId))];
  const strips = await stripViews(stripIds);
  const terminals = await terminalsOfStrips(projectId, stripIds);

  const verdicts: Record<number, Verdict> = {};
  const exposures: OverlayExposure[] = [];
  const seen = new Set<string>();
  for (const f of findings) {
    if (!f.exposure) continue;
    const from = Number(f.exposure.hazardTerminalId);
    const to = Number(f.exposure.targetTerminalId);
    verdicts[from] = worse(verdicts[from], f.verdict);
    verdicts[to] = worse(verdicts[to], f.verdict);
    const k = `${from}-${to}-${f.exposure.mechanism}`;
    if (!seen.has(k)) {
      seen.add(k);
      exposures.push({ from, to, mechanism: f.exposure.mechanism, likelihood: f.exposure.likelihood });
    }
  }
  for (const id of [channel.signalTerminalId, channel.returnTerminalId]) if (id != null && worst) verdicts[id] = worse(verdicts[id], worst);

  return {
    projectId,
    standing,
    channel: {
      id: channel.id,
      tag: channel.tag,
      name: channel.name,
      signalType: channel.signalType,
      cabinetId: channel.cabinetId,
      cabinetTag: cabinet?.tag ?? '',
      guardRecipeName: recipe?.name ?? null,
      overrides,
      signalTerminalId: channel.signalTerminalId,
      returnTerminalId: channel.returnTerminalId,
    },
    run: runId !== null ? { id: runId, stale: status?.stale ?? false } : null,
    guard,
    overriddenIds: Object.keys(overrides?.elements ?? {}),
    conditions,
    settings,
    worstVerdict: worst ?? null,
    cases,
    waveforms,
    strips,
    terminals,
    verdicts,
    exposures,
  };
}

export interface StripOverlay {
  projectId: number;
  standing: ProjectStanding;
  strip: StripView;
  cabinetTag: string;
  terminals: TerminalView[];
  run: { id: number; stale: boolean } | null;
  verdicts: Record<number, Verdict>;
  exposures: OverlayExposure[];
  /** Per channel on the strip: worst verdict and the finding that decides it. */
  channels: { channelId: number; tag: string; verdict: Verdict; reason: string }[];
  checks: CheckFinding[];
  /** The re-sequencing proposal for the strip as it stands, with what applying it needs (fingerprint, versions). */
  proposal: ResequenceView | null;
  proposalError: string | null;
}

/** One strip coloured by the latest run's verdicts, with its exposure lines and the re-sequencing proposal. */
export async function getStripOverlay(user: ActingUser, projectId: number, stripId: number): Promise<StripOverlay | null> {
  const standing = await loadStanding(user, projectId);
  if (!standing || !can(standing, 'audit:read')) return null;
  const { models } = getDb();
  const strip = await models.Strip.findByPk(stripId);
  if (!strip) return null;
  const cabinet = await models.Cabinet.findOne({ where: { id: strip.cabinetId, projectId }, attributes: ['id', 'tag'] });
  if (!cabinet) return null;
  const [view] = await stripViews([stripId]);
  const terminals = await terminalsOfStrips(projectId, [stripId]);
  const onStrip = new Set(terminals.map((t) => t.id));

  const runId = await latestRunId(projectId);
  const status = runId !== null ? await getAuditStatus(projectId) : null;
  const verdicts: Record<number, Verdict> = {};
  const exposures: OverlayExposure[] = [];
  const channelWorst = new Map<number, { tag: string; verdict: Verdict; reason: string }>();
  let checks: CheckFinding[] = [];
  if (runId !== null) {
    const channelIds = [...new Set(terminals.map((t) => t.channelId).filter((c): c is number => c != null))];
    const rows = channelIds.length
      ? await models.Finding.findAll({ where: { auditRunId: runId, kind: 'stress', channelId: { [Op.in]: channelIds } } })
      : [];
    const seen = new Set<string>();
    for (const r of rows) {
      const f = (r.figures as { finding?: Finding }).finding;
      if (!f) continue;
      const cw = channelWorst.get(r.channelId!);
      if (!cw || VERDICT_SEVERITY[f.verdict] > VERDICT_SEVERITY[cw.verdict]) channelWorst.set(r.channelId!, { tag: f.channelTag, verdict: f.verdict, reason: f.reason });
      if (!f.exposure) continue;
      const from = Number(f.exposure.hazardTerminalId);
      const to = Number(f.exposure.targetTerminalId);
      if (onStrip.has(to)) verdicts[to] = worse(verdicts[to], f.verdict);
      if (onStrip.has(from)) verdicts[from] = worse(verdicts[from], f.verdict);
      const k = `${from}-${to}-${f.exposure.mechanism}`;
      if (!seen.has(k) && onStrip.has(from) && onStrip.has(to)) {
        seen.add(k);
        exposures.push({ from, to, mechanism: f.exposure.mechanism, likelihood: f.exposure.likelihood });
      }
    }
    for (const t of terminals) {
      const cw = t.channelId != null ? channelWorst.get(t.channelId) : undefined;
      if (cw) verdicts[t.id] = worse(verdicts[t.id], cw.verdict);
    }
    const checkRows = await models.Finding.findAll({ where: { auditRunId: runId, kind: { [Op.in]: ['segregation', 'colour'] } } });
    checks = checkRows
      .map((r) => (r.figures as { check?: CheckFinding }).check)
      .filter((c): c is CheckFinding => c !== undefined && String(c.stripId) === String(stripId));
  }

  // The proposal from the schedule as it stands (what "Apply" would change).
  let proposal: ResequenceView | null = null;
  let proposalError: string | null = null;
  try {
    proposal = await proposeForStrip(projectId, stripId);
  } catch (err) {
    proposalError = err instanceof Error ? err.message : String(err);
  }

  return {
    projectId,
    standing,
    strip: view!,
    cabinetTag: cabinet.tag,
    terminals,
    run: runId !== null ? { id: runId, stale: status?.stale ?? false } : null,
    verdicts,
    exposures,
    channels: [...channelWorst.entries()].map(([channelId, w]) => ({ channelId, ...w })).sort((a, b) => VERDICT_SEVERITY[b.verdict] - VERDICT_SEVERITY[a.verdict] || a.tag.localeCompare(b.tag)),
    checks,
    proposal,
    proposalError,
  };
}
