import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { FindingsTable, type FindingRow } from '@/components/report/findings-table';
import { RunAudit } from '@/components/report/run-audit';
import { VerdictBadge } from '@/components/report/verdict-badge';
import { Caution } from '@/components/ui/caution';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { can } from '@/lib/auth/permissions';
import {
  getAuditRun,
  getAuditStatus,
  getRunSnapshot,
  latestRunId,
  listFindings,
  type StoredFinding,
} from '@/lib/data/audits';
import { getSignedInUser, loadStanding } from '@/lib/data/membership';
import { formatMargin, VERDICT_LABEL, VERDICT_ORDER } from '@/lib/report/format';
import {
  CASE_KINDS,
  FINDINGS_PAGE_SIZE,
  findingsQueryString,
  KIND_FILTERS,
  matchesMechanism,
  MECHANISM_FILTERS,
  parseFindingsQuery,
  toFindingFilters,
} from '@/lib/report/findings-query';
import { MECHANISM_LABEL } from '@/lib/report/vocabulary';

export const metadata: Metadata = { title: 'Audit findings' };

/** One labelled filter drop-down whose first choice is "All". */
function FilterSelect({
  label,
  name,
  defaultValue,
  options,
}: {
  label: string;
  name: string;
  defaultValue: string | number;
  options: readonly (readonly [string, string])[];
}) {
  return (
    <label>
      <span className="mb-1 block text-xs text-muted">{label}</span>
      <select
        name={name}
        defaultValue={defaultValue}
        className="h-9 rounded-sm border border-line bg-panel px-2"
      >
        <option value="">All</option>
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );
}

const CASE_LABEL: Record<string, string> = {
  ac: 'AC mains',
  dc: 'DC supply',
  surge: 'Surge',
  esd: 'ESD',
};
const KIND_LABEL: Record<string, string> = {
  stress: 'Stress',
  segregation: 'Segregation',
  colour: 'Wire colour',
};

function toRow(f: StoredFinding, delta: Map<string, 'new' | 'changed'>): FindingRow {
  return {
    id: f.id,
    key: f.key,
    kind: f.kind,
    verdict: f.verdict,
    reason: f.reason,
    margin: f.margin,
    channelId: f.channelId,
    channelTag: f.channelTag,
    cabinetTag: f.cabinetTag,
    stripId: f.stripId,
    stripTag: f.stripTag,
    caseLabel: f.finding?.caseLabel ?? null,
    mechanism: f.mechanism,
    hazardLabel: f.finding?.exposure?.hazardLabel ?? null,
    delta: delta.get(f.key) ?? null,
  };
}

export default async function FindingsPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { projectId: raw } = await params;
  const projectId = Number(raw);
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const standing = await loadStanding(user, projectId);
  if (!standing || !can(standing, 'audit:read')) notFound();
  const mayRun = can(standing, 'audit:run');
  const query = parseFindingsQuery(await searchParams);
  const base = `/projects/${projectId}/audit`;

  const runId = await latestRunId(projectId);
  const status = await getAuditStatus(projectId);

  if (runId === null) {
    // Same header as below, so the Run button stays mounted (with its finished message) when
    // the page refreshes into its findings layout after the first run.
    return (
      <div className="space-y-6">
        <div className="flex flex-wrap items-start justify-between gap-4">
          <div>
            <h2 className="text-xl font-semibold">Audit findings</h2>
          </div>
          {mayRun && <RunAudit projectId={projectId} stale firstRun />}
        </div>
        <Caution />
        <Panel>
          <p className="font-medium">No audit has been run on this project yet.</p>
          <p className="mt-1 text-sm text-muted">
            An audit maps every sensitive channel&apos;s exposures to hazards and solves the stress
            on its guard for each case.
            {mayRun ? ' Run the first one with the button above.' : ' A controls engineer runs it.'}
          </p>
        </Panel>
      </div>
    );
  }

  const detail = await getAuditRun(projectId, runId);
  const assumed = (await getRunSnapshot(projectId, runId)).settings;
  const all = (await listFindings(projectId, runId, { pageSize: 2000, all: true })).items;
  const filtered = (
    await listFindings(projectId, runId, { ...toFindingFilters(query), all: true })
  ).items.filter((f) => matchesMechanism(query, f.mechanism));

  const deltaMark = new Map<string, 'new' | 'changed'>();
  for (const k of detail.delta?.newKeys ?? []) deltaMark.set(k, 'new');
  for (const c of detail.delta?.changed ?? []) deltaMark.set(c.key, 'changed');
  const pages = Math.max(1, Math.ceil(filtered.length / FINDINGS_PAGE_SIZE));
  const page = Math.min(query.page, pages);
  const rows = filtered
    .slice((page - 1) * FINDINGS_PAGE_SIZE, page * FINDINGS_PAGE_SIZE)
    .map((f) => toRow(f, deltaMark));

  const cabinets = [
    ...new Map(
      all.filter((f) => f.cabinetId !== null).map((f) => [f.cabinetId!, f.cabinetTag ?? '']),
    ).entries(),
  ].sort((a, b) => a[1].localeCompare(b[1]));
  const strips = [
    ...new Map(
      all
        .filter(
          (f) =>
            f.stripId !== null && (query.cabinetId === null || f.cabinetId === query.cabinetId),
        )
        .map((f) => [f.stripId!, `${f.cabinetTag ?? ''} / ${f.stripTag ?? ''}`]),
    ).entries(),
  ].sort((a, b) => a[1].localeCompare(b[1]));

  const flipDir = {
    ...query,
    page: 1,
    sort: 'margin' as const,
    dir: query.sort === 'margin' && query.dir === 'asc' ? ('desc' as const) : ('asc' as const),
  };
  const marginSortLabel =
    query.sort === 'margin' && query.dir === 'desc'
      ? 'sorted descending; activate for ascending'
      : 'sorted ascending; activate for descending';

  const csv = new URLSearchParams();
  if (query.verdict.length) csv.set('verdict', query.verdict.join(','));
  if (query.mechanism.length) csv.set('mechanism', query.mechanism.join(','));
  if (query.caseKind.length) csv.set('caseKind', query.caseKind.join(','));
  if (query.kind.length) csv.set('kind', query.kind.join(','));
  if (query.cabinetId) csv.set('cabinetId', String(query.cabinetId));
  if (query.stripId) csv.set('stripId', String(query.stripId));
  csv.set('sort', query.sort);
  csv.set('dir', query.dir);
  const csvHref = `/api/projects/${projectId}/audits/${runId}/findings.csv?${csv.toString()}`;

  const summary = detail.run.summary;
  const delta = detail.delta;
  const channelTags = new Map(detail.channels.map((c) => [c.channelId, c.tag]));

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h2 className="text-xl font-semibold">Audit findings</h2>
          <p className="text-sm text-muted">
            Run #{detail.run.id} of{' '}
            {new Date(detail.run.createdAt).toLocaleString('en-GB', { timeZone: 'UTC' })} UTC
            {detail.run.createdBy && <> by {detail.run.createdBy.name}</>} · review:{' '}
            {detail.run.reviewState}
            {' · '}
            {status.stale ? (
              <strong className="text-caution">schedule changed since this run</strong>
            ) : (
              <span>up to date with the schedule</span>
            )}
          </p>
        </div>
        {mayRun && <RunAudit projectId={projectId} stale={status.stale} />}
      </div>

      <Caution />

      <p className="text-sm text-muted" data-testid="run-assumptions">
        Assumptions of this run: supply tolerance +{Math.round(assumed.supplyTolerance * 1000) / 10}{' '}
        %, DC supply maximum {assumed.dcSupplyMax} V, surge {assumed.surgeLevelKv} kV (
        {assumed.surgeCoupling} coupling), ESD {assumed.esdLevelKv} kV contact, cabinet ambient{' '}
        {assumed.ambientC} °C, derating to {Math.round(assumed.powerDerating * 100)} % of rated
        power and {Math.round(assumed.voltageDerating * 100)} % of rated voltage.{' '}
        <Link href={`/projects/${projectId}/settings`} className="underline underline-offset-2">
          {can(standing, 'settings:write') ? 'Edit the assumptions' : 'See the assumptions'}
        </Link>
      </p>

      {summary && (
        <section aria-label="Channels by verdict" className="grid grid-cols-2 gap-3 sm:grid-cols-5">
          {VERDICT_ORDER.map((v) => (
            <Link
              key={v}
              href={`${base}${findingsQueryString({ ...query, page: 1, verdict: [v] })}`}
              className="rounded-sm border border-line bg-panel p-3 hover:border-ink"
            >
              <VerdictBadge verdict={v} />
              <span className="mt-1 block font-mono text-2xl">{summary.channelsByVerdict[v]}</span>
              <span className="text-xs text-muted">
                channels · {summary.findingsByVerdict[v]} findings
              </span>
            </Link>
          ))}
        </section>
      )}

      {delta && delta.previousRunId !== null && (
        <Panel aria-label="Changes since the previous run">
          <PanelTitle
            aside={<span className="text-xs text-muted">against run #{delta.previousRunId}</span>}
          >
            Since the previous run
          </PanelTitle>
          <p className="text-sm" data-testid="run-delta">
            <strong>{delta.newFindings}</strong> new, <strong>{delta.resolvedFindings}</strong>{' '}
            resolved, <strong>{delta.changedFindings}</strong> changed findings;{' '}
            <strong>{delta.newChecks}</strong> new and <strong>{delta.resolvedChecks}</strong>{' '}
            resolved rule checks.{' '}
            {delta.inputsChanged
              ? 'The schedule or assumptions changed between the runs.'
              : 'The inputs were identical.'}
          </p>
          {(delta.newKeys.length > 0 ||
            delta.resolvedKeys.length > 0 ||
            delta.changed.length > 0) && (
            <details className="mt-2 text-sm">
              <summary className="cursor-pointer text-muted">List them</summary>
              <div className="mt-2 grid gap-4 md:grid-cols-3">
                <div>
                  <h3 className="text-xs font-semibold text-muted uppercase">New</h3>
                  <ul className="font-mono text-xs">
                    {delta.newKeys.slice(0, 200).map((k) => (
                      <li key={k}>{k}</li>
                    ))}
                  </ul>
                </div>
                <div>
                  <h3 className="text-xs font-semibold text-muted uppercase">Resolved</h3>
                  <ul className="font-mono text-xs">
                    {delta.resolvedKeys.slice(0, 200).map((k) => (
                      <li key={k}>{k}</li>
                    ))}
                  </ul>
                </div>
                <div>
                  <h3 className="text-xs font-semibold text-muted uppercase">Changed</h3>
                  <ul className="space-y-1 text-xs">
                    {delta.changed.slice(0, 200).map((c) => (
                      <li key={c.key}>
                        <span className="font-mono">{c.key}</span>:{' '}
                        {VERDICT_LABEL[c.before.verdict]} ({formatMargin(c.before.margin)}) →{' '}
                        {VERDICT_LABEL[c.after.verdict]} ({formatMargin(c.after.margin)})
                      </li>
                    ))}
                  </ul>
                </div>
              </div>
            </details>
          )}
        </Panel>
      )}

      <Panel>
        <PanelTitle
          aside={
            <a href={csvHref} className="text-sm underline-offset-2 hover:underline" download>
              Export CSV
            </a>
          }
        >
          Findings{' '}
          <span className="font-mono text-muted normal-case">
            ({filtered.length} of {all.length})
          </span>
        </PanelTitle>
        <form
          method="get"
          action={base}
          className="mb-4 flex flex-wrap items-end gap-x-5 gap-y-3 text-sm"
          aria-label="Filter findings"
        >
          <fieldset>
            <legend className="mb-1 text-xs text-muted">Verdict</legend>
            <div className="flex flex-wrap gap-x-3 gap-y-1">
              {VERDICT_ORDER.map((v) => (
                <label key={v} className="flex items-center gap-1">
                  <input
                    type="checkbox"
                    name="verdict"
                    value={v}
                    defaultChecked={query.verdict.includes(v)}
                  />
                  {VERDICT_LABEL[v]}
                </label>
              ))}
            </div>
          </fieldset>
          <FilterSelect
            label="Cabinet"
            name="cabinet"
            defaultValue={query.cabinetId ?? ''}
            options={cabinets.map(([id, tag]) => [String(id), tag] as const)}
          />
          <FilterSelect
            label="Strip"
            name="strip"
            defaultValue={query.stripId ?? ''}
            options={strips.map(([id, tag]) => [String(id), tag] as const)}
          />
          <FilterSelect
            label="Exposure"
            name="mechanism"
            defaultValue={query.mechanism[0] ?? ''}
            options={MECHANISM_FILTERS.map((m) => [m, MECHANISM_LABEL[m]] as const)}
          />
          <FilterSelect
            label="Stress case"
            name="case"
            defaultValue={query.caseKind[0] ?? ''}
            options={CASE_KINDS.map((c) => [c, CASE_LABEL[c]] as const)}
          />
          <FilterSelect
            label="Kind"
            name="kind"
            defaultValue={query.kind[0] ?? ''}
            options={KIND_FILTERS.map((k) => [k, KIND_LABEL[k]] as const)}
          />
          {query.sort !== 'margin' && <input type="hidden" name="sort" value={query.sort} />}
          {query.dir !== 'asc' && <input type="hidden" name="dir" value={query.dir} />}
          <div className="flex items-center gap-3">
            <button
              type="submit"
              className="h-9 rounded-sm border border-ink bg-panel px-3 font-medium hover:bg-accent-soft"
            >
              Apply filters
            </button>
            <Link href={base} className="text-muted underline-offset-2 hover:underline">
              Clear
            </Link>
          </div>
        </form>
        <FindingsTable
          projectId={projectId}
          rows={rows}
          marginSortHref={`${base}${findingsQueryString(flipDir)}`}
          marginSortLabel={marginSortLabel}
        />
        {pages > 1 && (
          <nav
            aria-label="Pages of findings"
            className="mt-3 flex flex-wrap items-center gap-2 text-sm"
          >
            <span className="text-muted">
              Rows {(page - 1) * FINDINGS_PAGE_SIZE + 1}–
              {Math.min(page * FINDINGS_PAGE_SIZE, filtered.length)} of {filtered.length}
            </span>
            {Array.from({ length: pages }, (_, k) => k + 1).map((n) => (
              <Link
                key={n}
                href={`${base}${findingsQueryString({ ...query, page: n })}`}
                aria-current={n === page ? 'page' : undefined}
                className={`min-w-8 rounded-sm border px-2 py-1 text-center font-mono ${n === page ? 'border-accent bg-accent-soft' : 'border-line hover:border-ink'}`}
              >
                {n}
              </Link>
            ))}
          </nav>
        )}
      </Panel>

      {detail.unmappedChannels.length > 0 && (
        <p className="text-sm text-muted">
          Not audited (no signal terminal mapped):{' '}
          {detail.unmappedChannels.map((c) => c.tag).join(', ')}.
        </p>
      )}
      {channelTags.size === 0 && (
        <p className="text-sm text-muted">The run found no channels to audit.</p>
      )}
      <Caution />
    </div>
  );
}
