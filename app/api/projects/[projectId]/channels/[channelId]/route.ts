import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { deleteChannel, updateChannel } from '@/lib/data/schedule/channels';
import { idParam, versionQuery } from '@/lib/validation/cabinet';
import { channelUpdateSchema } from '@/lib/validation/channel';

const params = z.object({ channelId: idParam('channelId') });

export const PATCH = projectRoute(
  { capability: 'schedule:write', params, body: channelUpdateSchema },
  async ({ actor, params, body }) =>
    updateChannel({ userId: actor.user.id, projectId: actor.projectId }, params.channelId, body),
);

export const DELETE = projectRoute(
  { capability: 'schedule:write', params, query: versionQuery },
  async ({ actor, params, query }) => {
    await deleteChannel(
      { userId: actor.user.id, projectId: actor.projectId },
      params.channelId,
      query.version,
    );
    return { deleted: true };
  },
);
