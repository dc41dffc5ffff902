import { projectRoute } from '@/lib/auth/guard';
import { listFindings } from '@/lib/data/audits';
import { findingsQuerySchema, runIdParams } from '@/lib/validation/audit';

export const GET = projectRoute(
  { capability: 'audit:read', params: runIdParams, query: findingsQuerySchema },
  async ({ actor, params, query }) => listFindings(actor.projectId, params.runId, query),
);
