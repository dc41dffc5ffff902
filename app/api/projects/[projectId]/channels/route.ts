import { NextResponse } from 'next/server';
import { projectRoute } from '@/lib/auth/guard';
import { createChannel, listChannels } from '@/lib/data/schedule/channels';
import { channelCreateSchema, channelListQuerySchema } from '@/lib/validation/channel';

export const GET = projectRoute(
  { capability: 'schedule:read', query: channelListQuerySchema },
  async ({ actor, query }) => ({
    items: await listChannels(actor.projectId, query.cabinetId),
  }),
);

export const POST = projectRoute(
  { capability: 'schedule:write', body: channelCreateSchema },
  async ({ actor, body }) =>
    NextResponse.json(
      await createChannel({ userId: actor.user.id, projectId: actor.projectId }, body),
      { status: 201 },
    ),
);
