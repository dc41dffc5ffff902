/**
 * A fresh, migrated SQLite database in a temp folder, bound as the app's database. One per
 * test file (vitest runs files in separate forks).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { closeDb, createSequelize, useDatabase, type Db } from '@/lib/db';
import { runMigrations } from '@/lib/db-migrate';

export interface FreshDb extends Db {
  file: string;
  cleanup(): Promise<void>;
}

export async function freshDb(options: { migrate?: boolean } = {}): Promise<FreshDb> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'crossfault-test-'));
  const file = path.join(dir, 'test.sqlite');
  const db = useDatabase(createSequelize({ sqlitePath: file }));
  if (options.migrate !== false) await runMigrations(db.sequelize);
  return {
    ...db,
    file,
    async cleanup() {
      await closeDb();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
