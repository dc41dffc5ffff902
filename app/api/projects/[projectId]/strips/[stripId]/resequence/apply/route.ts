import { projectRoute } from '@/lib/auth/guard';
import { applyResequence } from '@/lib/data/resequence';
import { resequenceApplySchema, stripIdParams } from '@/lib/validation/resequence';

export const POST = projectRoute(
  { capability: 'schedule:write', params: stripIdParams, body: resequenceApplySchema },
  async ({ actor, params, body }) => applyResequence(actor, params.stripId, body),
);
