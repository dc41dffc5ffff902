/**
 * Route handlers called directly against a fresh SQLite file: a project with one member of
 * each role, an administrator, an outsider, and a second project whose records must stay
 * invisible. The session is replaced by `actAs` (the test files mock @/lib/auth/session
 * with `sessionMock`).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { NextRequest } from 'next/server';
// Renamed on import: the React hooks lint rule would take a `use…` name for a hook.
import { closeDb, createSequelize, getDb, useDatabase as bindDatabase } from '@/lib/db';
import { runMigrations } from '@/lib/db-migrate';
import type { ProjectRole } from '@/models/enums';

type SessionHolder = typeof globalThis & { __scheduleTestUserId?: number | null };

/** The factory for vi.mock('@/lib/auth/session', …): reads the id set by actAs. */
export function sessionMock() {
  return { currentUserId: async () => (globalThis as SessionHolder).__scheduleTestUserId ?? null };
}

export function actAs(userId: number | null): void {
  (globalThis as SessionHolder).__scheduleTestUserId = userId;
}

// A well-formed bcrypt hash (of no password anyone uses); the model refuses plain text.
const HASH = '$2b$04$' + 'abcdefghijklmnopqrstuv'.padEnd(53, 'x');

export interface World {
  dir: string;
  users: Record<ProjectRole | 'admin' | 'outsider', number>;
  projectId: number;
  otherProjectId: number;
  cabinetId: number;
  stripId: number;
  terminalIds: number[];
  channelId: number;
  recipeId: number;
  other: {
    cabinetId: number;
    stripId: number;
    terminalId: number;
    channelId: number;
    recipeId: number;
  };
}

export const SIMPLE_GUARD = {
  stages: [
    {
      series: {
        kind: 'resistor',
        id: 'R1',
        resistance: 4990,
        ratedPower: 0.25,
        limitingVoltage: 200,
      },
      shunts: [
        {
          kind: 'tvs',
          id: 'D1',
          bidirectional: true,
          standoffVoltage: 28,
          breakdownVoltage: 31.1,
          clampVoltage: 45.4,
          peakPulseCurrent: 13.2,
        },
      ],
    },
  ],
  input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3 },
};

/** A fresh database file with migrations applied and the fixture world in it. */
export async function setupWorld(): Promise<World> {
  await closeDb();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'crossfault-api-'));
  process.env.SQLITE_PATH = path.join(dir, 'test.sqlite');
  const { sequelize } = bindDatabase(createSequelize({ sqlitePath: process.env.SQLITE_PATH }));
  await runMigrations(sequelize);
  const { models } = getDb();

  const mkUser = async (key: string, isAdmin = false) =>
    (
      await models.User.create({
        email: `${key}@kestrel-mill.test`,
        name: `Test ${key}`,
        passwordHash: HASH,
        isAdmin,
      })
    ).id;
  const users = {
    engineer: await mkUser('engineer'),
    technician: await mkUser('technician'),
    reviewer: await mkUser('reviewer'),
    viewer: await mkUser('viewer'),
    admin: await mkUser('admin', true),
    outsider: await mkUser('outsider'),
  };
  const project = await models.Project.create({ name: 'Kestrel Mill boiler house', code: 'KM-BH' });
  const other = await models.Project.create({ name: 'Harrow Lane pumping', code: 'HL-PS' });
  for (const role of ['engineer', 'technician', 'reviewer', 'viewer'] as const) {
    await models.ProjectMember.create({ projectId: project.id, userId: users[role], role });
  }
  // The engineer of this project has no standing on the other one.
  await models.ProjectMember.create({
    projectId: other.id,
    userId: users.outsider,
    role: 'engineer',
  });

  const cabinet = await models.Cabinet.create({
    projectId: project.id,
    tag: '+BH1',
    name: 'Boiler house I/O',
  });
  const strip = await models.Strip.create({ cabinetId: cabinet.id, tag: 'X2', order: 0 });
  const recipe = await models.GuardRecipe.create({
    projectId: project.id,
    name: 'DI 24 V guard',
    guard: SIMPLE_GUARD as never,
  });
  const t1 = await models.Terminal.create({
    stripId: strip.id,
    position: 1,
    label: 'X2:1',
    terminalNumber: '1',
    circuitClass: 'hazard',
    hazardKind: 'mains-line',
    nominalVoltage: 230,
    currentKind: 'ac',
    frequency: 50,
  });
  const t2 = await models.Terminal.create({
    stripId: strip.id,
    position: 2,
    label: 'X2:2',
    terminalNumber: '2',
    circuitClass: 'barrier',
  });
  const t3 = await models.Terminal.create({
    stripId: strip.id,
    position: 3,
    label: 'X2:3',
    terminalNumber: '3',
    circuitClass: 'sensitive',
  });
  const t4 = await models.Terminal.create({
    stripId: strip.id,
    position: 4,
    label: 'X2:4',
    terminalNumber: '4',
    circuitClass: 'return',
  });
  const channel = await models.Channel.create({
    projectId: project.id,
    cabinetId: cabinet.id,
    tag: 'LS-101',
    signalType: 'digital-24',
    signalTerminalId: t3.id,
    returnTerminalId: t4.id,
    guardRecipeId: recipe.id,
  });
  await t3.update({ channelId: channel.id });
  await t4.update({ channelId: channel.id });

  const oCabinet = await models.Cabinet.create({
    projectId: other.id,
    tag: '+PS1',
    name: 'Pump station',
  });
  const oStrip = await models.Strip.create({ cabinetId: oCabinet.id, tag: 'X1' });
  const oTerminal = await models.Terminal.create({
    stripId: oStrip.id,
    position: 1,
    label: 'X1:1',
    circuitClass: 'spare',
  });
  const oRecipe = await models.GuardRecipe.create({
    projectId: other.id,
    name: 'Other guard',
    guard: SIMPLE_GUARD as never,
  });
  const oChannel = await models.Channel.create({
    projectId: other.id,
    cabinetId: oCabinet.id,
    tag: 'PT-9',
    signalType: 'current-4-20',
  });

  return {
    dir,
    users,
    projectId: project.id,
    otherProjectId: other.id,
    cabinetId: cabinet.id,
    stripId: strip.id,
    terminalIds: [t1.id, t2.id, t3.id, t4.id],
    channelId: channel.id,
    recipeId: recipe.id,
    other: {
      cabinetId: oCabinet.id,
      stripId: oStrip.id,
      terminalId: oTerminal.id,
      channelId: oChannel.id,
      recipeId: oRecipe.id,
    },
  };
}

export async function teardownWorld(world: World | undefined): Promise<void> {
  await closeDb();
  if (world) fs.rmSync(world.dir, { recursive: true, force: true });
}

type Handler = (
  request: NextRequest,
  context: { params: Promise<Record<string, string>> },
) => Promise<Response>;

export interface CallOptions {
  params: Record<string, string | number>;
  body?: unknown;
  query?: Record<string, string | number>;
  form?: FormData;
  method?: string;
}

/** Calls a route handler as Next would: a NextRequest and params as a Promise. */
// The JSON body is checked field by field with expect(); typing every response shape here would only repeat the handlers.
export async function call(
  handler: Handler,
  options: CallOptions,
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
): Promise<{ status: number; body: any; response: Response }> {
  const url = new URL('http://crossfault.test/api/test');
  for (const [k, v] of Object.entries(options.query ?? {})) url.searchParams.set(k, String(v));
  const init: { method: string; body?: BodyInit; headers?: Record<string, string> } = {
    method: options.method ?? 'POST',
  };
  if (options.form) init.body = options.form;
  else if (options.body !== undefined) {
    init.body = JSON.stringify(options.body);
    init.headers = { 'content-type': 'application/json' };
  }
  const request = new NextRequest(url, init);
  const params = Object.fromEntries(Object.entries(options.params).map(([k, v]) => [k, String(v)]));
  const response = await handler(request, { params: Promise.resolve(params) });
  const type = response.headers.get('content-type') ?? '';
  const body = type.includes('json') ? await response.json() : null;
  return { status: response.status, body, response };
}

/** Every table the schedule writes to, for "nothing changed" checks. */
export async function snapshot() {
  const { models } = getDb();
  const plain = async (model: {
    findAll: (o: object) => Promise<{ get: (o: object) => unknown }[]>;
  }) =>
    (await model.findAll({ order: [['id', 'ASC']] })).map((r) =>
      JSON.stringify(r.get({ plain: true })),
    );
  return {
    cabinets: await plain(models.Cabinet),
    strips: await plain(models.Strip),
    terminals: await plain(models.Terminal),
    channels: await plain(models.Channel),
    recipes: await plain(models.GuardRecipe),
    auditLog: await models.AuditLog.count(),
  };
}
