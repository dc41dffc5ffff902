import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { deleteCabinet, getCabinet, updateCabinet } from '@/lib/data/schedule/cabinets';
import { cabinetUpdateSchema, idParam, versionQuery } from '@/lib/validation/cabinet';

const params = z.object({ cabinetId: idParam('cabinetId') });

export const GET = projectRoute(
  { capability: 'schedule:read', params },
  async ({ actor, params }) => getCabinet(actor.projectId, params.cabinetId),
);

export const PATCH = projectRoute(
  { capability: 'schedule:write', params, body: cabinetUpdateSchema },
  async ({ actor, params, body }) =>
    updateCabinet({ userId: actor.user.id, projectId: actor.projectId }, params.cabinetId, body),
);

export const DELETE = projectRoute(
  { capability: 'schedule:write', params, query: versionQuery },
  async ({ actor, params, query }) => {
    await deleteCabinet(
      { userId: actor.user.id, projectId: actor.projectId },
      params.cabinetId,
      query.version,
    );
    return { deleted: true };
  },
);
