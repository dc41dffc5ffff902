/**
 * The records the schedule routes send (RULES-schedule-api contract), as the browser sees
 * them: JSON, so dates are strings. Vocabularies come from models/enums (pure constants).
 */
import type { CircuitClass, CurrentKind, HazardKind, SignalType } from '@/models/enums';
import type { GuardOverrides } from '@/lib/presets/overrides';
import type { Guard } from '@/lib/stress/types';

interface Versioned {
  id: number;
  version: number;
  createdAt?: string;
  updatedAt?: string;
}

export interface Cabinet extends Versioned {
  projectId: number;
  tag: string;
  name: string;
  location: string | null;
  stripCount: number;
  terminalCount: number;
  channelCount: number;
}

export interface Strip extends Versioned {
  cabinetId: number;
  tag: string;
  name: string | null;
  order: number;
  terminalCount: number;
}

/** The editable facts of one terminal, keyed as the model keys them. */
export interface TerminalFields {
  stripId: number;
  position: number;
  level: number;
  blockId: string | null;
  label: string;
  terminalNumber: string | null;
  wireNumber: string | null;
  cableId: string | null;
  cableCore: string | null;
  connector: string | null;
  wireColour: string | null;
  circuitClass: CircuitClass;
  hazardKind: HazardKind | null;
  nominalVoltage: number | null;
  currentKind: CurrentKind | null;
  frequency: number | null;
  sourceImpedance: number | null;
  bridgeGroup: string | null;
  channelId: number | null;
  notes: string | null;
}

export interface TerminalRow extends Versioned, TerminalFields {
  stripTag: string;
  channelTag: string | null;
}

export interface ChannelRow extends Versioned {
  projectId: number;
  cabinetId: number;
  tag: string;
  name: string | null;
  signalType: SignalType;
  signalTerminalId: number | null;
  returnTerminalId: number | null;
  guardRecipeId: number | null;
  guardOverrides: GuardOverrides | null;
  notes: string | null;
  signalTerminalLabel: string | null;
  returnTerminalLabel: string | null;
  guardRecipeName: string | null;
}

export interface GuardRecipe extends Versioned {
  projectId: number;
  name: string;
  description: string | null;
  guard: Guard;
  isPreset: boolean;
  channelCount: number;
}

export interface ImportRowResult {
  row: number;
  values: Record<string, string>;
  errors: { column: string; message: string }[];
}

export interface ImportPreview {
  headers: string[];
  suggestedMapping: Record<string, string>;
  rows: ImportRowResult[];
  errorCount: number;
  validCount: number;
}

export interface ImportCommitResult {
  created: number;
  updated: number;
}

/** Our import/export column names: the server's own list, so the two cannot drift. */
export {
  SCHEDULE_COLUMNS as IMPORT_COLUMNS,
  type ScheduleColumn as ImportColumn,
} from '@/lib/schedule-io/columns';
