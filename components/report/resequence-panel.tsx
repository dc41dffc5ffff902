'use client';

import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { StripDrawing } from '@/components/strip/strip-drawing';
import { Button } from '@/components/ui/button';
import type { ResequenceView } from '@/lib/data/resequence';
import type { StripView, TerminalView } from '@/lib/data/channel-detail';

/** The strip as the proposal would leave it: new positions, added barriers or spares. */
export function proposedTerminals(
  terminals: TerminalView[],
  proposal: ResequenceView,
): TerminalView[] {
  const byId = new Map(terminals.map((t) => [String(t.id), t]));
  const out: TerminalView[] = [];
  let synthetic = -1;
  for (const slot of proposal.order) {
    if (slot.kind === 'terminal') {
      const t = byId.get(slot.terminalId);
      if (t) out.push({ ...t, position: slot.position });
    } else {
      const template = terminals[0]!;
      out.push({
        ...template,
        id: synthetic--,
        position: slot.position,
        level: 1,
        label: slot.kind === 'barrier' ? 'new barrier' : 'new spare',
        terminalNumber: null,
        circuitClass: slot.kind,
        channelId: null,
        channelTag: null,
        bridgeGroup: null,
        wireNumber: null,
        nominalVoltage: null,
        currentKind: null,
        hazardKind: null,
      });
    }
  }
  return out;
}

type Phase =
  | { step: 'view' }
  | { step: 'confirm' }
  | { step: 'applying' }
  | { step: 'done'; count: number }
  | { step: 'error'; message: string };

/**
 * The re-sequencing proposal, before and after, with the moves listed. Applying it is an
 * engineer's explicit act with a confirm step; it sends back the proposal's fingerprint and
 * the terminal versions it was shown, so a strip that changed meanwhile is refused (409).
 */
export function ResequencePanel({
  projectId,
  strip,
  terminals,
  proposal,
  mayApply,
}: {
  projectId: number;
  strip: StripView;
  terminals: TerminalView[];
  proposal: ResequenceView;
  mayApply: boolean;
}) {
  const router = useRouter();
  const [phase, setPhase] = useState<Phase>({ step: 'view' });
  const after = useMemo(() => proposedTerminals(terminals, proposal), [terminals, proposal]);
  const slides = proposal.renumbered.filter(
    (r) => !proposal.moves.some((m) => m.terminalId === r.terminalId),
  );

  const apply = async () => {
    setPhase({ step: 'applying' });
    try {
      const res = await fetch(`/api/projects/${projectId}/strips/${strip.id}/resequence/apply`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ fingerprint: proposal.fingerprint, versions: proposal.versions }),
      });
      const body = (await res.json().catch(() => null)) as {
        error?: string;
        items?: unknown[];
      } | null;
      if (!res.ok) {
        setPhase({ step: 'error', message: body?.error ?? `The server answered ${res.status}.` });
        return;
      }
      setPhase({
        step: 'done',
        count: Array.isArray(body?.items) ? body.items.length : proposal.renumbered.length,
      });
      router.refresh();
    } catch (err) {
      setPhase({ step: 'error', message: err instanceof Error ? err.message : String(err) });
    }
  };

  if (!proposal.changed) {
    return (
      <p className="text-sm">
        {proposal.note ||
          'The present order is already the best the proposal finds: nothing to move.'}
      </p>
    );
  }

  return (
    <div className="space-y-4">
      <p className="text-sm">
        Exposures between terminals of this strip:{' '}
        <strong className="font-mono">{proposal.before.exposures}</strong> now,{' '}
        <strong className="font-mono">{proposal.after.exposures}</strong> after.{' '}
        {proposal.moves.length} terminals lifted and landed elsewhere, {proposal.renumbered.length}{' '}
        renumbered in all, {proposal.addedSeparators.length} separators added.
      </p>
      {proposal.note && <p className="text-sm text-muted">{proposal.note}</p>}
      <div className="grid gap-4">
        <figure className="min-w-0">
          <figcaption className="mb-1 text-xs font-semibold text-muted uppercase">
            Before
          </figcaption>
          <div className="overflow-x-auto">
            <StripDrawing strips={[strip]} terminals={terminals} />
          </div>
        </figure>
        <figure className="min-w-0">
          <figcaption className="mb-1 text-xs font-semibold text-muted uppercase">
            After (proposed)
          </figcaption>
          <div className="overflow-x-auto">
            <StripDrawing strips={[strip]} terminals={after} />
          </div>
        </figure>
      </div>
      <table className="text-sm">
        <caption className="mb-1 text-left text-xs font-semibold text-muted uppercase">
          Moves
        </caption>
        <thead className="text-left text-xs text-muted">
          <tr>
            <th scope="col" className="pr-4 font-medium">
              Terminal
            </th>
            <th scope="col" className="pr-4 font-medium">
              From
            </th>
            <th scope="col" className="font-medium">
              To
            </th>
          </tr>
        </thead>
        <tbody>
          {proposal.moves.map((m) => (
            <tr key={m.terminalId} className="border-t border-line">
              <td className="pr-4 font-mono">{m.label}</td>
              <td className="pr-4 font-mono">{m.from}</td>
              <td className="font-mono">{m.to}</td>
            </tr>
          ))}
          {proposal.addedSeparators.map((s) => (
            <tr key={`sep-${s.position}`} className="border-t border-line">
              <td className="pr-4">new {s.kind}</td>
              <td className="pr-4">—</td>
              <td className="font-mono">{s.position}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {slides.length > 0 && (
        <details className="text-sm">
          <summary className="cursor-pointer text-muted">
            {slides.length} terminals slide along the rail to make room (renumbered, not re-landed)
          </summary>
          <ul className="mt-1 columns-2 font-mono text-xs sm:columns-3">
            {slides.map((r) => (
              <li key={r.terminalId}>
                {r.label}: {r.from} → {r.to}
              </li>
            ))}
          </ul>
        </details>
      )}

      {mayApply ? (
        <div className="space-y-2">
          {phase.step === 'view' && (
            <Button onClick={() => setPhase({ step: 'confirm' })}>Apply this order…</Button>
          )}
          {phase.step === 'confirm' && (
            <div
              role="alertdialog"
              aria-labelledby="reseq-confirm"
              className="space-y-2 rounded-sm border border-danger bg-danger-soft p-3"
            >
              <p id="reseq-confirm" className="text-sm">
                This renumbers {proposal.renumbered.length} terminals of strip {strip.tag} and adds{' '}
                {proposal.addedSeparators.length} separators in the schedule. The wiring on site
                must follow the new order, and the audit must be run again.
              </p>
              <div className="flex gap-2">
                <Button variant="danger" onClick={apply} autoFocus>
                  Confirm: apply to the schedule
                </Button>
                <Button variant="secondary" onClick={() => setPhase({ step: 'view' })}>
                  Cancel
                </Button>
              </div>
            </div>
          )}
          {phase.step === 'applying' && <p className="text-sm">Applying…</p>}
          {phase.step === 'done' && (
            <p role="status" className="text-sm">
              Applied: {phase.count} terminals updated. Run the audit again to see the new verdicts.
            </p>
          )}
          {phase.step === 'error' && (
            <p role="alert" className="text-sm text-danger">
              Not applied: {phase.message}
            </p>
          )}
        </div>
      ) : (
        <p className="text-sm text-muted">
          Only a controls engineer may apply a re-sequencing to the schedule.
        </p>
      )}
    </div>
  );
}
