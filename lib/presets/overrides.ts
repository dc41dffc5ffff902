/**
 * Per-channel overrides of a guard recipe: the as-built figures that differ from the recipe
 * (e.g. a 1k resistor fitted where the recipe says 4k99). Pure.
 */
import type { Guard, GuardElement, ProtectedInput } from '@/lib/stress/types';
import { guardShapeProblems } from './guard-shape';

export interface GuardOverrides {
  /** Replacement figures by element id; `kind` and `id` cannot be overridden. */
  elements?: Record<string, Record<string, number | boolean>>;
  input?: Partial<ProtectedInput>;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Shape problems of a stored overrides value (without the recipe it applies to). */
export function overridesShapeProblems(value: unknown): string[] {
  if (value === null || value === undefined) return [];
  if (!isObject(value)) return ['guardOverrides must be an object with elements and/or input.'];
  const problems: string[] = [];
  for (const key of Object.keys(value)) {
    if (key !== 'elements' && key !== 'input')
      problems.push(`guardOverrides.${key} is not a known key (elements, input).`);
  }
  const check = (where: string, figures: unknown) => {
    if (!isObject(figures)) {
      problems.push(`${where} must be an object of figures.`);
      return;
    }
    for (const [field, v] of Object.entries(figures)) {
      if (field === 'kind' || field === 'id')
        problems.push(`${where}.${field} cannot be overridden.`);
      else if (typeof v !== 'boolean' && (typeof v !== 'number' || !Number.isFinite(v))) {
        problems.push(`${where}.${field} must be a number in SI units (or true/false).`);
      }
    }
  };
  if (value.elements !== undefined) {
    if (!isObject(value.elements))
      problems.push('guardOverrides.elements must be an object keyed by element id.');
    else
      for (const [id, figures] of Object.entries(value.elements))
        check(`guardOverrides.elements.${id}`, figures);
  }
  if (value.input !== undefined) check('guardOverrides.input', value.input);
  return problems;
}

export type AppliedGuard = { guard: Guard; problems: [] } | { guard: null; problems: string[] };

/**
 * The recipe with the overrides laid over it. Unknown element ids and a result that is no
 * longer a well-formed guard are reported, never silently dropped.
 */
export function applyGuardOverrides(
  recipe: Guard,
  overrides: GuardOverrides | null | undefined,
): AppliedGuard {
  const shape = overridesShapeProblems(overrides);
  if (shape.length > 0) return { guard: null, problems: shape };
  if (!overrides) return { guard: structuredClone(recipe), problems: [] };

  const elementIds = new Set(
    recipe.stages.flatMap((s) => [s.series.id, ...s.shunts.map((e) => e.id)]),
  );
  const problems = Object.keys(overrides.elements ?? {})
    .filter((id) => !elementIds.has(id))
    .map((id) => `guardOverrides.elements.${id}: the recipe has no element "${id}".`);
  if (problems.length > 0) return { guard: null, problems };

  const patch = <T extends GuardElement>(element: T): T => {
    const figures = overrides.elements?.[element.id];
    return figures
      ? ({ ...element, ...figures, kind: element.kind, id: element.id } as T)
      : { ...element };
  };
  const guard: Guard = {
    stages: recipe.stages.map((stage) => ({
      series: patch(stage.series),
      shunts: stage.shunts.map(patch),
    })),
    input: { ...recipe.input, ...(overrides.input ?? {}) },
  };
  const after = guardShapeProblems(guard);
  return after.length > 0 ? { guard: null, problems: after } : { guard, problems: [] };
}
