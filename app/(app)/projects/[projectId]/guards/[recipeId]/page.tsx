import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { GuardBuilder } from '@/components/guards/guard-builder';
import type { GuardRecipe } from '@/components/schedule/types';
import { listGuardRecipes } from '@/lib/data/schedule/guard-recipes';
import { asJson, idSegment, scheduleAccess } from '../../cabinets/access';

export const metadata: Metadata = { title: 'Guard recipe' };

/** One recipe in the builder; the segment `new` starts an empty one (writers only). */
export default async function GuardRecipePage({
  params,
}: {
  params: Promise<{ projectId: string; recipeId: string }>;
}) {
  const raw = await params;
  const { projectId, canWrite } = await scheduleAccess(raw.projectId);
  let recipe: GuardRecipe | undefined;
  if (raw.recipeId === 'new') {
    if (!canWrite) notFound();
  } else {
    const id = idSegment(raw.recipeId);
    const found = (await listGuardRecipes(projectId)).find((r) => r.id === id);
    if (!found) notFound();
    recipe = asJson<GuardRecipe>(found);
  }
  return (
    <div className="space-y-4">
      <nav className="text-sm">
        <Link href={`/projects/${projectId}/guards`} className="text-accent hover:underline">
          ← Guard recipes
        </Link>
      </nav>
      <h2 className="text-lg font-semibold">
        {recipe ? recipe.name : 'New guard recipe'}
        {recipe ? (
          <span className="ml-2 text-sm font-normal text-muted">
            used by {recipe.channelCount} {recipe.channelCount === 1 ? 'channel' : 'channels'}
          </span>
        ) : null}
      </h2>
      <GuardBuilder
        key={recipe ? recipe.id : 'new'}
        projectId={projectId}
        recipe={recipe}
        canWrite={canWrite}
      />
    </div>
  );
}
