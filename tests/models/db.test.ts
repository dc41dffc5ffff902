import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { closeDb, configFromEnv, createSequelize, DEFAULT_SQLITE_PATH, getDb } from '@/lib/db';
import { runMigrations } from '@/lib/db-migrate';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'crossfault-db-'));
afterAll(async () => {
  await closeDb();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('createSequelize', () => {
  it('defaults to SQLite at data/crossfault.sqlite and lets SQLITE_PATH override it', () => {
    expect(DEFAULT_SQLITE_PATH).toBe(path.join('data', 'crossfault.sqlite'));
    expect(
      configFromEnv({ SQLITE_PATH: ' /tmp/x.sqlite ' } as unknown as NodeJS.ProcessEnv),
    ).toEqual({ url: undefined, sqlitePath: '/tmp/x.sqlite' });
    const file = path.join(dir, 'nested', 'folder', 'app.sqlite');
    const s = createSequelize({ sqlitePath: file });
    expect(s.getDialect()).toBe('sqlite');
    expect(fs.existsSync(path.dirname(file))).toBe(true); // the folder is created when missing
  });

  it('switches dialect on DATABASE_URL', () => {
    expect(createSequelize({ url: 'postgres://u:p@db.invalid:5432/crossfault' }).getDialect()).toBe(
      'postgres',
    );
    const mem = createSequelize({ url: 'sqlite::memory:' });
    expect(mem.getDialect()).toBe('sqlite');
    expect((mem as unknown as { options: { storage?: string } }).options.storage).toBe(':memory:');
  });
});

describe('getDb', () => {
  it('returns one instance, bound to the models, until closed', async () => {
    vi.stubEnv('SQLITE_PATH', path.join(dir, 'app.sqlite'));
    const a = getDb();
    const b = getDb();
    expect(b.sequelize).toBe(a.sequelize);
    await runMigrations(a.sequelize);
    await a.models.Project.create({ name: 'Cached', code: 'C-1' });
    await closeDb();
    const c = getDb();
    expect(c.sequelize).not.toBe(a.sequelize);
    expect(await c.models.Project.count()).toBe(1); // same file, new connection
  });

  it('keeps the instance across a module reload and binds the fresh model classes to it', async () => {
    const before = getDb();
    vi.resetModules();
    const reloaded = (await import('@/lib/db')) as typeof import('@/lib/db');
    const after = reloaded.getDb();
    expect(after.sequelize).toBe(before.sequelize);
    expect(after.models.Project).not.toBe(before.models.Project);
    expect(await after.models.Project.count()).toBe(1);
    expect(await before.models.Project.count()).toBe(1); // the old classes still work
    vi.unstubAllEnvs();
  });
});
