import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { Panel } from '@/components/ui/panel';
import { ROLE_LABELS } from '@/lib/auth/permissions';
import { getSignedInUser } from '@/lib/data/membership';
import { listProjectsForUser } from '@/lib/data/projects';

export const metadata: Metadata = { title: 'Projects' };

export default async function ProjectsPage() {
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const projects = await listProjectsForUser(user);

  return (
    <main className="mx-auto max-w-7xl space-y-6 px-4 py-8">
      <div className="flex items-end justify-between">
        <div>
          <h1 className="text-2xl font-semibold">Projects</h1>
          <p className="text-sm text-muted">
            Plants and site jobs you are a member of, with your role on each.
          </p>
        </div>
      </div>
      {projects.length === 0 ? (
        <Panel>
          <p className="font-medium">You are not a member of any project yet.</p>
          <p className="mt-1 text-sm text-muted">
            Ask your administrator to add you to a project; the invitation e-mail tells you your
            role.
          </p>
        </Panel>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2" aria-label="Your projects">
          {projects.map((p) => (
            <li key={p.id}>
              <Link
                href={`/projects/${p.id}`}
                className="block rounded-sm border border-line bg-panel p-5 transition-colors hover:border-accent"
              >
                <div className="flex items-baseline justify-between gap-3">
                  <span className="font-mono text-xs text-muted">{p.code}</span>
                  <span className="rounded-sm border border-line px-2 py-0.5 text-xs">
                    {p.role ? ROLE_LABELS[p.role] : ROLE_LABELS.admin}
                  </span>
                </div>
                <h2 className="mt-1 text-lg font-semibold">{p.name}</h2>
                <p className="text-sm text-muted">
                  {[p.client, p.site].filter(Boolean).join(' · ')}
                </p>
                <p className="mt-3 font-mono text-xs text-muted">
                  {p.counts.cabinets} cabinets · {p.counts.terminals} terminals ·{' '}
                  {p.counts.channels} channels
                </p>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </main>
  );
}
