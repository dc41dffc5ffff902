import { notFound, redirect } from 'next/navigation';
import { can } from '@/lib/auth/permissions';
import { getSignedInUser, loadStanding } from '@/lib/data/membership';

/**
 * The page-level check for the schedule screens: signed in, may read this project's schedule
 * (404 otherwise, revealing nothing), and whether the UI should offer editing. The route
 * handlers check again on every write.
 */
export async function scheduleAccess(rawProjectId: string) {
  const projectId = Number(rawProjectId);
  if (!Number.isInteger(projectId) || projectId <= 0) notFound();
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const standing = await loadStanding(user, projectId);
  if (!standing || !can(standing, 'schedule:read')) notFound();
  return { projectId, canWrite: can(standing, 'schedule:write') };
}

/** A positive whole-number route segment, or 404. */
export function idSegment(raw: string): number {
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) notFound();
  return id;
}

/** Server rows (with Date fields) → the JSON shape the client components and routes share. */
export function asJson<T>(value: unknown): T {
  return JSON.parse(JSON.stringify(value)) as T;
}
