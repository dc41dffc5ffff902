import { NextRequest } from 'next/server';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { mapExposures } from '@/lib/exposure';
import { buildProjectSnapshot } from '@/lib/data/audit-snapshot';
import type { Models } from '@/models';
import type { FreshDb } from '../models/fresh-db';
import { demoProject } from './demo-project';

const session = vi.hoisted(() => ({ userId: null as number | null }));
vi.mock('@/lib/auth/session', () => ({ currentUserId: async () => session.userId }));

const propose = await import('@/app/api/projects/[projectId]/strips/[stripId]/resequence/route');
const apply =
  await import('@/app/api/projects/[projectId]/strips/[stripId]/resequence/apply/route');

let db: FreshDb;
let m: Models;
let projectId = 0;
let userId: Record<string, number> = {};

beforeAll(async () => {
  ({ db, projectId, userId } = await demoProject());
  m = db.models;
}, 120_000);
afterAll(async () => db.cleanup());

const ctx = (stripId: number) => ({
  params: Promise.resolve({ projectId: String(projectId), stripId: String(stripId) }),
});
const post = (path: string, body: unknown) =>
  new NextRequest(`http://test/api/projects/${projectId}${path}`, {
    method: 'POST',
    body: JSON.stringify(body),
  });

/** Neighbour and bridge exposures on one strip, counted by the mapping itself. */
async function stripExposures(stripId: number): Promise<number> {
  const snapshot = await buildProjectSnapshot(projectId);
  const onStrip = new Set(
    snapshot.terminals.filter((t) => t.stripId === String(stripId)).map((t) => t.id),
  );
  return mapExposures(snapshot)
    .targets.filter((t) => onStrip.has(t.terminalId))
    .flatMap((t) => t.exposures)
    .filter(
      (e) =>
        onStrip.has(e.hazardTerminalId) &&
        (e.mechanism === 'neighbour' || e.mechanism === 'bridge'),
    ).length;
}

describe('strip re-sequencing through the API', () => {
  let stripId = 0;
  let proposal: {
    fingerprint: string;
    versions: Record<string, number>;
    changed: boolean;
    before: { exposures: number };
    after: { exposures: number };
  };

  it('finds a demo strip where a mains terminal sits beside a sensor input, and proposes a better order without writing', async () => {
    const strips = await m.Strip.findAll({ order: [['id', 'ASC']] });
    session.userId = userId.reviewer;
    for (const s of strips) {
      const res = await propose.POST(post(`/strips/${s.id}/resequence`, {}), ctx(s.id));
      if (res.status !== 200) continue;
      const body = await res.json();
      if (body.changed && body.after.exposures < body.before.exposures) {
        stripId = s.id;
        proposal = body;
        break;
      }
    }
    expect(stripId).toBeGreaterThan(0);
    expect(await m.AuditLog.count({ where: { action: 'strip.resequence' } })).toBe(0);
  });

  it('a technician may not apply it, and nothing moves', async () => {
    session.userId = userId.technician;
    const before = await stripExposures(stripId);
    const res = await apply.POST(
      post(`/strips/${stripId}/resequence/apply`, {
        fingerprint: proposal.fingerprint,
        versions: proposal.versions,
      }),
      ctx(stripId),
    );
    expect(res.status).toBe(403);
    expect(await stripExposures(stripId)).toBe(before);
  });

  it('applying a proposal the engineer did not see is refused with 409', async () => {
    session.userId = userId.engineer;
    const res = await apply.POST(
      post(`/strips/${stripId}/resequence/apply`, {
        fingerprint: 'not-this-one',
        versions: proposal.versions,
      }),
      ctx(stripId),
    );
    expect(res.status).toBe(409);
  });

  it('the engineer applies it: the strip then has the exposure count the proposal promised, and the change is logged', async () => {
    session.userId = userId.engineer;
    const res = await apply.POST(
      post(`/strips/${stripId}/resequence/apply`, {
        fingerprint: proposal.fingerprint,
        versions: proposal.versions,
      }),
      ctx(stripId),
    );
    expect(res.status).toBe(200);
    expect(await stripExposures(stripId)).toBe(proposal.after.exposures);
    expect(
      await m.AuditLog.count({ where: { action: 'strip.resequence', entityId: stripId } }),
    ).toBe(1);
  });

  it('an unknown strip is 404', async () => {
    session.userId = userId.engineer;
    expect((await propose.POST(post('/strips/99999/resequence', {}), ctx(99999))).status).toBe(404);
  });
});
