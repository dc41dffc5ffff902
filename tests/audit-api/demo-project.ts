/**
 * A fresh database holding the demo scenario, with the evaporator project's id and each demo
 * role's user id, for tests that call route handlers as those users.
 */
import { DEMO_USERS, EVAPORATOR_PROJECT_CODE } from '@/seeders/demo-scenario';
import { seedDemo } from '@/seeders/demo';
import { freshDb, type FreshDb } from '../models/fresh-db';

export interface DemoProject {
  db: FreshDb;
  projectId: number;
  userId: Record<string, number>;
}

export async function demoProject(): Promise<DemoProject> {
  const db = await freshDb();
  await seedDemo(db);
  const m = db.models;
  const projectId = (await m.Project.findOne({ where: { code: EVAPORATOR_PROJECT_CODE } }))!.id;
  const userId: Record<string, number> = {};
  for (const u of DEMO_USERS) {
    userId[u.demoRole] = (await m.User.findOne({ where: { email: u.email } }))!.id;
  }
  return { db, projectId, userId };
}
