import type { Metadata } from 'next';
import { RecipeList } from '@/components/guards/recipe-list';
import type { GuardRecipe } from '@/components/schedule/types';
import { listGuardRecipes } from '@/lib/data/schedule/guard-recipes';
import { asJson, scheduleAccess } from '../cabinets/access';

export const metadata: Metadata = { title: 'Guard recipes' };

export default async function GuardsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId, canWrite } = await scheduleAccess((await params).projectId);
  const recipes = asJson<GuardRecipe[]>(await listGuardRecipes(projectId));
  return <RecipeList projectId={projectId} canWrite={canWrite} initial={recipes} />;
}
