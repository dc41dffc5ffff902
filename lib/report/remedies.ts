/**
 * The sizing remedies for a channel, in the shape the "what if" offers them. The channel's
 * cases may land on either terminal (signal or return), each with its own conditions, so the
 * sizing runs per terminal and the suggestions of the same kind for the same elements are
 * merged, each figure taking the larger value (it must serve both). A suggestion made for one
 * side says nothing of the other, so every merged suggestion is re-solved against every case
 * of the channel, and that verdict is the one shown.
 */
import { formatEng } from '../units';
import { suggestRemedies, type Remedy, type RemedyChange } from '../remedies';
import { solveStress } from '../stress/solve';
import {
  VERDICT_SEVERITY,
  type Guard,
  type HazardTerminal,
  type StressCase,
  type StressConditions,
  type Verdict,
} from '../stress/types';
import { VERDICT_LABEL } from './format';

export interface RemedyOptionData {
  id: string;
  title: string;
  detail: string;
  changes: { elementId: string; field: string; to: number }[];
}

interface Merged {
  first: Remedy;
  count: number;
  changes: Map<string, RemedyChange>;
}

/** The channel's verdict over all its cases with the changes laid over the guard (the worst case's reason). */
function verdictWith(
  guard: Guard,
  changes: RemedyChange[],
  cases: { stress: StressCase; appliedTo: HazardTerminal }[],
  conditions: Record<HazardTerminal, StressConditions>,
): { verdict: Verdict; reason: string } {
  const trial = structuredClone(guard);
  for (const stage of trial.stages) {
    for (const el of [stage.series, ...stage.shunts]) {
      for (const c of changes)
        if (c.elementId === el.id) (el as unknown as Record<string, number>)[c.field] = c.to;
    }
  }
  let worst: { verdict: Verdict; reason: string } = { verdict: 'holds', reason: '' };
  for (const c of cases) {
    const r = solveStress(trial, c.stress, conditions[c.appliedTo]);
    if (VERDICT_SEVERITY[r.verdict] > VERDICT_SEVERITY[worst.verdict])
      worst = { verdict: r.verdict, reason: r.reason };
  }
  return worst;
}

function changeText(c: RemedyChange): string {
  return `${c.elementId} ${c.field}: ${c.from === null ? 'not given' : formatEng(c.from, c.unit)} → ${formatEng(c.to, c.unit)}`;
}

export function remedyOptions(
  guard: Guard,
  cases: { stress: StressCase; appliedTo: HazardTerminal }[],
  conditions: Record<HazardTerminal, StressConditions>,
): RemedyOptionData[] {
  const bySide = new Map<HazardTerminal, StressCase[]>();
  for (const c of cases)
    (bySide.get(c.appliedTo) ?? bySide.set(c.appliedTo, []).get(c.appliedTo)!).push(c.stress);
  const merged = new Map<string, Merged>();
  for (const [side, list] of bySide) {
    for (const r of suggestRemedies(guard, list, conditions[side])) {
      const key = `${r.kind}:${[...new Set(r.changes.map((c) => c.elementId))].sort().join('+')}`;
      const entry = merged.get(key);
      if (!entry) {
        merged.set(key, {
          first: r,
          count: 1,
          changes: new Map(r.changes.map((c) => [`${c.elementId}.${c.field}`, c])),
        });
        continue;
      }
      entry.count++;
      for (const c of r.changes) {
        const k = `${c.elementId}.${c.field}`;
        const prev = entry.changes.get(k);
        if (!prev || c.to > prev.to) entry.changes.set(k, c);
      }
    }
  }
  const checked = [...merged.entries()].map(([key, m]) => {
    const changes = [...m.changes.values()];
    return { key, m, changes, after: verdictWith(guard, changes, cases, conditions) };
  });
  // Those that make the channel hold first; otherwise in the sizing's own order.
  checked.sort((a, b) => VERDICT_SEVERITY[a.after.verdict] - VERDICT_SEVERITY[b.after.verdict]);
  return checked.map(({ key, m, changes, after }) => {
    return {
      id: key,
      // The sizing's own words when one side gave it; our summary of the merged figures otherwise.
      title:
        m.count === 1
          ? m.first.description
          : `${changes.map(changeText).join('; ')} (larger of the signal- and return-side sizings)`,
      detail: `With this change, over every case of the channel: ${VERDICT_LABEL[after.verdict].toLowerCase()}${after.verdict === 'holds' ? '' : ` (${after.reason})`}.`,
      changes: changes.map((c) => ({ elementId: c.elementId, field: c.field, to: c.to })),
    };
  });
}
