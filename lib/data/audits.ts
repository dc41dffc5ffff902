import { Op, type WhereOptions } from 'sequelize';
import { diffAudits, diffSnapshots, runAudit, snapshotHash, type SnapshotChange } from '@/lib/audit';
import type { AuditProgress, AuditResult, AuditSummary, ChannelAudit, Finding, ProjectSnapshot } from '@/lib/audit/types';
import type { CheckFinding } from '@/lib/exposure/types';
import type { Verdict } from '@/lib/stress/types';
import type { ProjectActor } from '@/lib/auth/guard';
import { getDb } from '@/lib/db';
import { NotFoundError } from '@/lib/errors';
import { logAction } from './audit-log';
import { buildProjectSnapshot } from './audit-snapshot';

/** What an audit run keeps besides its findings rows (AuditRun.summary). */
export interface StoredRunSummary extends AuditSummary {
  auditVersion: string;
  channelsAudit: ChannelAudit[];
  checks: CheckFinding[];
  /** Channels left out because no signal terminal is mapped: they are not audited. */
  unmappedChannels: { id: string; tag: string }[];
  delta: DeltaKeys | null;
}

export interface DeltaCounts {
  previousRunId: number | null;
  inputsChanged: boolean;
  newFindings: number;
  resolvedFindings: number;
  changedFindings: number;
  newChecks: number;
  resolvedChecks: number;
}

export interface DeltaKeys extends DeltaCounts {
  newKeys: string[];
  resolvedKeys: string[];
  changed: { key: string; before: { verdict: Verdict; margin: number | null }; after: { verdict: Verdict; margin: number | null } }[];
}

export interface AuditRunInfo {
  id: number;
  createdAt: string;
  createdBy: { id: number; name: string } | null;
  status: string;
  inputHash: string | null;
  reviewState: string;
  summary: AuditSummary | null;
  isLatest: boolean;
}

export type RunProgress = (AuditProgress | { phase: 'loading' | 'saving'; done: number; total: number }) & {
  phase: string;
};

const SAVE_CHUNK = 500;
const FAILING: Verdict[] = ['fails', 'unprotected'];

/** Findings of a run, rebuilt from rows (for deltas); checks come from the summary. */
async function loadRunResult(runId: number): Promise<Pick<AuditResult, 'hash' | 'findings' | 'checks'> | null> {
  const { models } = getDb();
  const run = await models.AuditRun.findByPk(runId);
  if (!run || run.status !== 'done') return null;
  const rows = await models.Finding.findAll({ where: { auditRunId: runId, kind: 'stress' }, attributes: ['key', 'verdict', 'margin', 'figures'] });
  const summary = run.summary as StoredRunSummary | null;
  return {
    hash: run.inputHash ?? '',
    findings: rows.map((r) => (r.figures as { finding: Finding }).finding),
    checks: summary?.checks ?? [],
  };
}

function deltaKeys(previousRunId: number | null, delta: ReturnType<typeof diffAudits> | null): DeltaKeys | null {
  if (!delta) return null;
  return {
    previousRunId,
    inputsChanged: delta.inputsChanged,
    newFindings: delta.newFindings.length,
    resolvedFindings: delta.resolvedFindings.length,
    changedFindings: delta.changedFindings.length,
    newChecks: delta.newChecks.length,
    resolvedChecks: delta.resolvedChecks.length,
    newKeys: delta.newFindings.map((f) => f.key),
    resolvedKeys: delta.resolvedFindings.map((f) => f.key),
    changed: delta.changedFindings.map((c) => ({ key: c.key, before: c.before, after: c.after })),
  };
}

export function deltaCounts(delta: DeltaKeys | null): DeltaCounts | null {
  if (!delta) return null;
  const { newKeys: _n, resolvedKeys: _r, changed: _c, ...counts } = delta;
  return counts;
}

function numericId(id: string | null | undefined): number | null {
  if (id == null) return null;
  const n = Number(id);
  return Number.isInteger(n) ? n : null;
}

/**
 * Runs the audit of the project as it now stands and stores it as a frozen run: the snapshot,
 * its hash, every finding with its figures, the checks, and the delta against the previous
 * completed run. Progress goes to `onProgress`; a failure is stored on the run and rethrown.
 */
export async function runProjectAudit(
  actor: ProjectActor,
  onProgress: (p: RunProgress) => void = () => {},
): Promise<{ runId: number; hash: string; summary: AuditSummary; delta: DeltaKeys | null }> {
  const { models, sequelize } = getDb();
  const projectId = actor.projectId;
  onProgress({ phase: 'loading', done: 0, total: 1 });
  const snapshot = await buildProjectSnapshot(projectId);
  const allChannels = await models.Channel.findAll({ where: { projectId }, attributes: ['id', 'tag', 'signalTerminalId'] });
  const unmappedChannels = allChannels.filter((c) => c.signalTerminalId == null).map((c) => ({ id: String(c.id), tag: c.tag }));
  onProgress({ phase: 'loading', done: 1, total: 1 });

  const previous = await models.AuditRun.findOne({ where: { projectId, status: 'done' }, order: [['id', 'DESC']] });
  const run = await models.AuditRun.create({
    projectId,
    createdById: actor.user.id,
    status: 'running',
    progress: 0,
    inputHash: null,
    snapshot,
    summary: null,
    error: null,
    startedAt: new Date(),
    finishedAt: null,
    signedById: null,
    signedAt: null,
  });

  try {
    const result = runAudit(snapshot, { onProgress });
    const before = previous ? await loadRunResult(previous.id) : null;
    const delta = deltaKeys(previous?.id ?? null, before ? diffAudits(before, result) : null);

    const stripOf = new Map(snapshot.terminals.map((t) => [t.id, t.stripId]));
    const rows = [
      ...result.findings.map((f) => ({
        auditRunId: run.id,
        channelId: numericId(f.channelId),
        kind: 'stress' as const,
        stressCase: f.caseId,
        mechanism: f.exposure?.mechanism ?? null,
        hazardTerminalId: numericId(f.exposure?.hazardTerminalId),
        verdict: f.verdict,
        reason: f.reason,
        margin: f.margin,
        figures: { finding: f, stripId: stripOf.get(f.exposure?.targetTerminalId ?? '') ?? null },
        key: f.key,
      })),
      ...result.checks.map((c) => ({
        auditRunId: run.id,
        channelId: null,
        kind: c.kind,
        stressCase: null,
        mechanism: null,
        hazardTerminalId: null,
        // A violated rule is reported like a failing part; an advisory like a marginal one.
        verdict: (c.severity === 'violation' ? 'fails' : 'marginal') as Verdict,
        reason: c.message,
        margin: null,
        figures: { check: c, stripId: c.stripId },
        key: c.key,
      })),
    ];

    await sequelize.transaction(async (transaction) => {
      for (let i = 0; i < rows.length; i += SAVE_CHUNK) {
        await models.Finding.bulkCreate(rows.slice(i, i + SAVE_CHUNK), { transaction });
        onProgress({ phase: 'saving', done: Math.min(i + SAVE_CHUNK, rows.length), total: rows.length });
      }
      const summary: StoredRunSummary = {
        ...result.summary,
        auditVersion: result.version,
        channelsAudit: result.channels,
        checks: result.checks,
        unmappedChannels,
        delta,
      };
      await run.update(
        { status: 'done', progress: 1, inputHash: result.hash, summary, finishedAt: new Date() },
        { transaction },
      );
      await logAction(
        {
          actorId: actor.user.id,
          projectId,
          action: 'audit.run',
          entity: 'AuditRun',
          entityId: run.id,
          detail: { hash: result.hash, findings: result.findings.length, delta: deltaCounts(delta) },
        },
        transaction,
      );
    });
    onProgress({ phase: 'done', done: 1, total: 1 });
    return { runId: run.id, hash: result.hash, summary: result.summary, delta };
  } catch (error) {
    await run.update({ status: 'failed', error: error instanceof Error ? error.message : String(error), finishedAt: new Date() });
    throw error;
  }
}

function runInfo(run: InstanceType<ReturnType<typeof getDb>['models']['AuditRun']>, latestId: number | null, names: Map<number, string>): AuditRunInfo {
  const summary = run.summary as StoredRunSummary | null;
  let plain: AuditSummary | null = null;
  if (summary) {
    const { channelsAudit: _a, checks: _c, unmappedChannels: _u, delta: _d, auditVersion: _v, ...rest } = summary;
    plain = rest;
  }
  return {
    id: run.id,
    createdAt: run.createdAt.toISOString(),
    createdBy: run.createdById != null ? { id: run.createdById, name: names.get(run.createdById) ?? 'unknown' } : null,
    status: run.status,
    inputHash: run.inputHash,
    reviewState: run.reviewState,
    summary: plain,
    isLatest: run.id === latestId,
  };
}

async function userNames(ids: (number | null)[]): Promise<Map<number, string>> {
  const { models } = getDb();
  const wanted = [...new Set(ids.filter((i): i is number => i != null))];
  if (wanted.length === 0) return new Map();
  const users = await models.User.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, u.name]));
}

export async function latestRunId(projectId: number): Promise<number | null> {
  const { models } = getDb();
  const run = await models.AuditRun.findOne({ where: { projectId, status: 'done' }, order: [['id', 'DESC']], attributes: ['id'] });
  return run?.id ?? null;
}

export async function listAuditRuns(projectId: number): Promise<AuditRunInfo[]> {
  const { models } = getDb();
  const runs = await models.AuditRun.findAll({
    where: { projectId },
    order: [['id', 'DESC']],
    attributes: { exclude: ['snapshot'] },
  });
  const latest = await latestRunId(projectId);
  const names = await userNames(runs.map((r) => r.createdById));
  return runs.map((r) => runInfo(r, latest, names));
}

async function findRun(projectId: number, runId: number) {
  const { models } = getDb();
  const run = await models.AuditRun.findOne({ where: { id: runId, projectId } });
  if (!run) throw new NotFoundError(`Audit run ${runId} not found in this project.`);
  return run;
}

export interface AuditRunDetail {
  run: AuditRunInfo;
  channels: ChannelAudit[];
  checks: CheckFinding[];
  unmappedChannels: { id: string; tag: string }[];
  delta: DeltaKeys | null;
}

export async function getAuditRun(projectId: number, runId: number): Promise<AuditRunDetail> {
  const run = await findRun(projectId, runId);
  const summary = run.summary as StoredRunSummary | null;
  const names = await userNames([run.createdById]);
  return {
    run: runInfo(run, await latestRunId(projectId), names),
    channels: summary?.channelsAudit ?? [],
    checks: summary?.checks ?? [],
    unmappedChannels: summary?.unmappedChannels ?? [],
    delta: summary?.delta ?? null,
  };
}

/** The frozen inputs of a run (for the channel page, the report and the handover pack). */
export async function getRunSnapshot(projectId: number, runId: number): Promise<ProjectSnapshot> {
  const run = await findRun(projectId, runId);
  return run.snapshot as ProjectSnapshot;
}

export interface AuditStatus {
  latestRunId: number | null;
  stale: boolean;
  currentHash: string;
  changes: SnapshotChange[];
}

/** Whether the schedule or the assumptions changed since the latest completed run, and how. */
export async function getAuditStatus(projectId: number): Promise<AuditStatus> {
  const { models } = getDb();
  const current = await buildProjectSnapshot(projectId);
  const currentHash = snapshotHash(current);
  const latest = await models.AuditRun.findOne({ where: { projectId, status: 'done' }, order: [['id', 'DESC']] });
  if (!latest) return { latestRunId: null, stale: true, currentHash, changes: [] };
  const stale = latest.inputHash !== currentHash;
  return {
    latestRunId: latest.id,
    stale,
    currentHash,
    changes: stale ? diffSnapshots(latest.snapshot as ProjectSnapshot, current) : [],
  };
}

export const FINDING_SORTS = ['margin', 'utilisation', 'channel', 'verdict'] as const;

export interface FindingFilters {
  verdict?: Verdict[];
  mechanism?: string[];
  caseKind?: string[];
  caseId?: string[];
  cabinetId?: number;
  stripId?: number;
  channelId?: number;
  kind?: ('stress' | 'segregation' | 'colour')[];
  sort?: (typeof FINDING_SORTS)[number];
  dir?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
  /** Every match on one page (CSV export). */
  all?: boolean;
}

export interface StoredFinding {
  id: number;
  kind: 'stress' | 'segregation' | 'colour';
  key: string;
  verdict: Verdict;
  reason: string;
  margin: number | null;
  channelId: number | null;
  channelTag: string | null;
  cabinetId: number | null;
  cabinetTag: string | null;
  stripId: number | null;
  stripTag: string | null;
  caseId: string | null;
  caseKind: string | null;
  mechanism: string | null;
  finding: Finding | null;
  check: CheckFinding | null;
}

const SEVERITY: Record<Verdict, number> = { unprotected: 4, fails: 3, incomplete: 2, marginal: 1, holds: 0 };

/** Findings of one run, filtered and sorted; the worst (lowest margin) first by default. */
export async function listFindings(
  projectId: number,
  runId: number,
  filters: FindingFilters = {},
): Promise<{ items: StoredFinding[]; total: number }> {
  const run = await findRun(projectId, runId);
  const snapshot = run.snapshot as ProjectSnapshot;
  const { models } = getDb();
  const where: WhereOptions = { auditRunId: run.id };
  if (filters.verdict?.length) Object.assign(where, { verdict: { [Op.in]: filters.verdict } });
  if (filters.kind?.length) Object.assign(where, { kind: { [Op.in]: filters.kind } });
  if (filters.mechanism?.length) {
    // Project-wide surge and ESD findings have no exposure mechanism: 'transient' selects them.
    const named = filters.mechanism.filter((m) => m !== 'transient');
    const either: WhereOptions[] = [];
    if (named.length) either.push({ mechanism: { [Op.in]: named } });
    if (named.length < filters.mechanism.length) either.push({ mechanism: null, kind: 'stress' });
    Object.assign(where, { [Op.or]: either });
  }
  if (filters.caseId?.length) Object.assign(where, { stressCase: { [Op.in]: filters.caseId } });
  if (filters.channelId) Object.assign(where, { channelId: filters.channelId });
  const rows = await models.Finding.findAll({ where });

  const stripById = new Map(snapshot.strips.map((s) => [s.id, s]));
  const cabinetById = new Map(snapshot.cabinets.map((c) => [c.id, c]));
  const channelById = new Map(snapshot.channels.map((c) => [c.id, c]));
  const terminalById = new Map(snapshot.terminals.map((t) => [t.id, t]));

  let items: StoredFinding[] = rows.map((r) => {
    const figures = r.figures as { finding?: Finding; check?: CheckFinding; stripId?: string | null };
    const finding = figures.finding ?? null;
    const check = figures.check ?? null;
    const channel = r.channelId != null ? channelById.get(String(r.channelId)) : undefined;
    const stripKey =
      figures.stripId ?? (channel ? terminalById.get(channel.signalTerminalId)?.stripId ?? null : null);
    const strip = stripKey ? stripById.get(stripKey) : undefined;
    const cabinet = strip ? cabinetById.get(strip.cabinetId) : undefined;
    return {
      id: r.id,
      kind: r.kind,
      key: r.key,
      verdict: r.verdict,
      reason: r.reason,
      margin: r.margin,
      channelId: r.channelId,
      channelTag: channel?.tag ?? finding?.channelTag ?? null,
      cabinetId: cabinet ? Number(cabinet.id) : null,
      cabinetTag: cabinet?.tag ?? null,
      stripId: strip ? Number(strip.id) : null,
      stripTag: strip?.tag ?? null,
      caseId: r.stressCase,
      caseKind: finding?.stress?.kind ?? null,
      mechanism: r.mechanism ?? (finding && !finding.exposure ? 'transient' : null),
      finding,
      check,
    };
  });
  if (filters.cabinetId) items = items.filter((f) => f.cabinetId === filters.cabinetId);
  if (filters.stripId) items = items.filter((f) => f.stripId === filters.stripId);
  if (filters.caseKind?.length) items = items.filter((f) => f.caseKind && filters.caseKind!.includes(f.caseKind));

  const dir = filters.dir === 'desc' ? -1 : 1;
  const sort = filters.sort ?? 'margin';
  const marginKey = (f: StoredFinding) => (f.margin ?? (FAILING.includes(f.verdict) ? -Infinity : Infinity));
  items.sort((a, b) => {
    let d = 0;
    if (sort === 'margin') d = marginKey(a) - marginKey(b);
    else if (sort === 'utilisation') d = (b.finding?.utilisation ?? 0) - (a.finding?.utilisation ?? 0);
    else if (sort === 'verdict') d = SEVERITY[b.verdict] - SEVERITY[a.verdict];
    else d = (a.channelTag ?? '').localeCompare(b.channelTag ?? '');
    if (Number.isNaN(d)) d = 0;
    return d * dir || SEVERITY[b.verdict] - SEVERITY[a.verdict] || a.key.localeCompare(b.key);
  });
  const total = items.length;
  if (filters.all) return { items, total };
  const pageSize = Math.min(filters.pageSize ?? 200, 2000);
  const page = Math.max(filters.page ?? 1, 1);
  return { items: items.slice((page - 1) * pageSize, page * pageSize), total };
}
