import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { GuardSchematic } from '@/components/guards/guard-schematic';
import { CaseCalculations } from '@/components/report/case-calculations';
import { RemedyPanel } from '@/components/report/remedy-panel';
import { VerdictBadge } from '@/components/report/verdict-badge';
import { WaveformPlot } from '@/components/report/waveform-plot';
import { StripDrawing } from '@/components/strip/strip-drawing';
import { Caution } from '@/components/ui/caution';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { can } from '@/lib/auth/permissions';
import { getChannelDetail } from '@/lib/data/channel-detail';
import { getSignedInUser } from '@/lib/data/membership';
import { formatMargin } from '@/lib/report/format';
import { innerNodeTraces } from '@/lib/report/node-traces';
import { MECHANISM_LABEL, LIKELIHOOD_LABEL, ROUTE_LABEL } from '@/lib/report/vocabulary';
import { cn } from '@/lib/utils';

export const metadata: Metadata = { title: 'Channel' };

const PLOT_KIND: Record<string, string> = {
  ac: 'over one mains cycle',
  dc: 'under the steady fault',
  surge: 'during the surge (IEC 61000-4-5 combination wave)',
  esd: 'during the discharge (150 pF through 330 Ω)',
};

export default async function ChannelPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string; channelId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { projectId: rawProject, channelId: rawChannel } = await params;
  const sp = await searchParams;
  const projectId = Number(rawProject);
  const channelId = Number(rawChannel);
  if (!Number.isInteger(channelId) || channelId <= 0) notFound();
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const detail = await getChannelDetail(user, projectId, channelId);
  if (!detail) notFound();

  const { channel, cases, guard, run } = detail;
  const base = `/projects/${projectId}/audit`;
  const selectedKey = typeof sp.case === 'string' ? sp.case : null;
  // Worst first: the case that decides the channel is the one shown when none is picked.
  const severity = { unprotected: 4, fails: 3, incomplete: 2, marginal: 1, holds: 0 } as const;
  const ordered = [...cases].sort(
    (a, b) =>
      severity[b.finding.verdict] - severity[a.finding.verdict] ||
      (a.finding.margin ?? Infinity) - (b.finding.margin ?? Infinity) ||
      a.finding.key.localeCompare(b.finding.key),
  );
  const selected = ordered.find((c) => c.finding.key === selectedKey) ?? ordered[0] ?? null;
  const worstFinding = ordered[0]?.finding ?? null;
  const exposed = ordered.filter((c) => c.finding.exposure);
  const waveform = selected?.waveformKey ? detail.waveforms[selected.waveformKey] : null;
  // Source and field terminal, each inner node (Ohm's law on the engine's series currents), the input.
  const voltageTraces = waveform
    ? [
        ...waveform.traces.filter((t) => t.unit === 'V' && t.name !== 'input'),
        ...(guard ? innerNodeTraces(guard, waveform) : []),
        ...waveform.traces.filter((t) => t.name === 'input'),
      ]
    : [];
  const currentTraces = waveform ? waveform.traces.filter((t) => t.unit === 'A') : [];
  const caseHref = (key: string) =>
    `${base}/channels/${channelId}?case=${encodeURIComponent(key)}#case`;

  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm text-muted">
        <Link href={base} className="underline-offset-2 hover:underline">
          Findings
        </Link>{' '}
        / <span className="font-mono text-ink">{channel.tag}</span>
      </nav>

      <header className="flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0">
          <h2 className="flex flex-wrap items-center gap-3 text-2xl font-semibold">
            <span className="font-mono">{channel.tag}</span>
            {detail.worstVerdict && <VerdictBadge verdict={detail.worstVerdict} size="lg" />}
          </h2>
          <p className="mt-1 text-sm text-muted">
            {channel.name ?? 'Unnamed channel'} · cabinet{' '}
            <span className="font-mono">{channel.cabinetTag}</span> · {channel.signalType} · guard{' '}
            {channel.guardRecipeName ? (
              <span className="font-medium text-ink">{channel.guardRecipeName}</span>
            ) : (
              <strong className="text-ink">none</strong>
            )}
            {detail.overriddenIds.length > 0 && (
              <> (as built: {detail.overriddenIds.join(', ')} differ from the recipe)</>
            )}
          </p>
          {worstFinding && (
            <p className="mt-2 max-w-3xl text-base" data-testid="channel-reason">
              <span className="font-medium">{worstFinding.caseLabel}:</span> {worstFinding.reason}
            </p>
          )}
        </div>
      </header>

      <Caution />

      {!run && (
        <Panel>
          <p className="font-medium">This project has not been audited yet.</p>
          <p className="mt-1 text-sm text-muted">
            The stress on this channel is worked out by an audit run.{' '}
            {can(detail.standing, 'audit:run') ? (
              <>
                <Link className="underline" href={base}>
                  Go to the findings
                </Link>{' '}
                to run one.
              </>
            ) : (
              'A controls engineer runs it.'
            )}
          </p>
        </Panel>
      )}
      {run?.stale && (
        <p role="status" className="rounded-sm border border-caution bg-caution-soft p-3 text-sm">
          The schedule or the assumptions changed after audit run #{run.id}. What follows is that
          run&apos;s result; run the audit again to bring it up to date.
        </p>
      )}

      <div className="grid gap-6">
        <Panel className="min-w-0">
          <PanelTitle>Where it lands</PanelTitle>
          {detail.strips.length > 0 ? (
            <div className="overflow-x-auto">
              <StripDrawing
                strips={detail.strips}
                terminals={detail.terminals}
                exposures={detail.exposures}
                verdicts={detail.verdicts}
                selectedId={channel.signalTerminalId}
              />
            </div>
          ) : (
            <p className="text-sm text-muted">The channel is not mapped to a terminal.</p>
          )}
          {detail.strips.map((s) => (
            <Link
              key={s.id}
              href={`${base}/strips/${s.id}`}
              className="mr-3 text-sm underline-offset-2 hover:underline"
            >
              Strip {s.tag}: verdicts and re-sequencing →
            </Link>
          ))}
        </Panel>
        <Panel className="min-w-0">
          <PanelTitle>Guard</PanelTitle>
          {guard ? (
            <GuardSchematic
              guard={guard}
              marked={detail.overriddenIds}
              title={`Guard of ${channel.tag}`}
            />
          ) : (
            <p className="text-sm">
              <strong>No guard.</strong> Nothing limits the current a hazard can push into this
              input.
            </p>
          )}
        </Panel>
      </div>

      <Panel>
        <PanelTitle aside={<span className="text-xs text-muted">{exposed.length} exposures</span>}>
          Exposures
        </PanelTitle>
        {exposed.length === 0 ? (
          <p className="text-sm text-muted">
            No hazard terminal can reach this channel by a wiring mistake the mapping knows of.
          </p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <caption className="sr-only">
                Hazard terminals a mistake could connect to this channel
              </caption>
              <thead className="text-left text-xs text-muted">
                <tr>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Hazard
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Reaches
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    How
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Likelihood
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Case
                  </th>
                  <th scope="col" className="py-1 pr-3 text-right font-medium">
                    Margin
                  </th>
                  <th scope="col" className="py-1 font-medium">
                    Verdict
                  </th>
                </tr>
              </thead>
              <tbody>
                {exposed.map(({ finding: f }) => (
                  <tr
                    key={f.key}
                    className={cn(
                      'border-t border-line',
                      selected?.finding.key === f.key && 'bg-accent-soft',
                    )}
                  >
                    <td className="py-1.5 pr-3 font-mono">
                      <Link href={caseHref(f.key)} className="underline-offset-2 hover:underline">
                        {f.exposure!.hazardLabel}
                      </Link>
                    </td>
                    <td className="py-1.5 pr-3 font-mono">{f.exposure!.targetLabel}</td>
                    <td className="py-1.5 pr-3">
                      {MECHANISM_LABEL[f.exposure!.mechanism]},{' '}
                      {ROUTE_LABEL[f.exposure!.route] ?? f.exposure!.route}
                    </td>
                    <td className="py-1.5 pr-3">{LIKELIHOOD_LABEL[f.exposure!.likelihood]}</td>
                    <td className="py-1.5 pr-3">{f.caseLabel}</td>
                    <td className="py-1.5 pr-3 text-right font-mono">{formatMargin(f.margin)}</td>
                    <td className="py-1.5">
                      <VerdictBadge verdict={f.verdict} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Panel>

      {selected && (
        <Panel id="case">
          <PanelTitle>Stress cases</PanelTitle>
          <div className="grid gap-6 lg:grid-cols-[16rem_1fr]">
            <nav aria-label="Stress cases of this channel">
              <ul className="space-y-1">
                {ordered.map(({ finding: f }) => {
                  const current = f.key === selected.finding.key;
                  return (
                    <li key={f.key}>
                      <Link
                        href={caseHref(f.key)}
                        aria-current={current ? 'true' : undefined}
                        className={cn(
                          'flex items-start gap-2 rounded-sm border px-2 py-1.5 text-sm',
                          current
                            ? 'border-accent bg-accent-soft'
                            : 'border-transparent hover:border-line',
                        )}
                      >
                        <VerdictBadge verdict={f.verdict} />
                        <span className="min-w-0">
                          {f.caseLabel}
                          {f.exposure && (
                            <span className="block font-mono text-xs text-muted">
                              from {f.exposure.hazardLabel}
                            </span>
                          )}
                        </span>
                      </Link>
                    </li>
                  );
                })}
              </ul>
            </nav>
            <div className="min-w-0 space-y-6">
              <h3 className="text-lg font-semibold">
                {selected.finding.caseLabel}
                {selected.finding.exposure && (
                  <span className="text-muted"> from {selected.finding.exposure.hazardLabel}</span>
                )}
              </h3>
              {selected.finding.exposure && (
                <p className="text-sm">{selected.finding.exposure.reason}</p>
              )}
              {guard &&
              selected.finding.stress &&
              selected.finding.input &&
              selected.finding.sourcePeakCurrent !== null ? (
                <CaseCalculations
                  guard={guard}
                  result={{
                    case: selected.finding.stress,
                    verdict: selected.finding.verdict,
                    reason: selected.finding.reason,
                    elements: selected.finding.elements,
                    input: selected.finding.input,
                    rails: selected.finding.rails,
                    sourcePeakCurrent: selected.finding.sourcePeakCurrent,
                  }}
                  conditions={detail.conditions[selected.finding.appliedTo]}
                  basis={selected.finding.basis}
                  label={selected.finding.caseLabel}
                  waveform={waveform}
                />
              ) : (
                <div className="flex flex-wrap items-start gap-3 rounded-sm border border-line bg-paper p-3">
                  <VerdictBadge verdict={selected.finding.verdict} size="lg" />
                  <p className="min-w-0 flex-1 text-sm" data-testid="case-reason">
                    {selected.finding.reason}
                  </p>
                </div>
              )}
              {waveform && waveform.t.length > 1 && selected.finding.stress && (
                <div className="grid gap-6">
                  <WaveformPlot
                    title={`Voltage ${PLOT_KIND[selected.finding.stress.kind]}`}
                    unit="V"
                    t={waveform.t}
                    traces={voltageTraces}
                  />
                  <WaveformPlot
                    title={`Current ${PLOT_KIND[selected.finding.stress.kind]}`}
                    unit="A"
                    t={waveform.t}
                    traces={currentTraces}
                  />
                </div>
              )}
              {waveform && waveform.t.length <= 1 && (
                <p className="text-sm text-muted">
                  A steady DC fault has no waveform to plot: the figures above hold for as long as
                  it lasts.
                </p>
              )}
            </div>
          </div>
        </Panel>
      )}

      {guard && cases.length > 0 && (
        <Panel>
          <PanelTitle>Remedies</PanelTitle>
          <RemedyPanel
            projectId={projectId}
            channelId={channelId}
            needed={detail.worstVerdict !== null && detail.worstVerdict !== 'holds'}
            guard={guard}
            conditions={detail.conditions}
            cases={ordered
              .filter((c) => c.finding.stress)
              .map((c) => ({
                key: c.finding.key,
                label: c.finding.exposure
                  ? `${c.finding.caseLabel} from ${c.finding.exposure.hazardLabel}`
                  : c.finding.caseLabel,
                stress: c.finding.stress!,
                appliedTo: c.finding.appliedTo,
                verdict: c.finding.verdict,
              }))}
          />
        </Panel>
      )}

      <Caution />
    </div>
  );
}
