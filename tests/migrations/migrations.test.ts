import { QueryTypes, type Model, type ModelStatic, type QueryInterface } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MIGRATION_TABLE, migrationStatus, revertMigrations, runMigrations } from '@/lib/db-migrate';
import { MIGRATIONS } from '@/migrations';
import { freshDb, type FreshDb } from '../models/fresh-db';

let db: FreshDb;
let qi: QueryInterface;

beforeAll(async () => {
  db = await freshDb({ migrate: false });
  qi = db.sequelize.getQueryInterface();
});
afterAll(async () => db.cleanup());

async function tables(): Promise<string[]> {
  const names = (await qi.showAllTables()) as unknown as Array<string | { tableName: string }>;
  return names.map((t) => (typeof t === 'string' ? t : t.tableName)).filter((t) => t !== 'sqlite_sequence').sort();
}

type Row = Record<string, unknown>;
async function pragma(sql: string): Promise<Row[]> {
  return db.sequelize.query<Row>(sql, { type: QueryTypes.SELECT });
}

describe('migrations', () => {
  it('run up from an empty database and leave nothing pending', async () => {
    expect(await tables()).toEqual([]);
    const applied = await runMigrations(db.sequelize);
    expect(applied).toEqual(MIGRATIONS.map((m) => m.name));
    expect(await migrationStatus(db.sequelize)).toEqual({ executed: applied, pending: [] });
    expect(await runMigrations(db.sequelize)).toEqual([]);
  });

  it('create a table with a column for every model attribute, nullability matching', async () => {
    for (const model of Object.values(db.models) as ModelStatic<Model>[]) {
      const columns = await qi.describeTable(model.getTableName() as string);
      for (const [name, attribute] of Object.entries(model.getAttributes())) {
        const column = columns[attribute.field ?? name];
        expect(column, `${model.name}.${name} has no column`).toBeDefined();
        const modelAllowsNull = attribute.allowNull !== false;
        // Timestamps are set by Sequelize, so NOT NULL in the table while optional in the model
        // is fine; SQLite reports an INTEGER PRIMARY KEY as nullable.
        if (name !== 'createdAt' && name !== 'updatedAt' && !attribute.primaryKey) {
          expect(column.allowNull, `${model.name}.${name} nullability`).toBe(modelAllowsNull);
        }
      }
      const extra = Object.keys(columns).filter((c) => !Object.values(model.getAttributes()).some((a) => (a.field ?? '') === c));
      expect(extra, `${model.name} table has columns the model lacks`).toEqual([]);
    }
  });

  it('index every foreign key (as the leading column of some index)', async () => {
    const missing: string[] = [];
    let foreignKeys = 0;
    for (const table of (await tables()).filter((t) => t !== MIGRATION_TABLE)) {
      const fks = await pragma(`PRAGMA foreign_key_list(\`${table}\`)`);
      const leading = new Set<string>();
      for (const index of await pragma(`PRAGMA index_list(\`${table}\`)`)) {
        const cols = await pragma(`PRAGMA index_info(\`${String(index.name)}\`)`);
        const first = cols.find((c) => c.seqno === 0);
        if (first) leading.add(String(first.name));
      }
      for (const fk of fks) {
        foreignKeys += 1;
        if (!leading.has(String(fk.from))) missing.push(`${table}.${String(fk.from)}`);
      }
    }
    expect(foreignKeys).toBeGreaterThan(25);
    expect(missing).toEqual([]);
  });

  it('make (stripId, position, level) unique on terminals', async () => {
    const indexes = await pragma('PRAGMA index_list(`terminals`)');
    const unique = [];
    for (const index of indexes.filter((i) => i.unique === 1)) {
      const cols = await pragma(`PRAGMA index_info(\`${String(index.name)}\`)`);
      unique.push(cols.sort((a, b) => Number(a.seqno) - Number(b.seqno)).map((c) => String(c.name)).join(','));
    }
    expect(unique).toContain('stripId,position,level');
  });

  it('go down to an empty schema and up again', async () => {
    const reverted = await revertMigrations(db.sequelize, { all: true });
    expect(reverted).toEqual([...MIGRATIONS.map((m) => m.name)].reverse());
    expect(await tables()).toEqual([MIGRATION_TABLE]);
    expect((await migrationStatus(db.sequelize)).pending).toHaveLength(MIGRATIONS.length);

    await runMigrations(db.sequelize);
    expect(await tables()).toContain('terminals');
    const p = await db.models.Project.create({ name: 'After re-migration', code: 'RE-1' });
    expect(p.id).toBe(1);
  });
});
