import { NextResponse } from 'next/server';
import { projectRoute } from '@/lib/auth/guard';
import { createGuardRecipe, listGuardRecipes } from '@/lib/data/schedule/guard-recipes';
import { guardRecipeCreateSchema } from '@/lib/validation/guard-recipe';

export const GET = projectRoute({ capability: 'schedule:read' }, async ({ actor }) => ({
  items: await listGuardRecipes(actor.projectId),
}));

export const POST = projectRoute(
  { capability: 'schedule:write', body: guardRecipeCreateSchema },
  async ({ actor, body }) =>
    NextResponse.json(
      await createGuardRecipe({ userId: actor.user.id, projectId: actor.projectId }, body),
      { status: 201 },
    ),
);
