/**
 * Who may do what, per project. Pure: used by the server wrappers (the real check) and by the
 * navigation (which only hides what the server would refuse anyway).
 */

import { PROJECT_ROLES, type ProjectRole } from '@/models/enums';

export { PROJECT_ROLES, type ProjectRole };

/** The acting person's standing on one project: their project role, and whether they are a global admin. */
export interface ProjectStanding {
  role: ProjectRole | null;
  isAdmin: boolean;
}

export const CAPABILITIES = {
  'project:read': ['engineer', 'technician', 'reviewer', 'viewer'],
  'schedule:read': ['engineer', 'technician', 'reviewer', 'viewer'],
  'schedule:write': ['engineer'],
  'settings:write': ['engineer'],
  'audit:read': ['engineer', 'technician', 'reviewer', 'viewer'],
  'audit:run': ['engineer'],
  'markup:create': ['technician', 'engineer'],
  'markup:decide': ['engineer'],
  'review:decide': ['reviewer'],
  'handover:read': ['engineer', 'technician', 'reviewer', 'viewer'],
  'members:manage': [],
} as const satisfies Record<string, readonly ProjectRole[]>;

export type Capability = keyof typeof CAPABILITIES;

/**
 * A global admin may do everything an engineer may, manage members, and read everything;
 * review decisions stay with the project's reviewers, so a sign-off always names one.
 */
export function can(standing: ProjectStanding, capability: Capability): boolean {
  if (standing.isAdmin) return capability !== 'review:decide';
  if (!standing.role) return false;
  return (CAPABILITIES[capability] as readonly ProjectRole[]).includes(standing.role);
}

/** Human wording for a refusal: which roles may do it. */
export function describeCapability(capability: Capability): string {
  const roles = CAPABILITIES[capability] as readonly ProjectRole[];
  if (roles.length === 0) return 'Only an administrator may do this.';
  const list =
    roles.length === 1 ? roles[0] : `${roles.slice(0, -1).join(', ')} or ${roles.at(-1)}`;
  return `Only a project ${list}${capability === 'review:decide' ? '' : ' or an administrator'} may do this.`;
}

export const ROLE_LABELS: Record<ProjectRole | 'admin', string> = {
  engineer: 'Controls engineer',
  technician: 'Site technician',
  reviewer: 'Safety lead',
  viewer: 'Owner (read only)',
  admin: 'Administrator',
};
