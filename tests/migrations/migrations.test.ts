import { QueryTypes, type Model, type ModelStatic, type QueryInterface } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  MIGRATION_TABLE,
  migrationStatus,
  revertMigrations,
  runMigrations,
} from '@/lib/db-migrate';
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
  return names
    .map((t) => (typeof t === 'string' ? t : t.tableName))
    .filter((t) => t !== 'sqlite_sequence')
    .sort();
}

type Row = Record<string, unknown>;
async function select(sql: string): Promise<Row[]> {
  return db.sequelize.query<Row>(sql, { type: QueryTypes.SELECT });
}

/** Every foreign-key column, as `table.column`. */
async function foreignKeyColumns(): Promise<string[]> {
  if (db.dialect === 'postgres') {
    const rows = await select(`
      SELECT c.conrelid::regclass::text AS "table", a.attname AS "column"
      FROM pg_constraint c JOIN pg_attribute a ON a.attrelid = c.conrelid AND a.attnum = c.conkey[1]
      WHERE c.contype = 'f'`);
    return rows.map((r) => `${String(r.table).replace(/"/g, '')}.${String(r.column)}`);
  }
  const out: string[] = [];
  for (const table of await tables()) {
    for (const fk of await select(`PRAGMA foreign_key_list(\`${table}\`)`))
      out.push(`${table}.${String(fk.from)}`);
  }
  return out;
}

/** Column lists of every index on `table` (in index order), unique ones marked. */
async function indexes(table: string): Promise<Array<{ columns: string[]; unique: boolean }>> {
  if (db.dialect === 'postgres') {
    const rows = await select(`
      SELECT i.indisunique AS "unique",
             array_to_string(array(
               SELECT a.attname FROM unnest(i.indkey) WITH ORDINALITY AS k(attnum, ord)
               JOIN pg_attribute a ON a.attrelid = i.indrelid AND a.attnum = k.attnum ORDER BY k.ord), ',') AS "columns"
      FROM pg_index i WHERE i.indrelid = '"${table}"'::regclass`);
    return rows.map((r) => ({ columns: String(r.columns).split(','), unique: Boolean(r.unique) }));
  }
  const out: Array<{ columns: string[]; unique: boolean }> = [];
  for (const index of await select(`PRAGMA index_list(\`${table}\`)`)) {
    const cols = await select(`PRAGMA index_info(\`${String(index.name)}\`)`);
    out.push({
      columns: cols.sort((a, b) => Number(a.seqno) - Number(b.seqno)).map((c) => String(c.name)),
      unique: index.unique === 1,
    });
  }
  return out;
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
      const extra = Object.keys(columns).filter(
        (c) => !Object.values(model.getAttributes()).some((a) => (a.field ?? '') === c),
      );
      expect(extra, `${model.name} table has columns the model lacks`).toEqual([]);
    }
  });

  it('index every foreign key (as the leading column of some index)', async () => {
    const fks = await foreignKeyColumns();
    expect(fks.length).toBeGreaterThan(25);
    const leading = new Set<string>();
    for (const table of await tables()) {
      for (const index of await indexes(table)) leading.add(`${table}.${index.columns[0]}`);
    }
    expect(fks.filter((fk) => !leading.has(fk))).toEqual([]);
  });

  it('make (stripId, position, level) unique on terminals', async () => {
    const unique = (await indexes('terminals'))
      .filter((i) => i.unique)
      .map((i) => i.columns.join(','));
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
