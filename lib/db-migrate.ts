/**
 * Runs the schema migrations in-process (umzug, recorded in the `schema_migrations` table).
 * Used by scripts/migrate.ts, the seed, and tests.
 */
import type { Sequelize, QueryInterface } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { MIGRATIONS } from '@/migrations';

export const MIGRATION_TABLE = 'schema_migrations';

export function createMigrator(sequelize: Sequelize, log = false): Umzug<QueryInterface> {
  return new Umzug<QueryInterface>({
    migrations: MIGRATIONS.map(({ name, module }) => ({
      name,
      up: (params) => module.up(params),
      down: (params) => module.down(params),
    })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: MIGRATION_TABLE }),
    logger: log ? console : undefined,
  });
}

/** Applies every pending migration; returns the names applied. */
export async function runMigrations(
  sequelize: Sequelize,
  options: { log?: boolean } = {},
): Promise<string[]> {
  const applied = await createMigrator(sequelize, options.log).up();
  return applied.map((m) => m.name);
}

/** Reverts migrations: the last one by default, or all of them with `{ all: true }`. */
export async function revertMigrations(
  sequelize: Sequelize,
  options: { all?: boolean; log?: boolean } = {},
): Promise<string[]> {
  const migrator = createMigrator(sequelize, options.log);
  const reverted = await migrator.down(options.all ? { to: 0 } : undefined);
  return reverted.map((m) => m.name);
}

export async function migrationStatus(
  sequelize: Sequelize,
): Promise<{ executed: string[]; pending: string[] }> {
  const migrator = createMigrator(sequelize);
  const [executed, pending] = await Promise.all([migrator.executed(), migrator.pending()]);
  return { executed: executed.map((m) => m.name), pending: pending.map((m) => m.name) };
}
