/**
 * Editing the schedule through the route handlers: versioned updates (a stale edit is told,
 * with the record as it now stands), the all-or-nothing bulk edit, validation that names the
 * field, paging/sorting/filtering, refusals that protect data, and the audit trail.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { getDb } from '@/lib/db';
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

let w: World;
let p: { projectId: number };
beforeAll(async () => {
  w = await setupWorld();
  p = { projectId: w.projectId };
  actAs(w.users.engineer);
});
afterAll(() => teardownWorld(w));

async function terminalRow(id: number) {
  return (await call(terminal.GET, { method: 'GET', params: { ...p, terminalId: id } })).body;
}

describe('versioned updates', () => {
  it('two editors start from the same version: the first saves, the second gets 409 with the current record', async () => {
    const id = w.terminalIds[2];
    const read = await terminalRow(id);
    const first = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: id },
      body: { version: read.version, wireNumber: 'W-3101' },
    });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({
      wireNumber: 'W-3101',
      version: read.version + 1,
      stripTag: 'X2',
      channelTag: 'LS-101',
    });

    const before = await snapshot();
    const second = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: id },
      body: { version: read.version, wireNumber: 'W-9999' },
    });
    expect(second.status).toBe(409);
    expect(second.body.error).toMatch(/changed by someone else/i);
    expect(second.body.current).toMatchObject({
      id,
      wireNumber: 'W-3101',
      version: read.version + 1,
      stripTag: 'X2',
    });
    // Who saved first, from the audit log (the contract's optional changedBy).
    expect(second.body.changedBy).toEqual({
      name: 'Test engineer',
      at: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
    });
    expect(await snapshot()).toEqual(before);
  });

  it('two saves of the same version at the same moment: one is saved, the other gets 409 (never a server error)', async () => {
    const id = w.terminalIds[1];
    const read = await terminalRow(id);
    const results = await Promise.all(
      ['first', 'second'].map((notes) =>
        call(terminal.PATCH, {
          method: 'PATCH',
          params: { ...p, terminalId: id },
          body: { version: read.version, notes },
        }),
      ),
    );
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const saved = results.find((r) => r.status === 200)!.body;
    expect((await terminalRow(id)).notes).toBe(saved.notes);
    expect(results.find((r) => r.status === 409)!.body.current).toMatchObject({
      notes: saved.notes,
      version: read.version + 1,
    });
  });

  it('a stale cabinet, strip, channel or recipe update is refused the same way', async () => {
    const staleCabinet = await call(cabinet.PATCH, {
      method: 'PATCH',
      params: { ...p, cabinetId: w.cabinetId },
      body: { version: 7, name: 'x' },
    });
    expect(staleCabinet.status).toBe(409);
    expect(staleCabinet.body.current).toMatchObject({ id: w.cabinetId, tag: '+BH1', version: 0 });
    // Never written through the API, so the log cannot say who: no name is better than a wrong one.
    expect(staleCabinet.body.changedBy).toBeNull();
    const staleStrip = await call(strip.PATCH, {
      method: 'PATCH',
      params: { ...p, stripId: w.stripId },
      body: { version: 3, name: 'x' },
    });
    expect(staleStrip.status).toBe(409);
    const staleChannel = await call(channel.PATCH, {
      method: 'PATCH',
      params: { ...p, channelId: w.channelId },
      body: { version: 5, name: 'x' },
    });
    expect(staleChannel.status).toBe(409);
    const staleRecipe = await call(recipe.PATCH, {
      method: 'PATCH',
      params: { ...p, recipeId: w.recipeId },
      body: { version: 5, name: 'x' },
    });
    expect(staleRecipe.status).toBe(409);
    const staleDelete = await call(terminal.DELETE, {
      method: 'DELETE',
      params: { ...p, terminalId: w.terminalIds[1] },
      query: { version: 9 },
    });
    expect(staleDelete.status).toBe(409);
    expect(staleDelete.body.current).toMatchObject({ id: w.terminalIds[1], label: 'X2:2' });
  });

  it('an update without a version, or a delete without ?version, is refused with the reason', async () => {
    const noVersion = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: w.terminalIds[1] },
      body: { notes: 'x' },
    });
    expect(noVersion.status).toBe(422);
    expect(noVersion.body.fieldErrors.version[0]).toMatch(/version/);
    const noQuery = await call(terminal.DELETE, {
      method: 'DELETE',
      params: { ...p, terminalId: w.terminalIds[1] },
    });
    expect(noQuery.status).toBe(422);
    expect(noQuery.body.fieldErrors.version[0]).toMatch(/\?version=N/);
  });
});

describe('validation names the field and why, and changes nothing', () => {
  it('position, class, and the hazard facts', async () => {
    const before = await snapshot();
    const badPosition = await call(terminals.POST, {
      params: p,
      body: { stripId: w.stripId, position: 0, label: 'X2:0', circuitClass: 'spare' },
    });
    expect(badPosition.status).toBe(422);
    expect(badPosition.body.fieldErrors.position).toEqual([
      'position must be a whole number of 1 or more.',
    ]);
    const badClass = await call(terminals.POST, {
      params: p,
      body: { stripId: w.stripId, position: 8, label: 'X2:8', circuitClass: 'mains' },
    });
    expect(badClass.body.fieldErrors.circuitClass[0]).toMatch(/one of: hazard, sensitive/);
    const hazardNoVoltage = await call(terminals.POST, {
      params: p,
      body: {
        stripId: w.stripId,
        position: 8,
        label: 'X2:8',
        circuitClass: 'hazard',
        hazardKind: 'dc-supply',
        currentKind: 'dc',
      },
    });
    expect(hazardNoVoltage.status).toBe(422);
    expect(hazardNoVoltage.body.fieldErrors.nominalVoltage[0]).toMatch(
      /required on a hazard terminal/,
    );
    // An update is judged on the record as it would stand: X2:1 is an AC hazard; making it DC-less fails.
    const t1 = await terminalRow(w.terminalIds[0]);
    const dropKind = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: t1.id },
      body: { version: t1.version, currentKind: null },
    });
    expect(dropKind.status).toBe(422);
    expect(dropKind.body.fieldErrors.currentKind[0]).toMatch(/ac or dc/);
    const taken = await call(terminals.POST, {
      params: p,
      body: { stripId: w.stripId, position: 3, label: 'X2:3b', circuitClass: 'spare' },
    });
    expect(taken.status).toBe(422);
    expect(taken.body.fieldErrors.position[0]).toBe(
      'position 3 level 1 on strip X2 is already taken by terminal X2:3.',
    );
    const dupCabinet = await call(cabinets.POST, {
      params: p,
      body: { tag: '+BH1', name: 'Again' },
    });
    expect(dupCabinet.status).toBe(422);
    expect(dupCabinet.body.fieldErrors.tag[0]).toMatch(/already used/);
    const badGuard = await call(recipes.POST, {
      params: p,
      body: {
        name: 'Broken',
        guard: {
          stages: [{ series: { kind: 'resistor', id: 'R1', resistance: '4q' }, shunts: [] }],
          input: { positiveRail: 24, negativeRail: 0 },
        },
      },
    });
    expect(badGuard.status).toBe(422);
    expect(badGuard.body.fieldErrors['guard.stages.0.series.resistance'][0]).toMatch(
      /unknown unit or suffix "q"/,
    );
    expect(badGuard.body.fieldErrors['guard.input.absMaxBeyondRail'][0]).toMatch(/required/);
    const unknownField = await call(cabinet.PATCH, {
      method: 'PATCH',
      params: { ...p, cabinetId: w.cabinetId },
      body: { version: 0, colour: 'red' },
    });
    expect(unknownField.status).toBe(422);
    expect(await snapshot()).toEqual(before);
  });
});

describe('bulk terminal update', () => {
  it('applies every change in one go, including two terminals swapping places', async () => {
    const a = await terminalRow(w.terminalIds[2]); // X2:3, position 3
    const b = await terminalRow(w.terminalIds[3]); // X2:4, position 4
    const res = await call(terminals.PATCH, {
      method: 'PATCH',
      params: p,
      body: {
        updates: [
          { id: a.id, version: a.version, changes: { position: 4 } },
          { id: b.id, version: b.version, changes: { position: 3, wireColour: 'blue' } },
        ],
      },
    });
    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([
      expect.objectContaining({ id: a.id, position: 4, version: a.version + 1 }),
      expect.objectContaining({
        id: b.id,
        position: 3,
        wireColour: 'blue',
        version: b.version + 1,
      }),
    ]);
  });

  it('one stale row: 409 listing it with its current record; the valid rows are not written either', async () => {
    const a = await terminalRow(w.terminalIds[1]);
    const b = await terminalRow(w.terminalIds[2]);
    const before = await snapshot();
    const res = await call(terminals.PATCH, {
      method: 'PATCH',
      params: p,
      body: {
        updates: [
          { id: a.id, version: a.version, changes: { notes: 'end plate' } },
          { id: b.id, version: b.version - 1, changes: { notes: 'stale' } },
        ],
      },
    });
    expect(res.status).toBe(409);
    expect(res.body.conflicts).toEqual([
      {
        id: b.id,
        current: expect.objectContaining({ id: b.id, version: b.version, label: b.label }),
        changedBy: { name: 'Test engineer', at: expect.any(String) },
      },
    ]);
    expect(await snapshot()).toEqual(before);
  });

  it('one invalid row: 422 keyed updates.<i>.changes.<field>; nothing written', async () => {
    const a = await terminalRow(w.terminalIds[1]);
    const b = await terminalRow(w.terminalIds[2]);
    const c = await terminalRow(w.terminalIds[3]);
    const before = await snapshot();
    const res = await call(terminals.PATCH, {
      method: 'PATCH',
      params: p,
      body: {
        updates: [
          { id: a.id, version: a.version, changes: { notes: 'fine' } },
          { id: b.id, version: b.version, changes: { circuitClass: 'hazard' } },
          { id: c.id, version: c.version, changes: { position: -2 } },
        ],
      },
    });
    expect(res.status).toBe(422);
    expect(res.body.fieldErrors['updates.2.changes.position']).toEqual([
      'position must be a whole number of 1 or more.',
    ]);
    expect(await snapshot()).toEqual(before);
    // Field rules passed, record rules fail: judged after merging, keyed the same way.
    const merged = await call(terminals.PATCH, {
      method: 'PATCH',
      params: p,
      body: {
        updates: [
          { id: a.id, version: a.version, changes: { notes: 'fine' } },
          { id: b.id, version: b.version, changes: { circuitClass: 'hazard' } },
          { id: c.id, version: c.version, changes: { position: 1 } },
        ],
      },
    });
    expect(merged.status).toBe(422);
    expect(merged.body.fieldErrors['updates.1.changes.nominalVoltage'][0]).toMatch(
      /required on a hazard terminal/,
    );
    expect(merged.body.fieldErrors['updates.2.changes.position'][0]).toMatch(
      /already taken by terminal X2:1/,
    );
    expect(merged.body.fieldErrors['updates.0.changes.notes']).toBeUndefined();
    expect(await snapshot()).toEqual(before);
  });
});

describe('the schedule list: paging, sorting, filtering', () => {
  it('pages, sorts by any column both ways, filters by class, strip and text', async () => {
    const q = (query: Record<string, string | number>) =>
      call(cabinetTerminals.GET, {
        method: 'GET',
        params: { ...p, cabinetId: w.cabinetId },
        query,
      });
    const page = await q({ page: 2, pageSize: 3 });
    expect(page.body.total).toBe(4);
    expect(page.body.items).toHaveLength(1);
    const byLabelDesc = await q({ sort: 'label', dir: 'desc' });
    expect(byLabelDesc.body.items.map((r: { label: string }) => r.label)).toEqual([
      'X2:4',
      'X2:3',
      'X2:2',
      'X2:1',
    ]);
    const hazards = await q({ circuitClass: 'hazard' });
    expect(hazards.body.items.map((r: { label: string }) => r.label)).toEqual(['X2:1']);
    const text = await q({ q: 'ls-101' });
    expect(text.body.items.map((r: { channelTag: string }) => r.channelTag)).toEqual([
      'LS-101',
      'LS-101',
    ]);
    const byChannel = await q({ sort: 'channelTag', dir: 'desc' });
    expect(byChannel.body.items[0].channelTag).toBe('LS-101');
    const strip = await q({ stripId: w.other.stripId });
    expect(strip.body).toEqual({ items: [], total: 0 });
    const badSort = await q({ sort: 'passwordHash' });
    expect(badSort.status).toBe(422);
    expect(badSort.body.fieldErrors.sort[0]).toMatch(/sort must be one of/);
    // A list row is the same record the single-terminal read answers (dates included).
    const all = await q({});
    for (const row of all.body.items) expect(row).toEqual(await terminalRow(row.id));
    const tooBig = await q({ pageSize: 5001 });
    expect(tooBig.status).toBe(422);
  });
});

describe('refusals that protect data', () => {
  it('a cabinet with strips, a strip with terminals, a recipe in use: 409 saying why', async () => {
    const before = await snapshot();
    const c = await call(cabinet.DELETE, {
      method: 'DELETE',
      params: { ...p, cabinetId: w.cabinetId },
      query: { version: 0 },
    });
    expect(c.status).toBe(409);
    expect(c.body.error).toMatch(/still has 1 strip/);
    const stripRow = (
      await call(strips.GET, { method: 'GET', params: { ...p, cabinetId: w.cabinetId } })
    ).body.items[0];
    const s = await call(strip.DELETE, {
      method: 'DELETE',
      params: { ...p, stripId: w.stripId },
      query: { version: stripRow.version },
    });
    expect(s.status).toBe(409);
    expect(s.body.error).toMatch(/still has 4 terminals/);
    const r = await call(recipe.DELETE, {
      method: 'DELETE',
      params: { ...p, recipeId: w.recipeId },
      query: { version: 0 },
    });
    expect(r.status).toBe(409);
    expect(r.body.error).toMatch(/used by 1 channel \(LS-101\)/);
    expect(await snapshot()).toEqual(before);
  });
});

describe('create, update, delete round trip with the audit trail', () => {
  it('each write leaves one entry naming actor, project, action and record', async () => {
    const { models } = getDb();
    const logBefore = await models.AuditLog.count();
    const newCabinet = await call(cabinets.POST, {
      params: p,
      body: { tag: '+BH2', name: 'Burner management', location: 'Level 2' },
    });
    expect(newCabinet.status).toBe(201);
    expect(newCabinet.body).toMatchObject({ tag: '+BH2', version: 0, stripCount: 0 });
    const newStrip = await call(strips.POST, {
      params: { ...p, cabinetId: newCabinet.body.id },
      body: { tag: 'X5' },
    });
    expect(newStrip.status).toBe(201);
    const t = await call(terminals.POST, {
      params: p,
      body: {
        stripId: newStrip.body.id,
        position: 1,
        label: 'X5:1',
        circuitClass: 'hazard',
        hazardKind: 'dc-supply',
        nominalVoltage: 24,
        currentKind: 'dc',
      },
    });
    expect(t.status).toBe(201);
    expect(t.body).toMatchObject({ level: 1, stripTag: 'X5', channelTag: null, blockId: null });
    const rec = await call(recipes.POST, {
      params: p,
      body: {
        name: 'AI 4-20 guard',
        guard: {
          stages: [{ series: { kind: 'resistor', id: 'R1', resistance: '100' }, shunts: [] }],
          input: { positiveRail: '24V', negativeRail: 0, absMaxBeyondRail: '0.3' },
        },
      },
    });
    expect(rec.status).toBe(201);
    expect(rec.body.guard.input.positiveRail).toBe(24);
    const sensitive = await call(terminals.POST, {
      params: p,
      body: { stripId: newStrip.body.id, position: 2, label: 'X5:2', circuitClass: 'sensitive' },
    });
    const ch = await call(channels.POST, {
      params: p,
      body: {
        cabinetId: newCabinet.body.id,
        tag: 'PT-2201',
        signalType: 'current-4-20',
        signalTerminalId: sensitive.body.id,
        guardRecipeId: rec.body.id,
      },
    });
    expect(ch.status).toBe(201);
    expect(ch.body).toMatchObject({
      signalTerminalLabel: 'X5:2',
      guardRecipeName: 'AI 4-20 guard',
    });
    // The channel's signal terminal now shows the channel in the schedule.
    expect((await terminalRow(sensitive.body.id)).channelTag).toBe('PT-2201');
    const chDel = await call(channel.DELETE, {
      method: 'DELETE',
      params: { ...p, channelId: ch.body.id },
      query: { version: ch.body.version },
    });
    expect(chDel.body).toEqual({ deleted: true });
    expect((await terminalRow(sensitive.body.id)).channelTag).toBeNull();
    const del = await call(terminal.DELETE, {
      method: 'DELETE',
      params: { ...p, terminalId: t.body.id },
      query: { version: t.body.version },
    });
    expect(del.status).toBe(200);
    expect(del.body).toEqual({ deleted: true });

    const entries = await models.AuditLog.findAll({
      where: { projectId: w.projectId },
      order: [['id', 'ASC']],
      offset: logBefore,
    });
    expect(entries.map((e) => e.action)).toEqual([
      'cabinet.create',
      'strip.create',
      'terminal.create',
      'guard-recipe.create',
      'terminal.create',
      'channel.create',
      'channel.delete',
      'terminal.delete',
    ]);
    for (const e of entries) expect(e.actorId).toBe(w.users.engineer);
    expect(entries[2].entityId).toBe(t.body.id);
  });

  it('an administrator who is not a member may write', async () => {
    actAs(w.users.admin);
    try {
      const res = await call(cabinets.POST, {
        params: p,
        body: { tag: '+BH3', name: 'Feedwater' },
      });
      expect(res.status).toBe(201);
    } finally {
      actAs(w.users.engineer);
    }
  });
});

describe('strips, moves and channel links', () => {
  it('a new strip goes after the last one unless an order is given; the list follows the order', async () => {
    const other = await call(cabinets.POST, {
      params: p,
      body: { tag: '+BH4', name: 'Ash handling' },
    });
    const cid = other.body.id;
    await call(strips.POST, { params: { ...p, cabinetId: cid }, body: { tag: 'X10' } });
    await call(strips.POST, { params: { ...p, cabinetId: cid }, body: { tag: 'X11' } });
    const first = await call(strips.POST, {
      params: { ...p, cabinetId: cid },
      body: { tag: 'X9', order: 0 },
    });
    expect(first.status).toBe(201);
    const list = await call(strips.GET, { method: 'GET', params: { ...p, cabinetId: cid } });
    // By order, then by tag as text ("X10" before "X9").
    expect(list.body.items.map((s: { tag: string; order: number }) => [s.tag, s.order])).toEqual([
      ['X10', 0],
      ['X9', 0],
      ['X11', 1],
    ]);
    const renamed = await call(strip.PATCH, {
      method: 'PATCH',
      params: { ...p, stripId: first.body.id },
      body: { version: 0, order: 5, name: 'Spare rail' },
    });
    expect(renamed.body).toMatchObject({
      order: 5,
      name: 'Spare rail',
      version: 1,
      terminalCount: 0,
    });
    const dupTag = await call(strip.PATCH, {
      method: 'PATCH',
      params: { ...p, stripId: first.body.id },
      body: { version: 1, tag: 'X10' },
    });
    expect(dupTag.status).toBe(422);
    expect(dupTag.body.fieldErrors.tag[0]).toMatch(/already used by another strip/);
    const gone = await call(strip.DELETE, {
      method: 'DELETE',
      params: { ...p, stripId: first.body.id },
      query: { version: 1 },
    });
    expect(gone.body).toEqual({ deleted: true });
  });

  it('a terminal moves to another strip of its cabinet, never to another cabinet', async () => {
    const x3 = await call(strips.POST, {
      params: { ...p, cabinetId: w.cabinetId },
      body: { tag: 'X3' },
    });
    const t = await terminalRow(w.terminalIds[1]);
    const moved = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: t.id },
      body: { version: t.version, stripId: x3.body.id, position: 1, label: 'X3:1' },
    });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ stripTag: 'X3', position: 1, label: 'X3:1' });
    const elsewhere = (await call(cabinets.GET, { method: 'GET', params: p })).body.items.find(
      (c: { tag: string }) => c.tag === '+BH4',
    );
    const foreignStrip = (
      await call(strips.GET, { method: 'GET', params: { ...p, cabinetId: elsewhere.id } })
    ).body.items[0];
    const before = await snapshot();
    const refused = await call(terminal.PATCH, {
      method: 'PATCH',
      params: { ...p, terminalId: t.id },
      body: { version: moved.body.version, stripId: foreignStrip.id },
    });
    expect(refused.status).toBe(422);
    expect(refused.body.fieldErrors.stripId[0]).toMatch(
      /another cabinet; a terminal moves only within its cabinet/,
    );
    expect(await snapshot()).toEqual(before);
  });

  it("changing a channel's signal terminal moves the schedule's channel mark with it", async () => {
    const ch = (
      await call(channels.GET, { method: 'GET', params: p, query: { cabinetId: w.cabinetId } })
    ).body.items.find((c: { tag: string }) => c.tag === 'LS-101');
    const oldSignal = ch.signalTerminalId;
    const spare = await call(terminals.POST, {
      params: p,
      body: { stripId: w.stripId, position: 20, label: 'X2:20', circuitClass: 'sensitive' },
    });
    const res = await call(channel.PATCH, {
      method: 'PATCH',
      params: { ...p, channelId: ch.id },
      body: { version: ch.version, signalTerminalId: spare.body.id },
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      signalTerminalLabel: 'X2:20',
      returnTerminalLabel: ch.returnTerminalLabel,
    });
    expect((await terminalRow(spare.body.id)).channelTag).toBe('LS-101');
    expect((await terminalRow(oldSignal)).channelTag).toBeNull();
    const same = await call(channel.PATCH, {
      method: 'PATCH',
      params: { ...p, channelId: ch.id },
      body: { version: res.body.version, returnTerminalId: spare.body.id },
    });
    expect(same.status).toBe(422);
    expect(same.body.fieldErrors.returnTerminalId[0]).toMatch(/different terminal/);
    const foreign = await call(channel.PATCH, {
      method: 'PATCH',
      params: { ...p, channelId: ch.id },
      body: { version: res.body.version, returnTerminalId: w.other.terminalId },
    });
    expect(foreign.status).toBe(422);
    expect(foreign.body.fieldErrors.returnTerminalId[0]).toMatch(
      /not a terminal of this channel's cabinet/,
    );
  });

  it('a cabinet update is saved, versioned and logged with the change', async () => {
    const { models } = getDb();
    const c = (await call(cabinet.GET, { method: 'GET', params: { ...p, cabinetId: w.cabinetId } }))
      .body;
    const res = await call(cabinet.PATCH, {
      method: 'PATCH',
      params: { ...p, cabinetId: w.cabinetId },
      body: { version: c.version, location: 'Boiler house, east wall' },
    });
    expect(res.body).toMatchObject({
      location: 'Boiler house, east wall',
      name: c.name,
      version: c.version + 1,
    });
    const entry = await models.AuditLog.findOne({
      where: { action: 'cabinet.update', entityId: w.cabinetId },
      order: [['id', 'DESC']],
    });
    expect(entry?.detail).toEqual({ changes: { location: [null, 'Boiler house, east wall'] } });
  });
});
