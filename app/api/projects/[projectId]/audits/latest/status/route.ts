import { projectRoute } from '@/lib/auth/guard';
import { getAuditStatus } from '@/lib/data/audits';

export const GET = projectRoute({ capability: 'audit:read' }, async ({ actor }) =>
  getAuditStatus(actor.projectId),
);
