/**
 * Guard recipe input. The guard may carry numbers (SI) or engineering strings ("4k99",
 * "0.25W"); strings are parsed here so only SI numbers are stored (lib/stress/types.ts).
 * Interim: a minimal schema of our own until the engine's lib/stress/schema.ts lands; the
 * structural check is the one the model uses (lib/presets/guard-shape.ts).
 */
import { z } from 'zod';
import { guardShapeProblems } from '@/lib/presets/guard-shape';
import type { Guard } from '@/lib/stress/types';
import { parseEng } from '@/lib/units';
import { optionalText, requiredText, versionField } from './cabinet';

const NOT_FIGURES = new Set(['kind', 'id']);

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Copies `figures` with every engineering string parsed to SI; collects what cannot be parsed. */
function parseFigures(where: string, figures: unknown, problems: string[]): unknown {
  if (!isObject(figures)) return figures;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(figures)) {
    if (typeof value === 'string' && !NOT_FIGURES.has(key)) {
      if (value.trim() === '') continue; // an empty optional field in the form
      try {
        out[key] = parseEng(value);
      } catch (err) {
        problems.push(`${where}.${key}: ${(err as Error).message}.`);
        out[key] = value;
      }
    } else out[key] = value;
  }
  return out;
}

/** A guard with engineering strings parsed to SI numbers, or the problems found. */
export function normaliseGuard(value: unknown): { guard: Guard; problems: [] } | { guard: null; problems: string[] } {
  const problems: string[] = [];
  if (value === undefined || value === null) return { guard: null, problems: ['guard is required: an object with stages and input.'] };
  if (!isObject(value)) return { guard: null, problems: ['guard must be an object with stages and input.'] };
  const stages = Array.isArray(value.stages)
    ? value.stages.map((stage: unknown, i: number) => {
        if (!isObject(stage)) return stage;
        const where = `guard.stages[${i}]`;
        return {
          ...stage,
          series: parseFigures(`${where}.series`, stage.series, problems),
          shunts: Array.isArray(stage.shunts)
            ? stage.shunts.map((s: unknown, j: number) => parseFigures(`${where}.shunts[${j}]`, s, problems))
            : stage.shunts,
        };
      })
    : value.stages;
  const candidate = { ...value, stages, input: parseFigures('guard.input', value.input, problems) };
  if (problems.length === 0) problems.push(...guardShapeProblems(candidate));
  return problems.length ? { guard: null, problems } : { guard: candidate as unknown as Guard, problems: [] };
}

export const guardField = z.optional(z.unknown()).transform((value, ctx) => {
  const result = normaliseGuard(value);
  if (result.guard) return result.guard;
  for (const message of result.problems) ctx.addIssue({ code: 'custom', message });
  return z.NEVER;
});

export const guardRecipeCreateSchema = z
  .object({
    name: requiredText('name', 120),
    description: optionalText('description', 2000).optional(),
    guard: guardField,
  })
  .strict();
export type GuardRecipeCreateInput = z.input<typeof guardRecipeCreateSchema>;
export type GuardRecipeCreate = z.output<typeof guardRecipeCreateSchema>;

export const guardRecipeUpdateSchema = z
  .object({ name: requiredText('name', 120), description: optionalText('description', 2000), guard: guardField })
  .partial()
  .extend({ version: versionField })
  .strict();
export type GuardRecipeUpdateInput = z.input<typeof guardRecipeUpdateSchema>;
export type GuardRecipeUpdate = z.output<typeof guardRecipeUpdateSchema>;
