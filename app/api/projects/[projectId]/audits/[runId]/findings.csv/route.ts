import { projectRoute } from '@/lib/auth/guard';
import { listFindings } from '@/lib/data/audits';
import { findingsCsv } from '@/lib/data/findings-csv';
import { findingsQuerySchema, runIdParams } from '@/lib/validation/audit';

export const GET = projectRoute(
  { capability: 'audit:read', params: runIdParams, query: findingsQuerySchema },
  async ({ actor, params, query }) => {
    const { items } = await listFindings(actor.projectId, params.runId, { ...query, all: true });
    return new Response(findingsCsv(items), {
      headers: {
        'content-type': 'text/csv; charset=utf-8',
        'content-disposition': `attachment; filename="crossfault-run-${params.runId}-findings.csv"`,
      },
    });
  },
);
