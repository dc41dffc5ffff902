/**
 * Cabinet input, shared by the cabinet form and the route handlers. Create and update
 * shapes; an update sends only what changed plus the `version` it was based on.
 */
import { z } from 'zod';

/** The version a client read; every update and delete sends it back. */
export const versionField = z
  .number({ error: 'version must be the whole number the record was read at.' })
  .int({ error: 'version must be a whole number.' })
  .min(0, { error: 'version must be 0 or more.' });

/** `?version=N` on a DELETE: the query string carries text. */
export const versionQuery = z.object({
  version: z
    .string({ error: 'version is required (?version=N, the version you read).' })
    .regex(/^\d+$/, { error: 'version must be a whole number (?version=N).' })
    .transform(Number),
});

/** A required short text: trimmed, not empty, at most `max` characters. */
export function requiredText(field: string, max: number) {
  return z
    .string({ error: `${field} is required.` })
    .trim()
    .min(1, { error: `${field} must not be empty.` })
    .max(max, { error: `${field} must be at most ${max} characters.` });
}

/** An optional text: trimmed; empty or missing becomes null (clears the field). */
export function optionalText(field: string, max: number) {
  return z
    .string({ error: `${field} must be text.` })
    .trim()
    .max(max, { error: `${field} must be at most ${max} characters.` })
    .nullish()
    .transform((v) => (v ? v : null));
}

/** A positive integer id in a JSON body. */
export function idField(field: string) {
  return z
    .number({ error: `${field} must be a record id (a whole number).` })
    .int({ error: `${field} must be a whole number.` })
    .positive({ error: `${field} must be 1 or more.` });
}

/** A positive integer id in a route segment or query string. */
export function idParam(field: string) {
  return z
    .string({ error: `${field} is required.` })
    .regex(/^[1-9]\d*$/, { error: `${field} must be a positive whole number.` })
    .transform(Number);
}

export const cabinetCreateSchema = z.object({
  tag: requiredText('tag', 40),
  name: requiredText('name', 200),
  location: optionalText('location', 200).optional(),
});
export type CabinetCreateInput = z.input<typeof cabinetCreateSchema>;
export type CabinetCreate = z.output<typeof cabinetCreateSchema>;

export const cabinetUpdateSchema = z
  .object({
    tag: requiredText('tag', 40),
    name: requiredText('name', 200),
    location: optionalText('location', 200),
  })
  .partial()
  .extend({ version: versionField })
  .strict();
export type CabinetUpdateInput = z.input<typeof cabinetUpdateSchema>;
export type CabinetUpdate = z.output<typeof cabinetUpdateSchema>;
