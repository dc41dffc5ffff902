import { projectRoute } from '@/lib/auth/guard';
import { getAuditRun } from '@/lib/data/audits';
import { runIdParams } from '@/lib/validation/audit';

export const GET = projectRoute(
  { capability: 'audit:read', params: runIdParams },
  async ({ actor, params }) => getAuditRun(actor.projectId, params.runId),
);
