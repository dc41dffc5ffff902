import { Op } from 'sequelize';
import { getDb } from '@/lib/db';
import type { ProjectRole } from '@/models/enums';
import { loadStanding, type ActingUser } from './membership';

export interface ProjectCounts {
  cabinets: number;
  strips: number;
  terminals: number;
  channels: number;
  guardRecipes: number;
}

export interface ProjectListItem {
  id: number;
  name: string;
  code: string;
  client: string | null;
  site: string | null;
  /** The user's project role; null for an admin who is not a member. */
  role: ProjectRole | null;
  counts: ProjectCounts;
}

async function countsFor(projectIds: number[]): Promise<Map<number, ProjectCounts>> {
  const { models } = getDb();
  const result = new Map<number, ProjectCounts>();
  for (const id of projectIds) result.set(id, { cabinets: 0, strips: 0, terminals: 0, channels: 0, guardRecipes: 0 });
  if (projectIds.length === 0) return result;

  const cabinets = await models.Cabinet.findAll({ where: { projectId: { [Op.in]: projectIds } }, attributes: ['id', 'projectId'] });
  const cabinetProject = new Map(cabinets.map((c) => [c.id, c.projectId]));
  const strips = await models.Strip.findAll({
    where: { cabinetId: { [Op.in]: [...cabinetProject.keys()] } },
    attributes: ['id', 'cabinetId'],
  });
  const stripProject = new Map(strips.map((s) => [s.id, cabinetProject.get(s.cabinetId)!]));
  const terminalsByStrip = (await models.Terminal.count({
    where: { stripId: { [Op.in]: [...stripProject.keys()] } },
    group: ['stripId'],
  })) as unknown as { stripId: number; count: number }[];
  const channels = (await models.Channel.count({
    where: { projectId: { [Op.in]: projectIds } },
    group: ['projectId'],
  })) as unknown as { projectId: number; count: number }[];
  const recipes = (await models.GuardRecipe.count({
    where: { projectId: { [Op.in]: projectIds } },
    group: ['projectId'],
  })) as unknown as { projectId: number; count: number }[];

  for (const c of cabinets) result.get(c.projectId)!.cabinets += 1;
  for (const s of strips) result.get(cabinetProject.get(s.cabinetId)!)!.strips += 1;
  for (const row of terminalsByStrip) result.get(stripProject.get(row.stripId)!)!.terminals += Number(row.count);
  for (const row of channels) result.get(row.projectId)!.channels = Number(row.count);
  for (const row of recipes) result.get(row.projectId)!.guardRecipes = Number(row.count);
  return result;
}

/** Projects the user is a member of (all projects for an admin), with their role and counts. */
export async function listProjectsForUser(user: ActingUser): Promise<ProjectListItem[]> {
  const { models } = getDb();
  const memberships = await models.ProjectMember.findAll({ where: { userId: user.id } });
  const roleByProject = new Map(memberships.map((m) => [m.projectId, m.role]));
  const projects = await models.Project.findAll({
    where: user.isAdmin ? {} : { id: { [Op.in]: [...roleByProject.keys()] } },
    order: [['name', 'ASC']],
  });
  const counts = await countsFor(projects.map((p) => p.id));
  return projects.map((p) => ({
    id: p.id,
    name: p.name,
    code: p.code,
    client: p.client,
    site: p.site,
    role: roleByProject.get(p.id) ?? null,
    counts: counts.get(p.id)!,
  }));
}

export async function getProjectHeader(projectId: number) {
  const { models } = getDb();
  const project = await models.Project.findByPk(projectId, { attributes: ['id', 'name', 'code', 'client', 'site'] });
  return project ? project.get({ plain: true }) : null;
}

export interface ProjectOverview {
  counts: ProjectCounts;
  cabinets: { id: number; tag: string; name: string; strips: number; terminals: number; channels: number }[];
  terminalsByClass: Record<string, number>;
}

/** The overview figures, or null when the user may not read the project. */
export async function getProjectOverview(user: ActingUser, projectId: number): Promise<ProjectOverview | null> {
  if (!Number.isInteger(projectId) || projectId <= 0) return null;
  const standing = await loadStanding(user, projectId);
  if (!standing) return null;
  const { models } = getDb();
  const counts = (await countsFor([projectId])).get(projectId)!;
  const cabinets = await models.Cabinet.findAll({ where: { projectId }, order: [['tag', 'ASC']] });
  const strips = await models.Strip.findAll({
    where: { cabinetId: { [Op.in]: cabinets.map((c) => c.id) } },
    attributes: ['id', 'cabinetId'],
  });
  const stripCabinet = new Map(strips.map((s) => [s.id, s.cabinetId]));
  const terminals = await models.Terminal.findAll({
    where: { stripId: { [Op.in]: [...stripCabinet.keys()] } },
    attributes: ['stripId', 'circuitClass'],
  });
  const channels = await models.Channel.findAll({ where: { projectId }, attributes: ['cabinetId'] });

  const terminalsByClass: Record<string, number> = {};
  const perCabinet = new Map(cabinets.map((c) => [c.id, { strips: 0, terminals: 0, channels: 0 }]));
  for (const s of strips) perCabinet.get(s.cabinetId)!.strips += 1;
  for (const t of terminals) {
    perCabinet.get(stripCabinet.get(t.stripId)!)!.terminals += 1;
    terminalsByClass[t.circuitClass] = (terminalsByClass[t.circuitClass] ?? 0) + 1;
  }
  for (const ch of channels) {
    const entry = perCabinet.get(ch.cabinetId);
    if (entry) entry.channels += 1;
  }
  return {
    counts,
    cabinets: cabinets.map((c) => ({ id: c.id, tag: c.tag, name: c.name, ...perCabinet.get(c.id)! })),
    terminalsByClass,
  };
}
