/**
 * Who may read and write the schedule (DESIGN.md §1: engineers and administrators write,
 * every other project role reads), and what a refused or misdirected request gets.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { actAs, call, setupWorld, snapshot, teardownWorld, type World } from './helpers';

vi.mock('@/lib/auth/session', async () => (await import('./helpers')).sessionMock());

const cabinets = await import('@/app/api/projects/[projectId]/cabinets/route');
const cabinet = await import('@/app/api/projects/[projectId]/cabinets/[cabinetId]/route');
const strips = await import('@/app/api/projects/[projectId]/cabinets/[cabinetId]/strips/route');
const strip = await import('@/app/api/projects/[projectId]/strips/[stripId]/route');
const cabinetTerminals =
  await import('@/app/api/projects/[projectId]/cabinets/[cabinetId]/terminals/route');
const terminals = await import('@/app/api/projects/[projectId]/terminals/route');
const terminal = await import('@/app/api/projects/[projectId]/terminals/[terminalId]/route');
const channels = await import('@/app/api/projects/[projectId]/channels/route');
const channel = await import('@/app/api/projects/[projectId]/channels/[channelId]/route');
const recipes = await import('@/app/api/projects/[projectId]/guard-recipes/route');
const recipe = await import('@/app/api/projects/[projectId]/guard-recipes/[recipeId]/route');
const importRoute =
  await import('@/app/api/projects/[projectId]/cabinets/[cabinetId]/import/route');

let w: World;
beforeAll(async () => {
  w = await setupWorld();
});
afterAll(() => teardownWorld(w));

/** Every write the contract offers, each with a body that an engineer's request would pass. */
function writes(world: World) {
  const p = { projectId: world.projectId };
  const csv = new FormData();
  csv.set(
    'file',
    new File(['strip,position,label,circuit_class\nX9,1,X9:1,spare\n'], 'schedule.csv', {
      type: 'text/csv',
    }),
  );
  csv.set('mode', 'commit');
  return [
    {
      name: 'POST cabinets',
      run: () => call(cabinets.POST, { params: p, body: { tag: '+NEW', name: 'New' } }),
    },
    {
      name: 'PATCH cabinet',
      run: () =>
        call(cabinet.PATCH, {
          method: 'PATCH',
          params: { ...p, cabinetId: world.cabinetId },
          body: { version: 0, name: 'Renamed' },
        }),
    },
    {
      name: 'DELETE cabinet',
      run: () =>
        call(cabinet.DELETE, {
          method: 'DELETE',
          params: { ...p, cabinetId: world.cabinetId },
          query: { version: 0 },
        }),
    },
    {
      name: 'POST strips',
      run: () =>
        call(strips.POST, { params: { ...p, cabinetId: world.cabinetId }, body: { tag: 'X7' } }),
    },
    {
      name: 'PATCH strip',
      run: () =>
        call(strip.PATCH, {
          method: 'PATCH',
          params: { ...p, stripId: world.stripId },
          body: { version: 0, name: 'Field I/O' },
        }),
    },
    {
      name: 'DELETE strip',
      run: () =>
        call(strip.DELETE, {
          method: 'DELETE',
          params: { ...p, stripId: world.stripId },
          query: { version: 0 },
        }),
    },
    {
      name: 'POST terminals',
      run: () =>
        call(terminals.POST, {
          params: p,
          body: { stripId: world.stripId, position: 9, label: 'X2:9', circuitClass: 'spare' },
        }),
    },
    {
      name: 'PATCH terminals (bulk)',
      run: () =>
        call(terminals.PATCH, {
          method: 'PATCH',
          params: p,
          body: { updates: [{ id: world.terminalIds[1], version: 0, changes: { notes: 'x' } }] },
        }),
    },
    {
      name: 'PATCH terminal',
      run: () =>
        call(terminal.PATCH, {
          method: 'PATCH',
          params: { ...p, terminalId: world.terminalIds[1] },
          body: { version: 0, notes: 'x' },
        }),
    },
    {
      name: 'DELETE terminal',
      run: () =>
        call(terminal.DELETE, {
          method: 'DELETE',
          params: { ...p, terminalId: world.terminalIds[1] },
          query: { version: 0 },
        }),
    },
    {
      name: 'POST channels',
      run: () =>
        call(channels.POST, {
          params: p,
          body: { cabinetId: world.cabinetId, tag: 'TT-1', signalType: 'rtd' },
        }),
    },
    {
      name: 'PATCH channel',
      run: () =>
        call(channel.PATCH, {
          method: 'PATCH',
          params: { ...p, channelId: world.channelId },
          body: { version: 0, name: 'x' },
        }),
    },
    {
      name: 'DELETE channel',
      run: () =>
        call(channel.DELETE, {
          method: 'DELETE',
          params: { ...p, channelId: world.channelId },
          query: { version: 0 },
        }),
    },
    {
      name: 'POST guard-recipes',
      run: () =>
        call(recipes.POST, {
          params: p,
          body: {
            name: 'New guard',
            guard: {
              stages: [],
              input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3 },
            },
          },
        }),
    },
    {
      name: 'PATCH guard-recipe',
      run: () =>
        call(recipe.PATCH, {
          method: 'PATCH',
          params: { ...p, recipeId: world.recipeId },
          body: { version: 0, description: 'x' },
        }),
    },
    {
      name: 'DELETE guard-recipe',
      run: () =>
        call(recipe.DELETE, {
          method: 'DELETE',
          params: { ...p, recipeId: world.recipeId },
          query: { version: 0 },
        }),
    },
    {
      name: 'POST import (commit)',
      run: () =>
        call(importRoute.POST, { params: { ...p, cabinetId: world.cabinetId }, form: csv }),
    },
  ];
}

describe('schedule writes are refused to every role but engineer and administrator', () => {
  for (const role of ['technician', 'reviewer', 'viewer'] as const) {
    it(`${role}: 403 on every write, and nothing changes`, async () => {
      const before = await snapshot();
      actAs(w.users[role]);
      for (const write of writes(w)) {
        const { status, body } = await write.run();
        expect({ write: write.name, status }).toEqual({ write: write.name, status: 403 });
        expect(body.error).toMatch(/engineer or an administrator/);
      }
      expect(await snapshot()).toEqual(before);
    });
  }

  it('signed out: 401 on every write and on reads, nothing changes', async () => {
    const before = await snapshot();
    actAs(null);
    for (const write of writes(w)) {
      const { status } = await write.run();
      expect({ write: write.name, status }).toEqual({ write: write.name, status: 401 });
    }
    const read = await call(cabinets.GET, { method: 'GET', params: { projectId: w.projectId } });
    expect(read.status).toBe(401);
    expect(await snapshot()).toEqual(before);
  });

  it('a user who is not a member of the project gets 404 for the project, reads included', async () => {
    actAs(w.users.outsider);
    const read = await call(cabinets.GET, { method: 'GET', params: { projectId: w.projectId } });
    expect(read.status).toBe(404);
    const write = await call(cabinets.POST, {
      params: { projectId: w.projectId },
      body: { tag: '+X', name: 'x' },
    });
    expect(write.status).toBe(404);
  });
});

describe('reads are open to every project role', () => {
  for (const role of ['engineer', 'technician', 'reviewer', 'viewer', 'admin'] as const) {
    it(`${role} reads cabinets, strips, terminals, channels and recipes`, async () => {
      actAs(w.users[role]);
      const p = { projectId: w.projectId };
      const c = await call(cabinets.GET, { method: 'GET', params: p });
      expect(c.status).toBe(200);
      expect(c.body.items).toEqual([
        expect.objectContaining({ tag: '+BH1', stripCount: 1, terminalCount: 4, channelCount: 1 }),
      ]);
      const s = await call(strips.GET, { method: 'GET', params: { ...p, cabinetId: w.cabinetId } });
      expect(s.body.items).toEqual([expect.objectContaining({ tag: 'X2', terminalCount: 4 })]);
      const t = await call(cabinetTerminals.GET, {
        method: 'GET',
        params: { ...p, cabinetId: w.cabinetId },
      });
      expect(t.body.total).toBe(4);
      expect(t.body.items.map((r: { label: string }) => r.label)).toEqual([
        'X2:1',
        'X2:2',
        'X2:3',
        'X2:4',
      ]);
      expect(t.body.items[2]).toMatchObject({ stripTag: 'X2', channelTag: 'LS-101' });
      const ch = await call(channels.GET, { method: 'GET', params: p });
      expect(ch.body.items).toEqual([
        expect.objectContaining({
          tag: 'LS-101',
          signalTerminalLabel: 'X2:3',
          returnTerminalLabel: 'X2:4',
          guardRecipeName: 'DI 24 V guard',
        }),
      ]);
      const r = await call(recipes.GET, { method: 'GET', params: p });
      expect(r.body.items).toEqual([
        expect.objectContaining({ name: 'DI 24 V guard', channelCount: 1 }),
      ]);
    });
  }
});

describe("another project's records answer 404, exactly like records that do not exist", () => {
  it('each record route, read and write', async () => {
    const before = await snapshot();
    actAs(w.users.engineer);
    const p = { projectId: w.projectId };
    const o = w.other;
    const attempts = [
      () => call(cabinet.GET, { method: 'GET', params: { ...p, cabinetId: o.cabinetId } }),
      () =>
        call(cabinet.PATCH, {
          method: 'PATCH',
          params: { ...p, cabinetId: o.cabinetId },
          body: { version: 0, name: 'x' },
        }),
      () =>
        call(cabinet.DELETE, {
          method: 'DELETE',
          params: { ...p, cabinetId: o.cabinetId },
          query: { version: 0 },
        }),
      () => call(strips.GET, { method: 'GET', params: { ...p, cabinetId: o.cabinetId } }),
      () => call(strips.POST, { params: { ...p, cabinetId: o.cabinetId }, body: { tag: 'X5' } }),
      () =>
        call(strip.PATCH, {
          method: 'PATCH',
          params: { ...p, stripId: o.stripId },
          body: { version: 0, name: 'x' },
        }),
      () =>
        call(strip.DELETE, {
          method: 'DELETE',
          params: { ...p, stripId: o.stripId },
          query: { version: 0 },
        }),
      () => call(cabinetTerminals.GET, { method: 'GET', params: { ...p, cabinetId: o.cabinetId } }),
      () => call(terminal.GET, { method: 'GET', params: { ...p, terminalId: o.terminalId } }),
      () =>
        call(terminal.PATCH, {
          method: 'PATCH',
          params: { ...p, terminalId: o.terminalId },
          body: { version: 0, notes: 'x' },
        }),
      () =>
        call(terminal.DELETE, {
          method: 'DELETE',
          params: { ...p, terminalId: o.terminalId },
          query: { version: 0 },
        }),
      () =>
        call(terminals.PATCH, {
          method: 'PATCH',
          params: p,
          body: { updates: [{ id: o.terminalId, version: 0, changes: { notes: 'x' } }] },
        }),
      () =>
        call(channel.PATCH, {
          method: 'PATCH',
          params: { ...p, channelId: o.channelId },
          body: { version: 0, name: 'x' },
        }),
      () =>
        call(channel.DELETE, {
          method: 'DELETE',
          params: { ...p, channelId: o.channelId },
          query: { version: 0 },
        }),
      () =>
        call(recipe.PATCH, {
          method: 'PATCH',
          params: { ...p, recipeId: o.recipeId },
          body: { version: 0, name: 'x' },
        }),
      () =>
        call(recipe.DELETE, {
          method: 'DELETE',
          params: { ...p, recipeId: o.recipeId },
          query: { version: 0 },
        }),
    ];
    for (const attempt of attempts) {
      const { status, body } = await attempt();
      expect(status).toBe(404);
      expect(body.error).toMatch(/not found in this project/);
    }
    // An id that exists nowhere gets the same answer.
    const missing = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: 999999 },
      body: { version: 0, notes: 'x' },
    });
    expect(missing.status).toBe(404);
    expect(await snapshot()).toEqual(before);
  });

  it("a body may not point at another project's strip, channel or recipe", async () => {
    const before = await snapshot();
    actAs(w.users.engineer);
    const p = { projectId: w.projectId };
    const t = await call(terminals.POST, {
      params: p,
      body: { stripId: w.other.stripId, position: 1, label: 'Z', circuitClass: 'spare' },
    });
    expect(t.status).toBe(422);
    expect(t.body.fieldErrors.stripId[0]).toMatch(/does not exist in this project/);
    const c = await call(channels.POST, {
      params: p,
      body: {
        cabinetId: w.cabinetId,
        tag: 'FT-7',
        signalType: 'counter',
        guardRecipeId: w.other.recipeId,
      },
    });
    expect(c.status).toBe(422);
    expect(c.body.fieldErrors, JSON.stringify(c.body)).toHaveProperty('guardRecipeId');
    expect(c.body.fieldErrors.guardRecipeId[0]).toMatch(/does not exist in this project/);
    const u = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: w.terminalIds[1] },
      body: { version: 0, channelId: w.other.channelId },
    });
    expect(u.status).toBe(422);
    expect(u.body.fieldErrors.channelId[0]).toMatch(/does not exist in this project/);
    expect(await snapshot()).toEqual(before);
  });
});
