import { z } from 'zod';
import {
  FAULT_MODES,
  OVERVOLTAGE_CATEGORIES,
  SURGE_COUPLINGS,
  WIRE_COLOUR_CONVENTIONS,
} from '@/models/enums';

/**
 * The project's assumptions: what every audit of the project takes as given. Shared by the
 * settings form and the PATCH handler. Percentages are entered as fractions here (0.10 = 10 %).
 */
export const projectSettingsSchema = z.object({
  mainsSystem: z.string().trim().min(1, 'Name the mains system, e.g. "230/400V 50Hz".').max(40),
  nominalVoltage: z.coerce
    .number()
    .positive('Nominal voltage must be above 0 V.')
    .max(1000, 'Nominal voltage above 1000 V is outside low voltage.'),
  frequency: z.coerce
    .number()
    .refine((f) => f === 50 || f === 60, 'Mains frequency must be 50 or 60 Hz.'),
  supplyTolerance: z.coerce
    .number()
    .gt(0, 'Supply tolerance must be above 0 %.')
    .max(0.25, 'Supply tolerance above 25 % is not a mains supply.'),
  dcSupplyMax: z.coerce
    .number()
    .positive('DC supply maximum must be above 0 V.')
    .max(120, 'DC supply maximum above 120 V is not extra-low voltage.'),
  ambientC: z.coerce
    .number()
    .min(-40, 'Ambient must be at least −40 °C.')
    .max(125, 'Ambient must be at most 125 °C.'),
  overvoltageCategory: z.enum(OVERVOLTAGE_CATEGORIES, {
    message: 'Pick an overvoltage category I–IV.',
  }),
  surgeLevelKv: z.coerce
    .number()
    .positive('Surge level must be above 0 kV.')
    .max(10, 'Surge level above 10 kV is outside IEC 61000-4-5 practice.'),
  surgeCoupling: z.enum(SURGE_COUPLINGS, { message: 'Pick a surge coupling path.' }),
  esdLevelKv: z.coerce
    .number()
    .positive('ESD level must be above 0 kV.')
    .max(30, 'ESD level above 30 kV is outside IEC 61000-4-2.'),
  powerDerating: z.coerce
    .number()
    .gt(0, 'Power derating must be above 0.')
    .max(1, 'Power derating is a fraction of the rating, at most 1.'),
  voltageDerating: z.coerce
    .number()
    .gt(0, 'Voltage derating must be above 0.')
    .max(1, 'Voltage derating is a fraction of the rating, at most 1.'),
  wireColourConvention: z.enum(WIRE_COLOUR_CONVENTIONS, {
    message: 'Pick a wire-colour convention, or none.',
  }),
  faultMode: z.enum(FAULT_MODES, { message: 'Pick line-to-earth or line-to-line.' }),
});

export type ProjectSettingsInput = z.infer<typeof projectSettingsSchema>;

export const projectSettingsUpdateSchema = projectSettingsSchema.extend({
  version: z.coerce.number().int().nonnegative('version is required to detect concurrent edits.'),
});

export type ProjectSettingsUpdate = z.infer<typeof projectSettingsUpdateSchema>;
