import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { getChannelRemedies } from '@/lib/data/channel-detail';

const params = z.object({
  channelId: z.coerce.number().int().positive('Channel id must be a positive whole number.'),
});

/** The channel's sizing remedies (JSON), fetched by its page after it has rendered. */
export const GET = projectRoute(
  { capability: 'audit:read', params },
  async ({ actor, params: p }) => ({
    items: await getChannelRemedies(actor.projectId, p.channelId),
  }),
);
