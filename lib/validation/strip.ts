/** Strip (terminal rail) input, shared by the strip form and the route handlers. */
import { z } from 'zod';
import { optionalText, requiredText, versionField } from './cabinet';

const orderField = z
  .number({ error: 'order must be a whole number.' })
  .int({ error: 'order must be a whole number.' })
  .min(0, { error: 'order must be 0 or more.' });

export const stripCreateSchema = z.object({
  tag: requiredText('tag', 20),
  name: optionalText('name', 200).optional(),
  /** Omitted: placed after the cabinet's last strip. */
  order: orderField.optional(),
});
export type StripCreateInput = z.input<typeof stripCreateSchema>;
export type StripCreate = z.output<typeof stripCreateSchema>;

export const stripUpdateSchema = z
  .object({ tag: requiredText('tag', 20), name: optionalText('name', 200), order: orderField })
  .partial()
  .extend({ version: versionField })
  .strict();
export type StripUpdateInput = z.input<typeof stripUpdateSchema>;
export type StripUpdate = z.output<typeof stripUpdateSchema>;
