/**
 * Usage: tsx scripts/migrate.ts up|down|down-all|status
 * Uses the same configuration as the app (DATABASE_URL, SQLITE_PATH; default data/crossfault.sqlite).
 */
import { createSequelize } from '@/lib/db';
import { migrationStatus, revertMigrations, runMigrations } from '@/lib/db-migrate';

const USAGE = 'usage: tsx scripts/migrate.ts up | down | down-all | status';

async function main(command: string | undefined): Promise<number> {
  const sequelize = createSequelize();
  try {
    switch (command) {
      case 'up': {
        const applied = await runMigrations(sequelize);
        console.log(applied.length ? `applied: ${applied.join(', ')}` : 'schema is up to date');
        return 0;
      }
      case 'down':
      case 'down-all': {
        const reverted = await revertMigrations(sequelize, { all: command === 'down-all' });
        console.log(reverted.length ? `reverted: ${reverted.join(', ')}` : 'nothing to revert');
        return 0;
      }
      case 'status': {
        const { executed, pending } = await migrationStatus(sequelize);
        console.log(`executed (${executed.length}): ${executed.join(', ') || '—'}`);
        console.log(`pending (${pending.length}): ${pending.join(', ') || '—'}`);
        return 0;
      }
      default:
        console.error(USAGE);
        return 2;
    }
  } finally {
    await sequelize.close();
  }
}

main(process.argv[2]).then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  },
);
