'use client';

import { useMemo, useState, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/input';
import { solveStress } from '@/lib/stress/solve';
import {
  VERDICT_SEVERITY,
  type Guard,
  type GuardElement,
  type HazardTerminal,
  type StressCase,
  type StressConditions,
  type Verdict,
} from '@/lib/stress/types';
import { formatEng, parseEng, type UnitSymbol } from '@/lib/units';
import { VerdictBadge } from './verdict-badge';

export interface WhatIfCase {
  key: string;
  label: string;
  stress: StressCase;
  appliedTo: HazardTerminal;
  verdict: Verdict;
}

/** One suggested change: new figures for one or more elements. */
export interface RemedyOption {
  id: string;
  title: string;
  detail: string;
  changes: { elementId: string; field: string; to: number }[];
}

type Edits = Record<string, Record<string, number>>;

/** The unit a figure is entered in, from its name (the engine's fields are SI). */
export function unitOfField(field: string): UnitSymbol | undefined {
  if (/resistance|impedance/i.test(field)) return 'Ω';
  if (/power/i.test(field)) return 'W';
  if (/voltage/i.test(field)) return 'V';
  if (/i2t/i.test(field)) return 'A²s';
  if (/current/i.test(field)) return 'A';
  if (/energy/i.test(field)) return 'J';
  if (/capacitance/i.test(field)) return 'F';
  if (/duration/i.test(field)) return 's';
  return undefined;
}

function elementsOf(guard: Guard): GuardElement[] {
  return guard.stages.flatMap((s) => [s.series, ...s.shunts]);
}

function numericFields(el: GuardElement): string[] {
  return Object.entries(el)
    .filter(([k, v]) => k !== 'id' && k !== 'kind' && typeof v === 'number')
    .map(([k]) => k);
}

/** The guard with trial figures laid over it (a copy: the page's guard is never touched). */
export function withEdits(guard: Guard, edits: Edits): Guard {
  const copy = structuredClone(guard);
  for (const stage of copy.stages) {
    for (const el of [stage.series, ...stage.shunts]) {
      const e = edits[el.id];
      if (e) Object.assign(el, e);
    }
  }
  return copy;
}

function worst(verdicts: Verdict[]): Verdict {
  return verdicts.reduce<Verdict>(
    (w, v) => (VERDICT_SEVERITY[v] > VERDICT_SEVERITY[w] ? v : w),
    'holds',
  );
}

/**
 * Re-solves every stress case of the channel with trial figures, in the browser (the engine is
 * pure TypeScript). Nothing is saved: adopting a change is an edit of the channel's guard.
 */
export function WhatIf({
  guard,
  cases,
  conditions,
  remedies,
  status,
}: {
  guard: Guard;
  cases: WhatIfCase[];
  conditions: Record<HazardTerminal, StressConditions>;
  remedies: RemedyOption[];
  /** Shown instead of the suggestions while they are worked out (or when none are needed). */
  status?: ReactNode;
}) {
  const elements = useMemo(() => elementsOf(guard), [guard]);
  const [edits, setEdits] = useState<Edits>({});
  const [elementId, setElementId] = useState(elements[0]?.id ?? '');
  const element = elements.find((e) => e.id === elementId);
  const fields = element ? numericFields(element) : [];
  const [field, setField] = useState(fields[0] ?? '');
  const [text, setText] = useState('');
  const [error, setError] = useState<string | null>(null);

  const trial = Object.keys(edits).length > 0;
  const outcome = useMemo(() => {
    if (!trial) return null;
    const g = withEdits(guard, edits);
    return cases.map((c) => {
      try {
        const r = solveStress(g, c.stress, conditions[c.appliedTo]);
        return { key: c.key, verdict: r.verdict, reason: r.reason };
      } catch (err) {
        return {
          key: c.key,
          verdict: 'incomplete' as Verdict,
          reason: err instanceof Error ? err.message : String(err),
        };
      }
    });
  }, [trial, guard, edits, cases, conditions]);

  const before = worst(cases.map((c) => c.verdict));
  const after = outcome ? worst(outcome.map((o) => o.verdict)) : null;

  const apply = (changes: { elementId: string; field: string; to: number }[]) => {
    setEdits((e) => {
      const next: Edits = { ...e };
      for (const c of changes)
        next[c.elementId] = { ...(next[c.elementId] ?? {}), [c.field]: c.to };
      return next;
    });
    setError(null);
  };

  const tryManual = () => {
    if (!element || !field) return;
    try {
      const value = parseEng(text, unitOfField(field));
      if (!Number.isFinite(value) || value < 0) throw new Error('must be a number ≥ 0');
      apply([{ elementId: element.id, field, to: value }]);
      setText('');
    } catch (err) {
      setError(`${element.id}.${field}: ${err instanceof Error ? err.message : String(err)}`);
    }
  };

  return (
    <div className="space-y-4" data-testid="what-if">
      {status ? (
        status
      ) : remedies.length > 0 ? (
        <ul className="space-y-2">
          {remedies.map((r) => (
            <li
              key={r.id}
              className="flex flex-wrap items-center justify-between gap-3 rounded-sm border border-line p-3"
            >
              <div className="min-w-0 flex-1">
                <p className="font-medium">{r.title}</p>
                <p className="text-sm text-muted">{r.detail}</p>
              </div>
              <Button
                variant="secondary"
                size="sm"
                onClick={() => apply(r.changes)}
                aria-label={`What if: ${r.title}`}
              >
                What if?
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-muted">No sizing change is suggested for this channel.</p>
      )}

      <fieldset className="rounded-sm border border-line p-3">
        <legend className="px-1 text-sm font-medium">Try a figure of your own</legend>
        <div className="flex flex-wrap items-end gap-3">
          <label className="text-sm">
            <span className="block text-muted">Element</span>
            <select
              className="h-10 rounded-sm border border-line bg-panel px-2 text-sm"
              value={elementId}
              onChange={(e) => {
                setElementId(e.target.value);
                const el = elements.find((x) => x.id === e.target.value);
                setField(el ? (numericFields(el)[0] ?? '') : '');
              }}
            >
              {elements.map((e) => (
                <option key={e.id} value={e.id}>
                  {e.id} ({e.kind})
                </option>
              ))}
            </select>
          </label>
          <label className="text-sm">
            <span className="block text-muted">Figure</span>
            <select
              className="h-10 rounded-sm border border-line bg-panel px-2 text-sm"
              value={field}
              onChange={(e) => setField(e.target.value)}
            >
              {fields.map((f) => (
                <option key={f} value={f}>
                  {f} (now{' '}
                  {formatEng(
                    (element as unknown as Record<string, number>)[f]!,
                    unitOfField(f) ?? '',
                  )}
                  )
                </option>
              ))}
            </select>
          </label>
          <label className="text-sm">
            <span className="block text-muted">New value</span>
            <Input
              className="w-36 font-mono"
              value={text}
              placeholder={
                unitOfField(field)
                  ? `e.g. 22k${unitOfField(field) === 'Ω' ? '' : unitOfField(field)}`
                  : ''
              }
              onChange={(e) => setText(e.target.value)}
              onKeyDown={(e) => {
                if (e.key === 'Enter') tryManual();
              }}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? 'what-if-error' : undefined}
            />
          </label>
          <Button variant="secondary" onClick={tryManual} disabled={!text.trim()}>
            Try
          </Button>
        </div>
        {error && (
          <p id="what-if-error" role="alert" className="mt-2 text-sm text-danger">
            {error}
          </p>
        )}
      </fieldset>

      {trial && outcome && after && (
        <div
          className="space-y-3 rounded-sm border border-accent bg-accent-soft p-3"
          aria-live="polite"
        >
          <div className="flex flex-wrap items-center gap-3">
            <span className="text-sm font-medium">Trial, not saved:</span>
            {Object.entries(edits).map(([id, ch]) => (
              <span key={id} className="font-mono text-sm">
                {id}:{' '}
                {Object.entries(ch)
                  .map(([f, v]) => `${f} ${formatEng(v, unitOfField(f) ?? '')}`)
                  .join(', ')}
              </span>
            ))}
            <Button variant="ghost" size="sm" onClick={() => setEdits({})}>
              Reset
            </Button>
          </div>
          <p className="flex flex-wrap items-center gap-2 text-sm" data-testid="what-if-verdict">
            Channel verdict: <VerdictBadge verdict={before} /> <span aria-hidden>→</span>
            <span className="sr-only">becomes</span> <VerdictBadge verdict={after} size="lg" />
          </p>
          <table className="w-full text-sm">
            <caption className="sr-only">Each stress case re-solved with the trial figures</caption>
            <thead className="text-left text-xs text-muted">
              <tr>
                <th scope="col" className="py-1 pr-2 font-medium">
                  Case
                </th>
                <th scope="col" className="py-1 pr-2 font-medium">
                  Audited
                </th>
                <th scope="col" className="py-1 pr-2 font-medium">
                  With the trial
                </th>
                <th scope="col" className="py-1 font-medium">
                  Why
                </th>
              </tr>
            </thead>
            <tbody>
              {cases.map((c, k) => (
                <tr key={c.key} className="border-t border-line align-top">
                  <td className="py-1 pr-2">{c.label}</td>
                  <td className="py-1 pr-2">
                    <VerdictBadge verdict={c.verdict} />
                  </td>
                  <td className="py-1 pr-2">
                    <VerdictBadge verdict={outcome[k]!.verdict} />
                  </td>
                  <td className="py-1 text-xs">{outcome[k]!.reason}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-xs text-muted">
            Nothing has been saved. To adopt a change, an engineer edits the channel&apos;s guard in
            the schedule and runs the audit again.
          </p>
        </div>
      )}
    </div>
  );
}
