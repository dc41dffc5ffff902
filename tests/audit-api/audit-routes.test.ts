import { NextRequest } from 'next/server';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Models } from '@/models';
import type { FreshDb } from '../models/fresh-db';
import { demoProject } from './demo-project';

const session = vi.hoisted(() => ({ userId: null as number | null }));
vi.mock('@/lib/auth/session', () => ({ currentUserId: async () => session.userId }));

const runs = await import('@/app/api/projects/[projectId]/audits/route');
const one = await import('@/app/api/projects/[projectId]/audits/[runId]/route');
const findings = await import('@/app/api/projects/[projectId]/audits/[runId]/findings/route');
const csv = await import('@/app/api/projects/[projectId]/audits/[runId]/findings.csv/route');
const status = await import('@/app/api/projects/[projectId]/audits/latest/status/route');
const exposures = await import('@/app/api/projects/[projectId]/exposures/route');

let db: FreshDb;
let m: Models;
let projectId = 0;
let userId: Record<string, number> = {};

beforeAll(async () => {
  ({ db, projectId, userId } = await demoProject());
  m = db.models;
}, 120_000);
afterAll(async () => db.cleanup());

const ctx = (params: Record<string, string> = {}) => ({
  params: Promise.resolve({ projectId: String(projectId), ...params }),
});
const url = (path: string) => new NextRequest(`http://test/api/projects/${projectId}${path}`);

async function runAudit(as: string) {
  session.userId = userId[as];
  const res = await runs.POST(
    new NextRequest(`http://test/api/projects/${projectId}/audits`, { method: 'POST' }),
    ctx(),
  );
  const text = await res.text();
  const lines = text
    .trim()
    .split('\n')
    .map((l) => JSON.parse(l));
  return { res, lines, done: lines.at(-1) };
}

describe('audit runs through the API', () => {
  let firstRun = 0;

  it('a technician, reviewer or viewer may not run an audit, and no run is stored', async () => {
    for (const role of ['technician', 'reviewer', 'viewer']) {
      session.userId = userId[role];
      const res = await runs.POST(
        new NextRequest(`http://test/api/projects/${projectId}/audits`, { method: 'POST' }),
        ctx(),
      );
      expect(res.status).toBe(403);
    }
    expect(await m.AuditRun.count()).toBe(0);
  });

  it('an engineer runs it and sees progress, then the stored run', async () => {
    const { res, lines, done } = await runAudit('engineer');
    expect(res.headers.get('content-type')).toContain('application/x-ndjson');
    expect(lines.filter((l) => l.type === 'progress').length).toBeGreaterThan(2);
    expect(new Set(lines.filter((l) => l.type === 'progress').map((l) => l.phase))).toEqual(
      new Set(['loading', 'exposures', 'stress', 'checks', 'saving', 'done']),
    );
    expect(done.type).toBe('done');
    expect(done.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(done.delta).toBeNull();
    firstRun = done.runId;
    const stored = await m.AuditRun.findByPk(firstRun);
    expect(stored?.status).toBe('done');
    expect(stored?.inputHash).toBe(done.hash);
  });

  it('the demo audit produces every verdict class and every exposure mechanism', async () => {
    session.userId = userId.viewer;
    const res = await one.GET(url(`/audits/${firstRun}`), ctx({ runId: String(firstRun) }));
    expect(res.status).toBe(200);
    const body = await res.json();
    const byVerdict = body.run.summary.findingsByVerdict;
    for (const v of ['holds', 'marginal', 'fails', 'unprotected', 'incomplete'])
      expect(byVerdict[v], v).toBeGreaterThan(0);
    const byMechanism = body.run.summary.exposuresByMechanism;
    for (const k of ['neighbour', 'stacked', 'same-cable', 'look-alike', 'bridge'])
      expect(byMechanism[k], k).toBeGreaterThan(0);
    expect(body.channels.length).toBeGreaterThanOrEqual(40);
  });

  it('findings filter by verdict and sort worst margin first', async () => {
    session.userId = userId.reviewer;
    const res = await findings.GET(
      url(`/audits/${firstRun}/findings?verdict=fails,marginal&kind=stress&sort=margin`),
      ctx({ runId: String(firstRun) }),
    );
    const body = await res.json();
    expect(body.total).toBeGreaterThan(0);
    expect(
      body.items.every((f: { verdict: string }) => ['fails', 'marginal'].includes(f.verdict)),
    ).toBe(true);
    const margins = body.items
      .map((f: { margin: number | null }) => f.margin)
      .filter((x: number | null) => x !== null);
    expect(margins).toEqual([...margins].sort((a: number, b: number) => a - b));
    expect(
      body.items.every(
        (f: { channelTag: string | null; kind: string }) => f.kind === 'stress' && f.channelTag,
      ),
    ).toBe(true);
  });

  it('the transient filter selects the project-wide surge and ESD findings', async () => {
    session.userId = userId.reviewer;
    const res = await findings.GET(
      url(`/audits/${firstRun}/findings?mechanism=transient&pageSize=2000`),
      ctx({ runId: String(firstRun) }),
    );
    const body = await res.json();
    expect(body.total).toBeGreaterThan(0);
    expect(
      body.items.every(
        (f: { caseKind: string; mechanism: string }) =>
          ['surge', 'esd'].includes(f.caseKind) && f.mechanism === 'transient',
      ),
    ).toBe(true);
  });

  it('a bad filter gets 422 naming it; an unknown run 404', async () => {
    session.userId = userId.reviewer;
    const bad = await findings.GET(
      url(`/audits/${firstRun}/findings?verdict=broken`),
      ctx({ runId: String(firstRun) }),
    );
    expect(bad.status).toBe(422);
    expect((await bad.json()).error).toMatch(/verdict/);
    const missing = await one.GET(url('/audits/99999'), ctx({ runId: '99999' }));
    expect(missing.status).toBe(404);
  });

  it('exports the findings as CSV', async () => {
    session.userId = userId.viewer;
    const res = await csv.GET(
      url(`/audits/${firstRun}/findings.csv`),
      ctx({ runId: String(firstRun) }),
    );
    expect(res.headers.get('content-type')).toContain('text/csv');
    const text = await res.text();
    expect(text.split('\n')[0]).toContain('verdict,kind,channel,cabinet,strip,case');
  });

  it('the same inputs give the same hash; the latest run is not stale', async () => {
    const again = await runAudit('engineer');
    expect(again.done.hash).toBe((await m.AuditRun.findByPk(firstRun))!.inputHash);
    expect(again.done.delta).toMatchObject({
      inputsChanged: false,
      newFindings: 0,
      resolvedFindings: 0,
      changedFindings: 0,
    });
    session.userId = userId.viewer;
    const s = await (await status.GET(url('/audits/latest/status'), ctx())).json();
    expect(s).toMatchObject({ latestRunId: again.done.runId, stale: false });
  });

  it('changing one terminal makes the schedule stale, changes the hash, and the delta names the change', async () => {
    // Move a hazard's voltage: the terminal next to a sensor input that carries 230 V.
    const hazard = await m.Terminal.findOne({
      where: { circuitClass: 'hazard', hazardKind: 'mains-line' },
    });
    expect(hazard).not.toBeNull();
    await hazard!.update({ nominalVoltage: 400 });
    session.userId = userId.viewer;
    const s = await (await status.GET(url('/audits/latest/status'), ctx())).json();
    expect(s.stale).toBe(true);
    expect(JSON.stringify(s.changes)).toContain(hazard!.label);

    const after = await runAudit('engineer');
    expect(after.done.hash).not.toBe((await m.AuditRun.findByPk(firstRun))!.inputHash);
    expect(after.done.delta.inputsChanged).toBe(true);
    expect(
      after.done.delta.changedFindings +
        after.done.delta.newFindings +
        after.done.delta.resolvedFindings,
    ).toBeGreaterThan(0);
    session.userId = userId.viewer;
    const detail = await (
      await one.GET(url(`/audits/${after.done.runId}`), ctx({ runId: String(after.done.runId) }))
    ).json();
    const touched = [
      ...detail.delta.changed.map((c: { key: string }) => c.key),
      ...detail.delta.newKeys,
    ];
    expect(touched.some((k: string) => k.includes(hazard!.label))).toBe(true);
  });

  it('lists the current exposures with labels', async () => {
    session.userId = userId.technician;
    const body = await (await exposures.GET(url('/exposures'), ctx())).json();
    expect(body.targets.length).toBeGreaterThan(0);
    expect(body.terminals.length).toBeGreaterThan(100);
  });
});
