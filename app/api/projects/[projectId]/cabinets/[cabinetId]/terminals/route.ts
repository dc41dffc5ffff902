import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { listTerminals } from '@/lib/data/schedule/terminals';
import { idParam } from '@/lib/validation/cabinet';
import { terminalListQuerySchema } from '@/lib/validation/terminal';

const params = z.object({ cabinetId: idParam('cabinetId') });

export const GET = projectRoute(
  { capability: 'schedule:read', params, query: terminalListQuerySchema },
  async ({ actor, params, query }) => listTerminals(actor.projectId, params.cabinetId, query),
);
