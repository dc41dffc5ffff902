import { can, type Capability, type ProjectStanding } from './permissions';

/** A project section and the capability it needs; the list grows as screens land. */
export interface ProjectSection {
  slug: string;
  label: string;
  capability: Capability;
}

export const PROJECT_SECTIONS: ProjectSection[] = [
  { slug: '', label: 'Overview', capability: 'project:read' },
  { slug: 'cabinets', label: 'Schedule', capability: 'schedule:read' },
  { slug: 'guards', label: 'Guard recipes', capability: 'schedule:read' },
  { slug: 'audit', label: 'Audit', capability: 'audit:read' },
  { slug: 'settings', label: 'Assumptions', capability: 'project:read' },
];

export function sectionsFor(standing: ProjectStanding, projectId: number) {
  return PROJECT_SECTIONS.filter((s) => can(standing, s.capability)).map((s) => ({
    href: `/projects/${projectId}${s.slug ? `/${s.slug}` : ''}`,
    label: s.label,
  }));
}
