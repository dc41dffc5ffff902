import { notFound, redirect } from 'next/navigation';
import type { ReactNode } from 'react';
import { ProjectNav } from '@/components/shell/project-nav';
import { ROLE_LABELS } from '@/lib/auth/permissions';
import { sectionsFor } from '@/lib/auth/sections';
import { getSignedInUser, loadStanding } from '@/lib/data/membership';
import { getProjectHeader } from '@/lib/data/projects';

export default async function ProjectLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ projectId: string }>;
}) {
  const { projectId: raw } = await params;
  const projectId = Number(raw);
  if (!Number.isInteger(projectId) || projectId <= 0) notFound();
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const standing = await loadStanding(user, projectId);
  if (!standing) notFound();
  const project = await getProjectHeader(projectId);
  if (!project) notFound();

  return (
    <div>
      <div className="border-b border-line bg-panel">
        <div className="mx-auto max-w-7xl px-4 pt-4">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <div>
              <span className="font-mono text-xs text-muted">{project.code}</span>
              <h1 className="text-xl font-semibold">{project.name}</h1>
            </div>
            <span className="text-sm text-muted">
              Your role: {standing.role ? ROLE_LABELS[standing.role] : ROLE_LABELS.admin}
              {standing.isAdmin && standing.role ? ' · administrator' : ''}
            </span>
          </div>
          <div className="mt-2">
            <ProjectNav items={sectionsFor(standing, projectId)} />
          </div>
        </div>
      </div>
      <div className="mx-auto max-w-7xl px-4 py-6">{children}</div>
    </div>
  );
}
