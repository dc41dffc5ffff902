import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { ResequencePanel } from '@/components/report/resequence-panel';
import { VerdictBadge } from '@/components/report/verdict-badge';
import { StripDrawing } from '@/components/strip/strip-drawing';
import { Caution } from '@/components/ui/caution';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { can } from '@/lib/auth/permissions';
import { getStripOverlay } from '@/lib/data/channel-detail';
import { getSignedInUser } from '@/lib/data/membership';

export const metadata: Metadata = { title: 'Strip verdicts' };

export default async function StripOverlayPage({
  params,
}: {
  params: Promise<{ projectId: string; stripId: string }>;
}) {
  const { projectId: rawProject, stripId: rawStrip } = await params;
  const projectId = Number(rawProject);
  const stripId = Number(rawStrip);
  if (!Number.isInteger(stripId) || stripId <= 0) notFound();
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const overlay = await getStripOverlay(user, projectId, stripId);
  if (!overlay) notFound();
  const base = `/projects/${projectId}/audit`;
  const { strip } = overlay;

  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm text-muted">
        <Link href={base} className="underline-offset-2 hover:underline">
          Findings
        </Link>{' '}
        / strip{' '}
        <span className="font-mono text-ink">
          {overlay.cabinetTag} / {strip.tag}
        </span>
      </nav>
      <h2 className="text-2xl font-semibold">
        Strip <span className="font-mono">{strip.tag}</span>
        {strip.name && <span className="ml-2 text-base font-normal text-muted">{strip.name}</span>}
      </h2>
      <Caution />
      {!overlay.run && (
        <p className="text-sm text-muted">No audit run yet: the strip is drawn without verdicts.</p>
      )}
      {overlay.run?.stale && (
        <p role="status" className="rounded-sm border border-caution bg-caution-soft p-3 text-sm">
          The schedule changed after audit run #{overlay.run.id}: the verdicts below are that
          run&apos;s.
        </p>
      )}

      <Panel className="min-w-0">
        <PanelTitle>Verdicts and exposures</PanelTitle>
        <div className="overflow-x-auto">
          <StripDrawing
            strips={[strip]}
            terminals={overlay.terminals}
            exposures={overlay.exposures}
            verdicts={overlay.verdicts}
          />
        </div>
      </Panel>

      <div className="grid gap-6 lg:grid-cols-2">
        <Panel>
          <PanelTitle>Channels on this strip</PanelTitle>
          {overlay.channels.length === 0 ? (
            <p className="text-sm text-muted">No audited channel lands on this strip.</p>
          ) : (
            <ul className="divide-y divide-line">
              {overlay.channels.map((c) => (
                <li key={c.channelId} className="py-2">
                  <div className="flex items-center gap-2">
                    <VerdictBadge verdict={c.verdict} />
                    <Link
                      href={`${base}/channels/${c.channelId}`}
                      className="font-mono font-semibold underline-offset-2 hover:underline"
                    >
                      {c.tag}
                    </Link>
                  </div>
                  <p className="mt-0.5 text-sm">{c.reason}</p>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel>
          <PanelTitle>Segregation and wire colour</PanelTitle>
          {overlay.checks.length === 0 ? (
            <p className="text-sm text-muted">No rule check flagged on this strip.</p>
          ) : (
            <ul className="space-y-2 text-sm">
              {overlay.checks.map((c) => (
                <li key={c.key} className="flex items-start gap-2">
                  <VerdictBadge verdict={c.severity === 'violation' ? 'fails' : 'marginal'} />
                  <span>{c.message}</span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      </div>

      <Panel>
        <PanelTitle>Re-sequencing proposal</PanelTitle>
        {overlay.proposal ? (
          <ResequencePanel
            projectId={projectId}
            strip={strip}
            terminals={overlay.terminals}
            proposal={overlay.proposal}
            mayApply={can(overlay.standing, 'schedule:write')}
          />
        ) : (
          <p role="alert" className="text-sm text-danger">
            No proposal could be made: {overlay.proposalError}
          </p>
        )}
      </Panel>
      <Caution />
    </div>
  );
}
