import { projectRoute } from '@/lib/auth/guard';
import { currentExposures } from '@/lib/data/exposures';

export const GET = projectRoute({ capability: 'audit:read' }, async ({ actor }) =>
  currentExposures(actor.projectId),
);
