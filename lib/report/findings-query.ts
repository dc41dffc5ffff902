/**
 * The findings table's state in the URL (so a filtered view can be shared): parse the search
 * params into the data layer's filters, and write filters back into a query string. Pure.
 */
import type { Verdict } from '../stress/types';

export const CASE_KINDS = ['ac', 'dc', 'surge', 'esd'] as const;
export const MECHANISM_FILTERS = [
  'neighbour',
  'stacked',
  'same-cable',
  'look-alike',
  'bridge',
  'transient',
] as const;
export const KIND_FILTERS = ['stress', 'segregation', 'colour'] as const;
const VERDICTS: readonly Verdict[] = ['unprotected', 'fails', 'incomplete', 'marginal', 'holds'];
const SORTS = ['margin', 'utilisation', 'channel', 'verdict'] as const;

export interface FindingsQuery {
  verdict: Verdict[];
  mechanism: string[];
  caseKind: string[];
  kind: ('stress' | 'segregation' | 'colour')[];
  cabinetId: number | null;
  stripId: number | null;
  sort: (typeof SORTS)[number];
  dir: 'asc' | 'desc';
  page: number;
}

/** Rows per page of the findings table. */
export const FINDINGS_PAGE_SIZE = 50;

type Params = Record<string, string | string[] | undefined>;

function list<T extends string>(raw: string | string[] | undefined, allowed: readonly T[]): T[] {
  const text = Array.isArray(raw) ? raw.join(',') : (raw ?? '');
  // Unknown words are dropped: a hand-edited URL narrows nothing it does not name.
  return text
    .split(',')
    .map((s) => s.trim())
    .filter((s): s is T => (allowed as readonly string[]).includes(s));
}

function id(raw: string | string[] | undefined): number | null {
  const n = Number(Array.isArray(raw) ? raw[0] : raw);
  return Number.isInteger(n) && n > 0 ? n : null;
}

export function parseFindingsQuery(sp: Params): FindingsQuery {
  const sort = list(sp.sort, SORTS)[0] ?? 'margin';
  const dir = sp.dir === 'desc' ? 'desc' : 'asc';
  return {
    verdict: list(sp.verdict, VERDICTS),
    mechanism: list(sp.mechanism, MECHANISM_FILTERS),
    caseKind: list(sp.case, CASE_KINDS),
    kind: list(sp.kind, KIND_FILTERS),
    cabinetId: id(sp.cabinet),
    stripId: id(sp.strip),
    sort,
    dir,
    page: id(sp.page) ?? 1,
  };
}

/** The query string for a state, leaving out defaults so URLs stay short. */
export function findingsQueryString(q: FindingsQuery): string {
  const p = new URLSearchParams();
  if (q.verdict.length) p.set('verdict', q.verdict.join(','));
  if (q.mechanism.length) p.set('mechanism', q.mechanism.join(','));
  if (q.caseKind.length) p.set('case', q.caseKind.join(','));
  if (q.kind.length) p.set('kind', q.kind.join(','));
  if (q.cabinetId) p.set('cabinet', String(q.cabinetId));
  if (q.stripId) p.set('strip', String(q.stripId));
  if (q.sort !== 'margin') p.set('sort', q.sort);
  if (q.dir !== 'asc') p.set('dir', q.dir);
  if (q.page > 1) p.set('page', String(q.page));
  const s = p.toString();
  return s ? `?${s}` : '';
}

/** The filters of lib/data/audits listFindings for this state (mechanism is matched after: see matchesMechanism). */
export function toFindingFilters(q: FindingsQuery) {
  return {
    verdict: q.verdict.length ? q.verdict : undefined,
    caseKind: q.caseKind.length ? q.caseKind : undefined,
    kind: q.kind.length ? q.kind : undefined,
    cabinetId: q.cabinetId ?? undefined,
    stripId: q.stripId ?? undefined,
    sort: q.sort,
    dir: q.dir,
    pageSize: 2000,
  };
}

/**
 * Mechanism filter, applied to the listed findings: surge and ESD findings are listed with
 * the mechanism 'transient', which is not a stored column value.
 */
export function matchesMechanism(q: FindingsQuery, mechanism: string | null): boolean {
  return (
    q.mechanism.length === 0 ||
    (mechanism !== null && (q.mechanism as string[]).includes(mechanism))
  );
}
