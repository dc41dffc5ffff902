import { projectRoute } from '@/lib/auth/guard';
import { proposeForStrip } from '@/lib/data/resequence';
import { resequenceOptionsSchema, stripIdParams } from '@/lib/validation/resequence';

/** A proposal only: nothing is written (applying is a separate, engineer-only request). */
export const POST = projectRoute(
  { capability: 'audit:read', params: stripIdParams, body: resequenceOptionsSchema },
  async ({ actor, params, body }) =>
    proposeForStrip(actor.projectId, params.stripId, body.separator),
);
