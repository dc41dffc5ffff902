'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { buttonVariants } from '@/components/ui/button';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { keys, projectApi } from '@/components/schedule/api';
import type { GuardRecipe } from '@/components/schedule/types';
import { TYPICAL_CAUTION } from '@/lib/presets/guards';
import { formatEng } from '@/lib/units';
import { KIND_BY_NAME, mainFigure } from './elements';

function summary(recipe: GuardRecipe): string {
  if (recipe.guard.stages.length === 0) return 'no stages: unprotected';
  return recipe.guard.stages
    .map((s) =>
      [s.series, ...s.shunts]
        .map((e) => {
          const fig = mainFigure(e);
          const v = fig ? (e as unknown as Record<string, unknown>)[fig.key] : undefined;
          return `${KIND_BY_NAME.get(e.kind)?.name ?? e.kind}${typeof v === 'number' && fig ? ` ${formatEng(v, fig.unit)}` : ''}`;
        })
        .join(' + '),
    )
    .join(' → ');
}

/** The project's library of guard recipes; a recipe is reused by many channels. */
export function RecipeList({
  projectId,
  canWrite,
  initial,
}: {
  projectId: number;
  canWrite: boolean;
  initial: GuardRecipe[];
}) {
  const api = projectApi(projectId);
  const { data } = useQuery({
    queryKey: keys.recipes(projectId),
    queryFn: () => api.listGuardRecipes(),
    initialData: { items: initial },
  });
  return (
    <Panel>
      <PanelTitle
        aside={
          canWrite ? (
            <Link
              href={`/projects/${projectId}/guards/new`}
              className={buttonVariants({ size: 'sm' })}
            >
              New recipe
            </Link>
          ) : (
            <span className="text-xs text-muted">read-only for your role</span>
          )
        }
      >
        Guard recipes
      </PanelTitle>
      {data.items.length === 0 ? (
        <p className="text-sm text-muted">
          No recipes yet. A recipe describes one channel&apos;s protection network, from the field
          terminal inward.
        </p>
      ) : (
        <ul className="divide-y divide-line">
          {data.items.map((r) => (
            <li key={r.id} className="py-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <Link
                  href={`/projects/${projectId}/guards/${r.id}`}
                  className="font-medium text-accent hover:underline"
                >
                  {r.name}
                </Link>
                <span className="text-xs text-muted">
                  {r.channelCount} {r.channelCount === 1 ? 'channel' : 'channels'}
                </span>
              </div>
              {r.description ? <p className="text-sm text-muted">{r.description}</p> : null}
              <p className="font-mono text-xs">{summary(r)}</p>
              {r.isPreset ? (
                <p className="text-xs text-caution">From a preset: {TYPICAL_CAUTION}.</p>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
