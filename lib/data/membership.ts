import type { ProjectStanding } from '@/lib/auth/permissions';
import { currentUserId } from '@/lib/auth/session';
import { getDb } from '@/lib/db';

export interface ActingUser {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** The active user behind a session id, read fresh so a deactivated account stops at once. */
export async function loadActingUser(id: number): Promise<ActingUser | null> {
  const { models } = getDb();
  const user = await models.User.findByPk(id);
  if (!user || !user.active) return null;
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

/** For server components: the signed-in, active user or null. */
export async function getSignedInUser(): Promise<ActingUser | null> {
  const id = await currentUserId();
  return id === null ? null : loadActingUser(id);
}

/**
 * The user's standing on a project, or null when the project does not exist or the user is
 * neither a member nor an admin (callers answer 404 then, revealing nothing).
 */
export async function loadStanding(user: ActingUser, projectId: number): Promise<ProjectStanding | null> {
  const { models } = getDb();
  const project = await models.Project.findByPk(projectId, { attributes: ['id'] });
  if (!project) return null;
  const member = await models.ProjectMember.findOne({ where: { projectId, userId: user.id } });
  if (!member && !user.isAdmin) return null;
  return { role: member?.role ?? null, isAdmin: user.isAdmin };
}
