export {
  suggestRemedies,
  eSeriesAbove,
  E24,
  E96,
  POWER_STEPS,
  VOLTAGE_STEPS,
  TVS_POWER_STEPS,
} from './sizing';
export type { Remedy, RemedyChange, RemedyKind, SizingOptions } from './sizing';
