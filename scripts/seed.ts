/**
 * Usage: tsx scripts/seed.ts [--reset]
 * Migrates, then loads the demo scenario. With demo data already present it does nothing
 * (exit 0); with other data present it refuses (exit 1). --reset drops every table, migrates
 * afresh and seeds: all data in the database is lost.
 */
import { createSequelize, bindDatabase } from '@/lib/db';
import { revertMigrations, runMigrations } from '@/lib/db-migrate';
import { DEMO_PASSWORD, DEMO_USERS, EVAPORATOR_PROJECT_CODE } from '@/seeders/demo-scenario';
import { seedDemo } from '@/seeders/demo';

async function main(args: string[]): Promise<number> {
  const unknown = args.filter((a) => a !== '--reset');
  if (unknown.length > 0) {
    console.error(`unknown option ${unknown.join(' ')}; usage: tsx scripts/seed.ts [--reset]`);
    return 2;
  }
  const reset = args.includes('--reset');
  const db = bindDatabase(createSequelize());
  try {
    if (reset) {
      await revertMigrations(db.sequelize, { all: true });
      console.log('reset: all tables dropped');
    }
    await runMigrations(db.sequelize);
    const { User, Project } = db.models;
    if ((await Project.count({ where: { code: EVAPORATOR_PROJECT_CODE } })) > 0) {
      console.log('demo data already present: nothing done (use --reset to start again)');
      return 0;
    }
    if ((await User.count()) > 0 || (await Project.count()) > 0) {
      console.error(
        'the database already holds data that is not the demo: refusing to mix them (use --reset to wipe it)',
      );
      return 1;
    }
    const counts = await seedDemo(db);
    console.log(
      `seeded: ${counts.projects} projects, ${counts.cabinets} cabinets, ${counts.strips} strips, ` +
        `${counts.terminals} terminals, ${counts.channels} channels, ${counts.recipes} guard recipes, ${counts.users} users`,
    );
    console.log(`demo accounts (password "${DEMO_PASSWORD}", local use only):`);
    for (const u of DEMO_USERS) console.log(`  ${u.demoRole.padEnd(10)} ${u.email}`);
    return 0;
  } finally {
    await db.sequelize.close();
  }
}

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  },
);
