import { NextResponse } from 'next/server';
import { projectRoute } from '@/lib/auth/guard';
import { createCabinet, listCabinets } from '@/lib/data/schedule/cabinets';
import { cabinetCreateSchema } from '@/lib/validation/cabinet';

export const GET = projectRoute({ capability: 'schedule:read' }, async ({ actor }) => ({
  items: await listCabinets(actor.projectId),
}));

export const POST = projectRoute(
  { capability: 'schedule:write', body: cabinetCreateSchema },
  async ({ actor, body }) =>
    NextResponse.json(
      await createCabinet({ userId: actor.user.id, projectId: actor.projectId }, body),
      { status: 201 },
    ),
);
