import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { deleteStrip, updateStrip } from '@/lib/data/schedule/strips';
import { idParam, versionQuery } from '@/lib/validation/cabinet';
import { stripUpdateSchema } from '@/lib/validation/strip';

const params = z.object({ stripId: idParam('stripId') });

export const PATCH = projectRoute(
  { capability: 'schedule:write', params, body: stripUpdateSchema },
  async ({ actor, params, body }) =>
    updateStrip({ userId: actor.user.id, projectId: actor.projectId }, params.stripId, body),
);

export const DELETE = projectRoute(
  { capability: 'schedule:write', params, query: versionQuery },
  async ({ actor, params, query }) => {
    await deleteStrip(
      { userId: actor.user.id, projectId: actor.projectId },
      params.stripId,
      query.version,
    );
    return { deleted: true };
  },
);
