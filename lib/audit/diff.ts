import type { CheckFinding } from '../exposure/types';
import type { Verdict } from '../stress/types';
import { canonicalJson } from './canonical';
import type { AuditResult, Finding, ProjectSnapshot } from './types';

export interface FindingChange {
  key: string;
  before: { verdict: Verdict; margin: number | null };
  after: { verdict: Verdict; margin: number | null };
  finding: Finding;
}

export interface AuditDelta {
  inputsChanged: boolean;
  newFindings: Finding[];
  resolvedFindings: Finding[];
  /** Same key, and the verdict or the margin moved. */
  changedFindings: FindingChange[];
  newChecks: CheckFinding[];
  resolvedChecks: CheckFinding[];
}

/** Margins are solver output: equal within 1e-9 absolute counts as unchanged. */
const MARGIN_TOLERANCE = 1e-9;

function marginMoved(a: number | null, b: number | null): boolean {
  if (a === null || b === null) return a !== b;
  return Math.abs(a - b) > MARGIN_TOLERANCE;
}

type Comparable = Pick<AuditResult, 'hash' | 'findings' | 'checks'>;

/** What re-running the audit changed, finding by finding (matched on `key`). */
export function diffAudits(previous: Comparable, current: Comparable): AuditDelta {
  const before = new Map(previous.findings.map((f) => [f.key, f]));
  const after = new Map(current.findings.map((f) => [f.key, f]));
  const delta: AuditDelta = {
    inputsChanged: previous.hash !== current.hash,
    newFindings: current.findings.filter((f) => !before.has(f.key)),
    resolvedFindings: previous.findings.filter((f) => !after.has(f.key)),
    changedFindings: [],
    newChecks: [],
    resolvedChecks: [],
  };
  for (const f of current.findings) {
    const old = before.get(f.key);
    if (!old) continue;
    if (old.verdict !== f.verdict || marginMoved(old.margin, f.margin)) {
      delta.changedFindings.push({
        key: f.key,
        before: { verdict: old.verdict, margin: old.margin },
        after: { verdict: f.verdict, margin: f.margin },
        finding: f,
      });
    }
  }
  const checksBefore = new Set(previous.checks.map((c) => c.key));
  const checksAfter = new Set(current.checks.map((c) => c.key));
  delta.newChecks = current.checks.filter((c) => !checksBefore.has(c.key));
  delta.resolvedChecks = previous.checks.filter((c) => !checksAfter.has(c.key));
  return delta;
}

export type SnapshotEntity = 'cabinet' | 'strip' | 'terminal' | 'channel' | 'guard' | 'settings';

export interface SnapshotChange {
  entity: SnapshotEntity;
  id: string;
  /** The label, tag or name a person knows it by. */
  label: string;
  change: 'added' | 'removed' | 'changed';
  fields: { field: string; before: unknown; after: unknown }[];
}

function labelOf(x: Record<string, unknown>): string {
  for (const f of ['label', 'tag', 'name']) if (typeof x[f] === 'string') return x[f] as string;
  return String(x.id);
}

function diffRecords(
  entity: SnapshotEntity,
  id: string,
  a: Record<string, unknown>,
  b: Record<string, unknown>,
): SnapshotChange | null {
  const fields: SnapshotChange['fields'] = [];
  for (const f of [...new Set([...Object.keys(a), ...Object.keys(b)])].sort()) {
    const va = a[f] ?? null;
    const vb = b[f] ?? null;
    if (canonicalJson(va) !== canonicalJson(vb)) fields.push({ field: f, before: va, after: vb });
  }
  return fields.length === 0 ? null : { entity, id, label: labelOf(b), change: 'changed', fields };
}

/** The input changes between two snapshots, entity by entity and field by field. */
export function diffSnapshots(
  previous: ProjectSnapshot,
  current: ProjectSnapshot,
): SnapshotChange[] {
  const out: SnapshotChange[] = [];
  const lists: [SnapshotEntity, keyof ProjectSnapshot][] = [
    ['cabinet', 'cabinets'],
    ['strip', 'strips'],
    ['terminal', 'terminals'],
    ['channel', 'channels'],
    ['guard', 'guards'],
  ];
  for (const [entity, field] of lists) {
    const a = new Map(
      (previous[field] as unknown as Record<string, unknown>[]).map((x) => [String(x.id), x]),
    );
    const b = new Map(
      (current[field] as unknown as Record<string, unknown>[]).map((x) => [String(x.id), x]),
    );
    for (const id of [...new Set([...a.keys(), ...b.keys()])].sort()) {
      const x = a.get(id);
      const y = b.get(id);
      if (!x) out.push({ entity, id, label: labelOf(y!), change: 'added', fields: [] });
      else if (!y) out.push({ entity, id, label: labelOf(x), change: 'removed', fields: [] });
      else {
        const d = diffRecords(entity, id, x, y);
        if (d) out.push(d);
      }
    }
  }
  const s = diffRecords(
    'settings',
    'settings',
    previous.settings as unknown as Record<string, unknown>,
    current.settings as unknown as Record<string, unknown>,
  );
  if (s) out.push({ ...s, label: 'project settings' });
  return out;
}
