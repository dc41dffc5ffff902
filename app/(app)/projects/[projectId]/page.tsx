import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { OverviewAudit } from '@/components/report/overview-audit';
import { Caution } from '@/components/ui/caution';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { can } from '@/lib/auth/permissions';
import { getAuditRun, getAuditStatus, latestRunId, listFindings } from '@/lib/data/audits';
import { getSignedInUser, loadStanding } from '@/lib/data/membership';
import { getProjectOverview } from '@/lib/data/projects';

export const metadata: Metadata = { title: 'Project overview' };

// Full class names so Tailwind's scanner sees them.
const CLASS_SWATCH: Record<string, string> = {
  hazard: 'bg-circuit-hazard',
  sensitive: 'bg-circuit-sensitive',
  return: 'bg-circuit-return',
  earth: 'bg-circuit-earth',
  spare: 'bg-circuit-spare',
  barrier: 'bg-circuit-barrier',
};

const CLASS_LABELS: Record<string, string> = {
  hazard: 'Hazard sources',
  sensitive: 'Sensitive inputs',
  return: 'Returns / commons',
  earth: 'Earth / shield',
  spare: 'Spare',
  barrier: 'Barriers',
};

export default async function ProjectOverviewPage({
  params,
}: {
  params: Promise<{ projectId: string }>;
}) {
  const { projectId } = await params;
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const overview = await getProjectOverview(user, Number(projectId));
  if (!overview) notFound();
  const { counts, cabinets, terminalsByClass } = overview;
  const empty = counts.terminals === 0;

  // The audit's state, for those who may read it.
  const standing = await loadStanding(user, Number(projectId));
  const readsAudit = standing !== null && can(standing, 'audit:read');
  const runId = readsAudit && !empty ? await latestRunId(Number(projectId)) : null;
  const audit =
    readsAudit && !empty
      ? {
          status: await getAuditStatus(Number(projectId)),
          detail: runId !== null ? await getAuditRun(Number(projectId), runId) : null,
          findings:
            runId !== null
              ? (await listFindings(Number(projectId), runId, { kind: ['stress'], all: true }))
                  .items
              : [],
          mayRun: can(standing, 'audit:run'),
        }
      : null;

  return (
    <div className="space-y-6">
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-5" aria-label="Schedule counts">
        {(
          [
            ['Cabinets', counts.cabinets],
            ['Strips', counts.strips],
            ['Terminals', counts.terminals],
            ['Channels', counts.channels],
            ['Guard recipes', counts.guardRecipes],
          ] as const
        ).map(([label, value]) => (
          <div key={label} className="rounded-sm border border-line bg-panel p-4">
            <dt className="text-xs tracking-wide text-muted uppercase">{label}</dt>
            <dd className="mt-1 font-mono text-3xl">{value}</dd>
          </div>
        ))}
      </dl>

      {audit && <OverviewAudit projectId={Number(projectId)} {...audit} />}

      {empty ? (
        <Panel>
          <p className="font-medium">This project has no terminal schedule yet.</p>
          <p className="mt-1 text-sm text-muted">
            A controls engineer adds the cabinets and their strips first, then enters or imports
            each strip&apos;s terminals and maps the input channels to them.
          </p>
        </Panel>
      ) : (
        <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
          <Panel>
            <PanelTitle>Cabinets</PanelTitle>
            <table className="w-full text-sm">
              <thead className="text-left text-xs text-muted uppercase">
                <tr>
                  <th className="py-1 font-medium">Tag</th>
                  <th className="py-1 font-medium">Name</th>
                  <th className="py-1 text-right font-medium">Strips</th>
                  <th className="py-1 text-right font-medium">Terminals</th>
                  <th className="py-1 text-right font-medium">Channels</th>
                </tr>
              </thead>
              <tbody>
                {cabinets.map((c) => (
                  <tr key={c.id} className="border-t border-line">
                    <td className="py-2 font-mono">{c.tag}</td>
                    <td className="py-2">{c.name}</td>
                    <td className="py-2 text-right font-mono">{c.strips}</td>
                    <td className="py-2 text-right font-mono">{c.terminals}</td>
                    <td className="py-2 text-right font-mono">{c.channels}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Panel>
          <Panel>
            <PanelTitle>Terminals by circuit class</PanelTitle>
            <ul className="space-y-1 text-sm">
              {Object.entries(terminalsByClass).map(([cls, n]) => (
                <li key={cls} className="flex items-center justify-between gap-2">
                  <span className="flex items-center gap-2">
                    <span
                      aria-hidden
                      className={`inline-block h-3 w-3 rounded-[2px] ${CLASS_SWATCH[cls] ?? 'bg-line'}`}
                    />
                    {CLASS_LABELS[cls] ?? cls}
                  </span>
                  <span className="font-mono">{n}</span>
                </li>
              ))}
            </ul>
          </Panel>
        </div>
      )}
      <Caution />
    </div>
  );
}
