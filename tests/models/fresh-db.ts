/**
 * A fresh, migrated database bound as the app's database, one per test file (vitest runs
 * files in separate forks). SQLite in a temp folder by default; with TEST_DATABASE_URL set to
 * a PostgreSQL server URL, a new throw-away database on that server instead, so the same tests
 * show the models run on PostgreSQL too.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { closeDb, createSequelize, bindDatabase, type Db } from '@/lib/db';
import { runMigrations } from '@/lib/db-migrate';

export interface FreshDb extends Db {
  dialect: 'sqlite' | 'postgres';
  cleanup(): Promise<void>;
}

async function freshPostgres(serverUrl: string): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `cf_test_${crypto.randomBytes(6).toString('hex')}`;
  const admin = createSequelize({ url: serverUrl });
  await admin.query(`CREATE DATABASE ${name}`);
  await admin.close();
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    async drop() {
      const again = createSequelize({ url: serverUrl });
      await again.query(`DROP DATABASE IF EXISTS ${name}`);
      await again.close();
    },
  };
}

export async function freshDb(options: { migrate?: boolean } = {}): Promise<FreshDb> {
  const serverUrl = process.env.TEST_DATABASE_URL?.trim();
  let db: Db;
  let release: () => Promise<void>;
  if (serverUrl) {
    const pg = await freshPostgres(serverUrl);
    db = bindDatabase(createSequelize({ url: pg.url }));
    release = pg.drop;
  } else {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'crossfault-test-'));
    db = bindDatabase(createSequelize({ sqlitePath: path.join(dir, 'test.sqlite') }));
    release = async () => fs.rmSync(dir, { recursive: true, force: true });
  }
  if (options.migrate !== false) await runMigrations(db.sequelize);
  return {
    ...db,
    dialect: db.sequelize.getDialect() === 'postgres' ? 'postgres' : 'sqlite',
    async cleanup() {
      await closeDb();
      await release();
    },
  };
}
