import { NextResponse } from 'next/server';
import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { createStrip, listStrips } from '@/lib/data/schedule/strips';
import { idParam } from '@/lib/validation/cabinet';
import { stripCreateSchema } from '@/lib/validation/strip';

const params = z.object({ cabinetId: idParam('cabinetId') });

export const GET = projectRoute(
  { capability: 'schedule:read', params },
  async ({ actor, params }) => ({
    items: await listStrips(actor.projectId, params.cabinetId),
  }),
);

export const POST = projectRoute(
  { capability: 'schedule:write', params, body: stripCreateSchema },
  async ({ actor, params, body }) =>
    NextResponse.json(
      await createStrip(
        { userId: actor.user.id, projectId: actor.projectId },
        params.cabinetId,
        body,
      ),
      {
        status: 201,
      },
    ),
);
