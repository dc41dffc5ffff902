import bcrypt from 'bcryptjs';
import { NextRequest } from 'next/server';
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Models } from '@/models';
import { freshDb, type FreshDb } from '../models/fresh-db';

// Act as whichever user the test names: the session cookie is the only thing faked.
const session = vi.hoisted(() => ({ userId: null as number | null }));
vi.mock('@/lib/auth/session', () => ({ currentUserId: async () => session.userId }));

const { GET, PATCH } = await import('@/app/api/projects/[projectId]/settings/route');

let db: FreshDb;
let m: Models;
const ids: Record<string, number> = {};
let projectId = 0;

beforeAll(async () => {
  db = await freshDb();
  m = db.models;
  const passwordHash = bcrypt.hashSync('test-password', 4);
  const project = await m.Project.create({ name: 'Guard test', code: 'GT-1' });
  projectId = project.id;
  for (const role of ['engineer', 'technician', 'reviewer', 'viewer'] as const) {
    const user = await m.User.create({ email: `${role}@guard.test`, name: role, passwordHash });
    await m.ProjectMember.create({ userId: user.id, projectId, role });
    ids[role] = user.id;
  }
  ids.admin = (
    await m.User.create({ email: 'admin@guard.test', name: 'admin', passwordHash, isAdmin: true })
  ).id;
  ids.outsider = (
    await m.User.create({ email: 'outsider@guard.test', name: 'outsider', passwordHash })
  ).id;
  ids.inactive = (
    await m.User.create({ email: 'gone@guard.test', name: 'gone', passwordHash, active: false })
  ).id;
  await m.ProjectMember.create({ userId: ids.inactive, projectId, role: 'engineer' });
});
afterAll(async () => db.cleanup());
beforeEach(() => {
  session.userId = null;
});

function ctx(id: number | string = projectId) {
  return { params: Promise.resolve({ projectId: String(id) }) };
}

async function current() {
  const res = await GET(new NextRequest(`http://test/api/projects/${projectId}/settings`), ctx());
  return (await res.json()) as Record<string, unknown> & { version: number; ambientC: number };
}

async function patch(body: unknown, id: number | string = projectId) {
  return PATCH(
    new NextRequest(`http://test/api/projects/${id}/settings`, {
      method: 'PATCH',
      body: JSON.stringify(body),
    }),
    ctx(id),
  );
}

async function withRole(role: string) {
  session.userId = ids[role];
  const before = await current();
  return { before, body: { ...before, ambientC: before.ambientC + 1 } };
}

describe('project role wrapper on an engineer-only action (changing the audit assumptions)', () => {
  for (const role of ['technician', 'reviewer', 'viewer']) {
    it(`${role} gets 403 with the reason, and nothing changes`, async () => {
      const { before, body } = await withRole(role);
      const res = await patch(body);
      expect(res.status).toBe(403);
      expect((await res.json()).error).toMatch(
        new RegExp(`Only a project engineer.*Your role on this project: ${role}`),
      );
      expect(await current()).toEqual(before);
    });
  }

  for (const role of ['engineer', 'admin']) {
    it(`${role} may change it, and the version moves on`, async () => {
      const { before, body } = await withRole(role);
      const res = await patch(body);
      expect(res.status).toBe(200);
      const saved = await res.json();
      expect(saved.ambientC).toBe(before.ambientC + 1);
      expect(saved.version).toBe(before.version + 1);
    });
  }

  it('a signed-out request gets 401 and changes nothing', async () => {
    session.userId = ids.engineer;
    const before = await current();
    session.userId = null;
    const res = await patch({ ...before, ambientC: 99 });
    expect(res.status).toBe(401);
    session.userId = ids.engineer;
    expect(await current()).toEqual(before);
  });

  it('a deactivated account is treated as signed out', async () => {
    session.userId = ids.inactive;
    expect((await patch({})).status).toBe(401);
  });

  it('a user who is not a member gets 404, revealing nothing about the project', async () => {
    session.userId = ids.outsider;
    const res = await patch({});
    expect(res.status).toBe(404);
  });

  it('an unknown project gets 404 and a malformed id 422', async () => {
    session.userId = ids.engineer;
    expect((await patch({}, 999_999)).status).toBe(404);
    expect((await patch({}, 'abc')).status).toBe(422);
  });

  it('bad input gets 422 naming the field, and nothing changes', async () => {
    const { before } = await withRole('engineer');
    const res = await patch({ ...before, supplyTolerance: 2, frequency: 55 });
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors)).toEqual(
      expect.arrayContaining(['supplyTolerance', 'frequency']),
    );
    expect(body.fieldErrors.frequency[0]).toMatch(/50 or 60/);
    expect(await current()).toEqual(before);
  });

  it('a body that is not JSON gets 400, not a crash', async () => {
    session.userId = ids.engineer;
    const res = await PATCH(
      new NextRequest(`http://test/api/projects/${projectId}/settings`, {
        method: 'PATCH',
        body: '{"ambientC": ',
      }),
      ctx(),
    );
    expect(res.status).toBe(400);
  });

  it('a stale version gets 409 with the current record, and the later edit is not applied', async () => {
    const { before, body } = await withRole('engineer');
    expect((await patch(body)).status).toBe(200);
    const res = await patch({ ...before, ambientC: 12 });
    expect(res.status).toBe(409);
    const conflict = await res.json();
    expect(conflict.current.version).toBe(before.version + 1);
    expect((await current()).ambientC).toBe(before.ambientC + 1);
  });

  it('every accepted change is in the append-only audit log', async () => {
    const entries = await m.AuditLog.findAll({ where: { projectId, action: 'settings.update' } });
    expect(entries.length).toBeGreaterThanOrEqual(3);
  });
});
