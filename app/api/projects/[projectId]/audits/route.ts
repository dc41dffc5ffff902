import { projectRoute } from '@/lib/auth/guard';
import { deltaCounts, listAuditRuns, runProjectAudit, type RunProgress } from '@/lib/data/audits';

export const GET = projectRoute({ capability: 'audit:read' }, async ({ actor }) => ({
  items: await listAuditRuns(actor.projectId),
}));

/**
 * Runs the audit and streams its progress as NDJSON lines, ending with a "done" line (the new
 * run's id, hash, summary and the delta against the previous run) or an "error" line.
 */
export const POST = projectRoute({ capability: 'audit:run' }, async ({ actor }) => {
  const encoder = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (line: unknown) => {
        try {
          controller.enqueue(encoder.encode(`${JSON.stringify(line)}\n`));
        } catch {
          // The client went away; the run still completes and is stored.
        }
      };
      let last = 0;
      const onProgress = (p: RunProgress) => {
        // Throttle: a line per phase change or every 50 ms is plenty for a progress bar.
        const now = Date.now();
        if (p.done === 0 || p.done === p.total || now - last > 50) {
          last = now;
          send({ type: 'progress', phase: p.phase, done: p.done, total: p.total });
        }
      };
      try {
        const result = await runProjectAudit(actor, onProgress);
        send({
          type: 'done',
          runId: result.runId,
          hash: result.hash,
          summary: result.summary,
          delta: deltaCounts(result.delta),
        });
      } catch (error) {
        send({
          type: 'error',
          error: error instanceof Error ? error.message : 'The audit failed; nothing was stored.',
        });
      } finally {
        try {
          controller.close();
        } catch {
          // already closed by a disconnect
        }
      }
    },
  });
  return new Response(stream, {
    headers: { 'content-type': 'application/x-ndjson; charset=utf-8', 'cache-control': 'no-store' },
  });
});
