import Link from 'next/link';
import { Panel, PanelTitle } from '@/components/ui/panel';
import type { AuditRunDetail, AuditStatus, StoredFinding } from '@/lib/data/audits';
import { VERDICT_LABEL, VERDICT_ORDER } from '@/lib/report/format';
import { MECHANISM_LABEL } from '@/lib/report/vocabulary';
import { VERDICT_SEVERITY, type Verdict } from '@/lib/stress/types';
import { VerdictBadge } from './verdict-badge';

const REVIEW_LABEL: Record<string, string> = {
  draft: 'not yet submitted for review',
  submitted: 'submitted, awaiting the safety lead',
  signed: 'signed off',
  returned: 'returned by the safety lead',
};

const WORST_SHOWN = 8;

/** The audit half of the project overview: verdict and mechanism counts, worst channels, run and review state. */
export function OverviewAudit({
  projectId,
  status,
  detail,
  findings,
  mayRun,
}: {
  projectId: number;
  status: AuditStatus;
  detail: AuditRunDetail | null;
  findings: StoredFinding[];
  mayRun: boolean;
}) {
  const base = `/projects/${projectId}/audit`;
  const stale = status.stale;
  const cta = (
    <div
      role="status"
      className="flex flex-wrap items-center justify-between gap-3 rounded-sm border border-caution bg-caution-soft p-3 text-sm"
      data-testid="audit-cta"
    >
      <span>
        {detail
          ? `The schedule or the assumptions changed after audit run #${detail.run.id} (${status.changes.length} ${status.changes.length === 1 ? 'change' : 'changes'}${
              status.changes.length
                ? `: ${status.changes
                    .slice(0, 3)
                    .map((c) => `${c.entity} ${c.label} ${c.change}`)
                    .join(', ')}${status.changes.length > 3 ? ', …' : ''}`
                : ''
            }). Its findings may no longer hold.`
          : 'This project has not been audited yet.'}
      </span>
      <Link
        href={base}
        className="rounded-sm border border-accent bg-accent px-3 py-1.5 font-medium text-accent-ink hover:brightness-110"
      >
        {mayRun ? 'Run the audit' : detail ? 'See the findings' : 'Open the audit page'}
      </Link>
    </div>
  );
  if (!detail || !detail.run.summary) return <div className="space-y-4">{cta}</div>;

  const summary = detail.run.summary;
  // Worst channels: worst verdict, then the smallest margin of its findings.
  const byChannel = new Map<number, StoredFinding>();
  for (const f of findings) {
    if (f.kind !== 'stress' || f.channelId === null) continue;
    const cur = byChannel.get(f.channelId);
    const worse =
      !cur ||
      VERDICT_SEVERITY[f.verdict] > VERDICT_SEVERITY[cur.verdict] ||
      (VERDICT_SEVERITY[f.verdict] === VERDICT_SEVERITY[cur.verdict] &&
        (f.margin ?? -Infinity) < (cur.margin ?? -Infinity));
    if (worse) byChannel.set(f.channelId, f);
  }
  const worst = [...byChannel.values()]
    .sort(
      (a, b) =>
        VERDICT_SEVERITY[b.verdict] - VERDICT_SEVERITY[a.verdict] ||
        (a.margin ?? -Infinity) - (b.margin ?? -Infinity) ||
        (a.channelTag ?? '').localeCompare(b.channelTag ?? ''),
    )
    .slice(0, WORST_SHOWN);
  const mechanisms = Object.entries(summary.exposuresByMechanism) as [
    keyof typeof MECHANISM_LABEL,
    number,
  ][];

  return (
    <div className="space-y-4">
      {stale && cta}
      <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
        <Panel>
          <PanelTitle
            aside={
              <Link href={base} className="text-sm underline-offset-2 hover:underline">
                All findings →
              </Link>
            }
          >
            Worst channels
          </PanelTitle>
          {worst.length === 0 ? (
            <p className="text-sm text-muted">No channel findings in this run.</p>
          ) : (
            <ol className="divide-y divide-line" data-testid="worst-channels">
              {worst.map((f) => (
                <li key={f.channelId} className="py-2">
                  <div className="flex flex-wrap items-center gap-2">
                    <VerdictBadge verdict={f.verdict} />
                    <Link
                      href={`${base}/channels/${f.channelId}?case=${encodeURIComponent(f.key)}#case`}
                      className="font-mono font-semibold underline-offset-2 hover:underline"
                    >
                      {f.channelTag}
                    </Link>
                    <span className="text-xs text-muted">
                      {f.cabinetTag} / {f.stripTag} · {f.finding?.caseLabel}
                    </span>
                  </div>
                  <p className="mt-0.5 text-sm">{f.reason}</p>
                </li>
              ))}
            </ol>
          )}
        </Panel>
        <div className="space-y-6">
          <Panel>
            <PanelTitle>Latest audit</PanelTitle>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
              <dt className="text-muted">Run</dt>
              <dd>
                #{detail.run.id},{' '}
                {new Date(detail.run.createdAt).toLocaleString('en-GB', { timeZone: 'UTC' })} UTC
              </dd>
              <dt className="text-muted">By</dt>
              <dd>{detail.run.createdBy?.name ?? '—'}</dd>
              <dt className="text-muted">Review</dt>
              <dd>{REVIEW_LABEL[detail.run.reviewState] ?? detail.run.reviewState}</dd>
              <dt className="text-muted">Inputs</dt>
              <dd>
                {stale
                  ? 'the schedule or assumptions changed after this run'
                  : 'unchanged since this run'}
              </dd>
            </dl>
          </Panel>
          <Panel>
            <PanelTitle>Channels by verdict</PanelTitle>
            <ul className="space-y-1 text-sm" aria-label="Channels by verdict">
              {VERDICT_ORDER.map((v: Verdict) => (
                <li key={v} className="flex items-center justify-between gap-2">
                  <Link
                    href={`${base}?verdict=${v}`}
                    className="flex items-center gap-2 hover:underline"
                    aria-label={`${VERDICT_LABEL[v]}: ${summary.channelsByVerdict[v]} channels`}
                  >
                    <VerdictBadge verdict={v} />
                  </Link>
                  <span className="font-mono">{summary.channelsByVerdict[v]}</span>
                </li>
              ))}
            </ul>
          </Panel>
          <Panel>
            <PanelTitle>Exposures by mechanism</PanelTitle>
            <ul className="space-y-1 text-sm">
              {mechanisms.map(([m, n]) => (
                <li key={m} className="flex items-center justify-between gap-2">
                  <Link href={`${base}?mechanism=${m}`} className="hover:underline">
                    {MECHANISM_LABEL[m] ?? m}
                  </Link>
                  <span className="font-mono">{n}</span>
                </li>
              ))}
            </ul>
          </Panel>
        </div>
      </div>
    </div>
  );
}
