'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import {
  overallFraction,
  PHASE_LABEL,
  takeLines,
  type RunDeltaCounts,
} from '@/lib/report/progress';

type State =
  | { status: 'idle' }
  | { status: 'running'; phase: string; done: number; total: number }
  | { status: 'done'; runId: number; delta: RunDeltaCounts | null }
  | { status: 'error'; error: string };

/** "Run audit": posts, reads the NDJSON progress stream, then refreshes the page's findings. */
export function RunAudit({
  projectId,
  stale,
  firstRun = false,
}: {
  projectId: number;
  stale: boolean;
  /** No run exists yet: there is no "last run" to be out of date against. */
  firstRun?: boolean;
}) {
  const router = useRouter();
  const [state, setState] = useState<State>({ status: 'idle' });

  const run = async () => {
    setState({ status: 'running', phase: 'loading', done: 0, total: 1 });
    try {
      const res = await fetch(`/api/projects/${projectId}/audits`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: '{}',
      });
      if (!res.ok || !res.body) {
        const body = (await res.json().catch(() => null)) as { error?: string } | null;
        setState({ status: 'error', error: body?.error ?? `The server answered ${res.status}.` });
        return;
      }
      const reader = res.body.getReader();
      const decoder = new TextDecoder();
      let buffer = '';
      let finished = false;
      for (;;) {
        const { value, done } = await reader.read();
        buffer += decoder.decode(value, { stream: !done });
        const { lines, rest } = takeLines(done ? `${buffer}\n` : buffer);
        buffer = rest;
        for (const line of lines) {
          if (line.type === 'progress')
            setState({ status: 'running', phase: line.phase, done: line.done, total: line.total });
          else if (line.type === 'done') {
            finished = true;
            setState({ status: 'done', runId: line.runId, delta: line.delta });
            router.refresh();
          } else {
            finished = true;
            setState({ status: 'error', error: line.error });
          }
        }
        if (done) break;
      }
      if (!finished)
        setState({
          status: 'error',
          error:
            'The connection closed before the audit reported its end; reload to see whether it was stored.',
        });
    } catch (err) {
      setState({ status: 'error', error: err instanceof Error ? err.message : String(err) });
    }
  };

  const running = state.status === 'running';
  const fraction = running
    ? overallFraction(state.phase, state.done, state.total)
    : state.status === 'done'
      ? 1
      : 0;

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={run} disabled={running} variant={stale ? 'primary' : 'secondary'}>
          {running ? 'Running…' : 'Run audit'}
        </Button>
        {stale && !firstRun && !running && state.status !== 'done' && (
          <span className="text-sm text-muted">
            The schedule or assumptions changed since the last run.
          </span>
        )}
      </div>
      {(running || state.status === 'done') && (
        <div className="max-w-md space-y-1" aria-live="polite">
          <div
            role="progressbar"
            aria-label="Audit progress"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={Math.round(fraction * 100)}
            aria-valuetext={
              running
                ? `${PHASE_LABEL[state.phase] ?? state.phase}, ${Math.round(fraction * 100)} %`
                : 'Done'
            }
            className="h-3 overflow-hidden rounded-sm border border-line bg-paper"
          >
            <div
              className="h-full bg-accent transition-[width]"
              style={{ width: `${(fraction * 100).toFixed(1)}%` }}
            />
          </div>
          <p className="text-sm" data-testid="run-phase">
            {running ? (
              <>
                {PHASE_LABEL[state.phase] ?? state.phase}
                {state.total > 1 && (
                  <span className="font-mono text-muted">
                    {' '}
                    {state.done} / {state.total}
                  </span>
                )}
              </>
            ) : state.status === 'done' ? (
              <>Audit run #{state.runId} stored.</>
            ) : null}
          </p>
        </div>
      )}
      {state.status === 'error' && (
        <p role="alert" className="text-sm text-danger">
          The audit did not complete: {state.error}
        </p>
      )}
    </div>
  );
}
