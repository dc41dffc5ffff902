/**
 * Guard recipe input. The guard is validated by the engine's own schema (lib/stress/schema.ts):
 * numbers (SI) or engineering strings ("4k99", "0.25W") in, SI numbers out, errors naming the
 * element and figure (e.g. guard.stages.0.series.resistance).
 */
import { z } from 'zod';
import { guardSchema } from '@/lib/stress/schema';
import type { Guard } from '@/lib/stress/types';
import { optionalText, requiredText, versionField } from './cabinet';

export const guardField = z.optional(z.unknown()).transform((value, ctx): Guard => {
  if (value === undefined || value === null) {
    ctx.addIssue({
      code: 'custom',
      message: 'guard is required: an object with stages and input.',
    });
    return z.NEVER;
  }
  const parsed = guardSchema.safeParse(value);
  if (!parsed.success) {
    for (const issue of parsed.error.issues)
      ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
    return z.NEVER;
  }
  return parsed.data as Guard;
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
  .object({
    name: requiredText('name', 120),
    description: optionalText('description', 2000),
    guard: guardField,
  })
  .partial()
  .extend({ version: versionField })
  .strict();
export type GuardRecipeUpdateInput = z.input<typeof guardRecipeUpdateSchema>;
export type GuardRecipeUpdate = z.output<typeof guardRecipeUpdateSchema>;
