/**
 * Plain input and output types of the exposure mapping. The server maps its models onto these;
 * nothing here knows about the database. Every id is a string (numeric database ids are
 * stringified at the boundary) so that sorting, hashing and keys behave the same everywhere.
 */

export type CircuitClass = 'hazard' | 'sensitive' | 'return' | 'earth' | 'spare' | 'barrier';

export type HazardKind =
  'mains-line' | 'mains-neutral' | 'dc-supply' | 'motor-output' | 'heater-output' | 'other';

export type CurrentKind = 'ac' | 'dc';

export interface CabinetSnapshot {
  id: string;
  tag: string;
}

export interface StripSnapshot {
  id: string;
  cabinetId: string;
  tag: string;
}

/** One terminal of the schedule. Optional facts may be absent or null; both mean "not given". */
export interface TerminalSnapshot {
  id: string;
  stripId: string;
  /** Position on the rail; all levels of a multi-level block share one position. */
  position: number;
  /** Level inside a multi-level block (1 = lowest); absent for single-level terminals. */
  level?: number | null;
  blockId?: string | null;
  /** e.g. "X3:14". */
  label: string;
  /** The number printed on the terminal; taken from the label after ":" when absent. */
  terminalNumber?: string | null;
  wireNumber?: string | null;
  cableId?: string | null;
  cableCore?: string | null;
  connector?: string | null;
  wireColour?: string | null;
  circuitClass: CircuitClass;
  hazardKind?: HazardKind | null;
  /** Hazard: rms (AC) or signed DC voltage; line-to-earth for mains conductors. */
  nominalVoltage?: number | null;
  currentKind?: CurrentKind | null;
  frequency?: number | null;
  /** Source resistance of the hazard (Ω); absent = a stiff source. */
  sourceImpedance?: number | null;
  /** Terminals sharing a bridge group are joined by one jumper or comb on their strip. */
  bridgeGroup?: string | null;
  channelId?: string | null;
}

export interface ChannelRef {
  id: string;
  tag: string;
  signalTerminalId: string;
  returnTerminalId?: string | null;
}

/** What the exposure mapping reads: the wiring of a project, nothing electrical beyond it. */
export interface WiringSnapshot {
  cabinets: CabinetSnapshot[];
  strips: StripSnapshot[];
  terminals: TerminalSnapshot[];
  channels: ChannelRef[];
}

// ---------------------------------------------------------------- likelihood

/** Our own likelihood classes, most likely first. */
export type LikelihoodClass = 'likely' | 'plausible' | 'remote';

export const LIKELIHOOD_CLASSES: readonly LikelihoodClass[] = ['likely', 'plausible', 'remote'];

/** Relative weight of each class; a project may change them (Project settings). */
export type LikelihoodWeights = Record<LikelihoodClass, number>;

/** Defaults: our own judgement of relative frequency (common practice, no source). */
export const DEFAULT_LIKELIHOOD_WEIGHTS: LikelihoodWeights = {
  likely: 1,
  plausible: 0.3,
  remote: 0.1,
};

// ---------------------------------------------------------------- exposures

export type Mechanism = 'neighbour' | 'stacked' | 'same-cable' | 'look-alike' | 'bridge';

export const MECHANISMS: readonly Mechanism[] = [
  'neighbour',
  'stacked',
  'same-cable',
  'look-alike',
  'bridge',
];

/** The precise route inside a mechanism (see lib/exposure/README.md for each). */
export type ExposureRoute =
  | 'adjacent' // neighbour, position distance 1
  | 'near' // neighbour, position distance 2–3
  | 'other-level' // stacked: another level of the same block
  | 'cable-core' // another core of the same cable
  | 'connector-pin' // another pin of the same connector
  | 'terminal-number' // same terminal number on another strip of the cabinet
  | 'wire-number-same' // identical wire number
  | 'wire-number-similar' // wire number one substitution or one adjacent swap away
  | 'bridge-member' // jumpered into the same bridge group
  | 'bridge-span' // a bridge passes over it (a tooth left on, a full comb fitted)
  | 'bridge-end'; // a bridge shifted by one position or one tooth too long

export interface Exposure {
  targetTerminalId: string;
  hazardTerminalId: string;
  mechanism: Mechanism;
  route: ExposureRoute;
  likelihood: LikelihoodClass;
  weight: number;
  /** Position distance for neighbour exposures. */
  distance?: number;
  /** One line a practitioner can read: what, where, why. */
  reason: string;
}

export interface TargetExposures {
  terminalId: string;
  label: string;
  /** Channels using this terminal as signal or return (a common return can serve many). */
  channelIds: string[];
  /** Ranked, most likely and most severe first. */
  exposures: Exposure[];
}

export interface ExposureMap {
  /** Every sensitive or return terminal and every terminal a channel uses, sorted by id. */
  targets: TargetExposures[];
  /** Count of exposures by mechanism over all targets. */
  countsByMechanism: Record<Mechanism, number>;
}

export interface ExposureOptions {
  weights?: Partial<LikelihoodWeights>;
}

// ---------------------------------------------------------------- checks

export type CheckKind = 'segregation' | 'colour';

export type CheckSeverity = 'violation' | 'advisory';

/** A finding of its own kind: not a stress verdict, a rule of the trade or of a standard. */
export interface CheckFinding {
  kind: CheckKind;
  /** Stable across runs: kind|strip|terminal labels. */
  key: string;
  severity: CheckSeverity;
  stripId: string;
  terminalIds: string[];
  /** The rule's source, tagged as REFERENCE.md tags it. */
  clause: string;
  message: string;
}

export type WireColourConvention = 'iec60204-1' | 'nfpa79' | 'none';
