/** Channel (one sensitive input) input, shared by the channel form and the route handlers. */
import { z } from 'zod';
import { overridesShapeProblems, type GuardOverrides } from '@/lib/presets/overrides';
import { SIGNAL_TYPES } from '@/models/enums';
import { idField, optionalText, requiredText, versionField } from './cabinet';

const optionalId = (field: string) =>
  idField(field)
    .nullish()
    .transform((v) => v ?? null);

/** Per-channel overrides of the recipe's figures (SI numbers), checked like the model checks them. */
export const guardOverridesField = z
  .optional(z.unknown())
  .superRefine((value, ctx) => {
    for (const message of overridesShapeProblems(value)) ctx.addIssue({ code: 'custom', message });
  })
  .transform((v) => (v ?? null) as GuardOverrides | null);

const channelFields = {
  tag: requiredText('tag', 40),
  name: optionalText('name', 200),
  signalType: z.enum(SIGNAL_TYPES, {
    error: `signalType must be one of: ${SIGNAL_TYPES.join(', ')}.`,
  }),
  signalTerminalId: optionalId('signalTerminalId'),
  returnTerminalId: optionalId('returnTerminalId'),
  guardRecipeId: optionalId('guardRecipeId'),
  guardOverrides: guardOverridesField,
  notes: optionalText('notes', 2000),
};

function distinctTerminals(
  c: { signalTerminalId?: number | null; returnTerminalId?: number | null },
  ctx: z.RefinementCtx,
): void {
  if (c.signalTerminalId != null && c.signalTerminalId === c.returnTerminalId) {
    ctx.addIssue({
      code: 'custom',
      message: 'returnTerminalId must be a different terminal from signalTerminalId.',
      path: ['returnTerminalId'],
    });
  }
}

export const channelCreateSchema = z
  .object({ cabinetId: idField('cabinetId'), ...channelFields })
  .strict()
  .superRefine(distinctTerminals);
export type ChannelCreateInput = z.input<typeof channelCreateSchema>;
export type ChannelCreate = z.output<typeof channelCreateSchema>;

/** cabinetId is fixed once created (a channel moves with its terminals, not on its own). */
export const channelUpdateSchema = z
  .object(channelFields)
  .partial()
  .extend({ version: versionField })
  .strict()
  .superRefine(distinctTerminals);
export type ChannelUpdateInput = z.input<typeof channelUpdateSchema>;
export type ChannelUpdate = z.output<typeof channelUpdateSchema>;

export const channelListQuerySchema = z.object({
  cabinetId: z
    .string()
    .regex(/^[1-9]\d*$/, { error: 'cabinetId must be a positive whole number.' })
    .transform(Number)
    .optional(),
});
