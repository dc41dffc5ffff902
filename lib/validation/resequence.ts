import { z } from 'zod';

export const stripIdParams = z.object({
  stripId: z.coerce.number().int().positive('Strip id must be a positive whole number.'),
});

export const resequenceOptionsSchema = z
  .object({
    separator: z
      .enum(['barrier', 'spare'], { message: 'separator must be barrier or spare.' })
      .optional(),
  })
  .optional()
  .default({});

/**
 * Applying a proposal: the client sends back what it was shown (the proposal's fingerprint)
 * and the version of every terminal it saw, so nothing is moved on a stale picture.
 */
export const resequenceApplySchema = z.object({
  separator: z.enum(['barrier', 'spare']).optional(),
  fingerprint: z.string().min(1, 'fingerprint of the proposal you reviewed is required.'),
  versions: z.record(z.string(), z.number().int().nonnegative()),
});

export type ResequenceApply = z.infer<typeof resequenceApplySchema>;
