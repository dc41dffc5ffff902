import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { deleteGuardRecipe, updateGuardRecipe } from '@/lib/data/schedule/guard-recipes';
import { idParam, versionQuery } from '@/lib/validation/cabinet';
import { guardRecipeUpdateSchema } from '@/lib/validation/guard-recipe';

const params = z.object({ recipeId: idParam('recipeId') });

export const PATCH = projectRoute(
  { capability: 'schedule:write', params, body: guardRecipeUpdateSchema },
  async ({ actor, params, body }) =>
    updateGuardRecipe({ userId: actor.user.id, projectId: actor.projectId }, params.recipeId, body),
);

export const DELETE = projectRoute(
  { capability: 'schedule:write', params, query: versionQuery },
  async ({ actor, params, query }) => {
    await deleteGuardRecipe(
      { userId: actor.user.id, projectId: actor.projectId },
      params.recipeId,
      query.version,
    );
    return { deleted: true };
  },
);
