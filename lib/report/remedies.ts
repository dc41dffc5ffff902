/**
 * The sizing remedies for a channel, in the shape the "what if" offers them. The channel's
 * cases may land on either terminal (signal or return), each with its own conditions, so the
 * sizing runs per terminal and the suggestions are merged; the "what if" then re-solves every
 * case of the channel with the chosen change, so the verdict it shows covers them all.
 */
import { suggestRemedies, type Remedy } from '../remedies';
import type { Guard, HazardTerminal, StressCase, StressConditions } from '../stress/types';
import { VERDICT_SEVERITY } from '../stress/types';
import { VERDICT_LABEL } from './format';

export interface RemedyOptionData {
  id: string;
  title: string;
  detail: string;
  changes: { elementId: string; field: string; to: number }[];
}

export function remedyOptions(
  guard: Guard,
  cases: { stress: StressCase; appliedTo: HazardTerminal }[],
  conditions: Record<HazardTerminal, StressConditions>,
): RemedyOptionData[] {
  const bySide = new Map<HazardTerminal, StressCase[]>();
  for (const c of cases) (bySide.get(c.appliedTo) ?? bySide.set(c.appliedTo, []).get(c.appliedTo)!).push(c.stress);
  const merged = new Map<string, { remedy: Remedy; changes: Map<string, { elementId: string; field: string; to: number }> }>();
  for (const [side, list] of bySide) {
    for (const r of suggestRemedies(guard, list, conditions[side])) {
      // The same element and field on both sides: keep the larger value (it must serve both).
      const key = `${r.kind}:${r.changes.map((c) => `${c.elementId}.${c.field}`).join('+')}`;
      const entry = merged.get(key) ?? merged.set(key, { remedy: r, changes: new Map() }).get(key)!;
      for (const c of r.changes) {
        const k = `${c.elementId}.${c.field}`;
        const prev = entry.changes.get(k);
        if (!prev || c.to > prev.to) entry.changes.set(k, { elementId: c.elementId, field: c.field, to: c.to });
      }
    }
  }
  // Those that make the channel hold first; otherwise in the sizing's own order.
  const ordered = [...merged.entries()].sort((a, b) => VERDICT_SEVERITY[a[1].remedy.verdict] - VERDICT_SEVERITY[b[1].remedy.verdict]);
  return ordered.map(([key, { remedy, changes }]) => ({
    id: key,
    title: remedy.description,
    detail: `Verdict after the change, as the sizing checked it: ${VERDICT_LABEL[remedy.verdict].toLowerCase()}${remedy.verdict === 'holds' ? '' : ` (${remedy.reason})`}.`,
    changes: [...changes.values()],
  }));
}
