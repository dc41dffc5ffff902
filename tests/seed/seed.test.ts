import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { guardShapeProblems } from '@/lib/presets/guard-shape';
import { TYPICAL_CAUTION } from '@/lib/presets/guards';
import { applyGuardOverrides } from '@/lib/presets/overrides';
import type { Guard } from '@/lib/stress/types';
import type { Channel, GuardRecipe, Strip, Terminal } from '@/models';
import {
  CREAMERY_PROJECT_CODE,
  DEMO_PASSWORD,
  DEMO_USERS,
  EVAPORATOR_PROJECT_CODE,
} from '@/seeders/demo-scenario';
import { seedDemo, type SeedCounts } from '@/seeders/demo';
import { freshDb, type FreshDb } from '../models/fresh-db';

let db: FreshDb;
let counts: SeedCounts;
let terminals: Terminal[];
let strips: Strip[];
let channels: Channel[];
let recipes: GuardRecipe[];
let projectId: number;

beforeAll(async () => {
  db = await freshDb();
  counts = await seedDemo(db);
  const m = db.models;
  const project = await m.Project.findOne({ where: { code: EVAPORATOR_PROJECT_CODE } });
  projectId = project!.id;
  const cabinetIds = (await m.Cabinet.findAll({ where: { projectId } })).map((c) => c.id);
  strips = await m.Strip.findAll({ where: { cabinetId: cabinetIds } });
  terminals = await m.Terminal.findAll({ where: { stripId: strips.map((s) => s.id) } });
  channels = await m.Channel.findAll({ where: { projectId } });
  recipes = await m.GuardRecipe.findAll({ where: { projectId } });
});
afterAll(async () => db.cleanup());

const MAINS = new Set(['mains-line', 'mains-neutral']);
const isMains = (t: Terminal) =>
  t.circuitClass === 'hazard' &&
  MAINS.has(t.hazardKind ?? '') &&
  (t.nominalVoltage === 120 || t.nominalVoltage === 230);
const byId = () => new Map(terminals.map((t) => [t.id, t]));
const stripOf = (t: Terminal) => strips.find((s) => s.id === t.stripId)!;

describe('demo seed, evaporator project', () => {
  it('is big enough to show the point', async () => {
    const cabinets = new Set(strips.map((s) => s.cabinetId));
    expect(cabinets.size).toBeGreaterThanOrEqual(2);
    expect(strips.length).toBeGreaterThanOrEqual(6);
    expect(terminals.length).toBeGreaterThanOrEqual(150);
    expect(channels.length).toBeGreaterThanOrEqual(40);
    expect(counts.terminals).toBe(await db.models.Terminal.count());
  });

  it('puts mains terminals right beside sensor inputs, with no barrier between', () => {
    const beside = terminals.filter(
      (t) =>
        t.circuitClass === 'sensitive' &&
        terminals.some(
          (h) => h.stripId === t.stripId && isMains(h) && Math.abs(h.position - t.position) === 1,
        ),
    );
    expect(beside.map((t) => t.label)).toContain('X1:7');
    expect(beside.length).toBeGreaterThanOrEqual(1);
  });

  it('has a multi-level block with a 24 V DC supply level over an analog input level', () => {
    const blocks = new Map<string, Terminal[]>();
    for (const t of terminals)
      if (t.blockId) blocks.set(t.blockId, [...(blocks.get(t.blockId) ?? []), t]);
    const analog = new Set(
      channels.filter((c) => c.signalType === 'current-4-20').map((c) => c.signalTerminalId),
    );
    const stacked = [...blocks.values()].filter((levels) => {
      const input = levels.find((t) => t.circuitClass === 'sensitive' && analog.has(t.id));
      const supply = levels.find((t) => t.hazardKind === 'dc-supply' && t.nominalVoltage === 24);
      return input && supply && input.position === supply.position && supply.level > input.level;
    });
    expect(stacked.length).toBeGreaterThanOrEqual(1);
  });

  it('has a multicore cable carrying both mains and signal cores', () => {
    const cables = new Map<string, Terminal[]>();
    for (const t of terminals)
      if (t.cableId) cables.set(t.cableId, [...(cables.get(t.cableId) ?? []), t]);
    const mixed = [...cables.entries()].filter(
      ([, cores]) => cores.some(isMains) && cores.some((t) => t.circuitClass === 'sensitive'),
    );
    expect(mixed.map(([id]) => id)).toContain('W-2210');
    const cores = cables.get('W-2210')!.map((t) => t.cableCore);
    expect(new Set(cores).size).toBe(cores.length); // each core lands once
  });

  it('has look-alike terminal numbers on parallel strips, one a mains terminal, the other an input', () => {
    const x3 = terminals.find((t) => t.label === 'X3:14')!;
    const x4 = terminals.find((t) => t.label === 'X4:14')!;
    expect(x3.terminalNumber).toBe(x4.terminalNumber);
    expect(stripOf(x3).cabinetId).toBe(stripOf(x4).cabinetId);
    expect(x3.circuitClass).toBe('sensitive');
    expect(isMains(x4)).toBe(true);
    // …and look-alike wire numbers: 1169 reads as 6911 upside down.
    expect([x3.wireNumber, x4.wireNumber]).toEqual(['1169', '6911']);
  });

  it('has barriers on some strips and none on others', () => {
    const withBarrier = new Set(
      terminals.filter((t) => t.circuitClass === 'barrier').map((t) => t.stripId),
    );
    expect(withBarrier.size).toBeGreaterThanOrEqual(2);
    expect(strips.length - withBarrier.size).toBeGreaterThanOrEqual(2);
  });

  it('has jumper groups joining terminals of one strip', () => {
    const groups = new Map<string, Terminal[]>();
    for (const t of terminals)
      if (t.bridgeGroup) groups.set(t.bridgeGroup, [...(groups.get(t.bridgeGroup) ?? []), t]);
    expect(groups.size).toBeGreaterThanOrEqual(3);
    for (const members of groups.values()) {
      expect(members.length).toBeGreaterThanOrEqual(2);
      expect(new Set(members.map((t) => t.stripId)).size).toBe(1);
    }
  });

  it('has wire colours that break IEC 60204-1 (13.2.2: green-yellow only for protective conductors)', () => {
    const peNotGnye = terminals.filter(
      (t) => t.circuitClass === 'earth' && t.wireColour && t.wireColour !== 'GNYE',
    );
    const gnyeOnSignal = terminals.filter(
      (t) => t.circuitClass !== 'earth' && t.wireColour === 'GNYE',
    );
    expect(peNotGnye.length).toBeGreaterThanOrEqual(1);
    expect(gnyeOnSignal.length).toBeGreaterThanOrEqual(1);
  });

  it('has guards from none at all to a two-stage network, with per-channel overrides that apply', () => {
    expect(channels.filter((c) => c.guardRecipeId === null).length).toBeGreaterThanOrEqual(3);
    const twoStage = recipes.filter((r) => r.guard.stages.length >= 2 && !r.isPreset);
    expect(twoStage.length).toBeGreaterThanOrEqual(1);
    expect(channels.some((c) => twoStage.some((r) => r.id === c.guardRecipeId))).toBe(true);

    const overridden = channels.filter((c) => c.guardOverrides);
    expect(overridden.length).toBeGreaterThanOrEqual(1);
    for (const c of overridden) {
      const recipe = recipes.find((r) => r.id === c.guardRecipeId)!;
      expect(applyGuardOverrides(recipe.guard, c.guardOverrides).problems).toEqual([]);
    }
  });

  it('ships the presets, labelled as typical, with well-formed guards', () => {
    const presets = recipes.filter((r) => r.isPreset);
    expect(presets.length).toBeGreaterThanOrEqual(4);
    for (const p of presets) expect(p.description).toContain(TYPICAL_CAUTION);
    for (const r of recipes) expect(guardShapeProblems(r.guard as Guard)).toEqual([]);
    const kinds = new Set(
      presets.flatMap((p) =>
        p.guard.stages.flatMap((s) => [s.series.kind, ...s.shunts.map((e) => e.kind)]),
      ),
    );
    for (const k of ['fuse', 'varistor', 'tvs', 'resistor', 'ptc', 'shuntResistor'])
      expect(kinds).toContain(k);
  });

  it('wires every channel to terminals of its own cabinet, consistently both ways', () => {
    const terminalsById = byId();
    for (const c of channels) {
      const sig = terminalsById.get(c.signalTerminalId!);
      expect(sig, c.tag).toBeDefined();
      expect(sig!.circuitClass).toBe('sensitive');
      expect(sig!.channelId).toBe(c.id);
      expect(stripOf(sig!).cabinetId).toBe(c.cabinetId);
      if (c.returnTerminalId !== null)
        expect(terminalsById.get(c.returnTerminalId)!.circuitClass).toBe('return');
    }
    expect(channels.filter((c) => c.returnTerminalId === null)).toEqual([]);
  });
});

describe('demo seed, people and roles', () => {
  it('has one account per role, each signing in with the documented password', async () => {
    expect(DEMO_USERS.map((u) => u.demoRole).sort()).toEqual([
      'admin',
      'engineer',
      'reviewer',
      'technician',
      'viewer',
    ]);
    for (const u of DEMO_USERS) {
      const user = await db.models.User.scope('withPassword').findOne({
        where: { email: u.email },
      });
      expect(user, u.email).not.toBeNull();
      expect(await bcrypt.compare(DEMO_PASSWORD, user!.passwordHash)).toBe(true);
      expect(user!.isAdmin).toBe(u.demoRole === 'admin');
    }
  });

  it('makes the engineer a viewer on the second project (roles are per project)', async () => {
    const m = db.models;
    const engineer = await m.User.findOne({ where: { email: 'orla.engineer@vessmoor.example' } });
    const creamery = await m.Project.findOne({ where: { code: CREAMERY_PROJECT_CODE } });
    const roles = await m.ProjectMember.findAll({ where: { userId: engineer!.id } });
    expect(Object.fromEntries(roles.map((r) => [r.projectId, r.role]))).toEqual({
      [projectId]: 'engineer',
      [creamery!.id]: 'viewer',
    });
    expect(creamery!.nominalVoltage).toBe(120);
    expect(creamery!.wireColourConvention).toBe('nfpa79');
  });
});

describe('demo seed, atomicity', () => {
  it('refuses to load twice and leaves the first load untouched', async () => {
    const before = await db.models.Terminal.count();
    await expect(seedDemo(db)).rejects.toThrow();
    expect(await db.models.Terminal.count()).toBe(before);
    expect(await db.models.User.count()).toBe(DEMO_USERS.length);
  });
});
