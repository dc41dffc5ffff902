import type {
  CabinetSnapshot,
  ChannelRef,
  CheckFinding,
  CheckKind,
  Exposure,
  ExposureMap,
  ExposureRoute,
  LikelihoodClass,
  LikelihoodWeights,
  Mechanism,
  StripSnapshot,
  TerminalSnapshot,
  WireColourConvention,
} from '../exposure/types';
import type { GuardOverrides } from '../presets/overrides';
import type {
  ElementStress,
  Guard,
  HazardTerminal,
  RailInjection,
  StressCase,
  StressConditions,
  StressResult,
  Verdict,
} from '../stress/types';

export type SurgeCoupling = 'line-earth' | 'line-line' | 'signal';
export type FaultMode = 'line-earth' | 'line-line';

/** The project's assumptions, as stored on the Project (fractions, volts, kV, °C). */
export interface ProjectSettings {
  /** e.g. "230/400V 50Hz"; the "a/b" pair gives the line-to-line ratio when present. */
  mainsSystem?: string | null;
  /** Line-to-earth mains voltage (rms), used for mains terminals with no voltage of their own. */
  nominalVoltage?: number | null;
  /** Mains frequency (Hz), used for AC hazards with no frequency of their own. */
  frequency?: number | null;
  /** Fraction: 0.10 = +10 % (IEC 60038); 0.05 = ANSI C84.1 Range A. */
  supplyTolerance: number;
  /** Maximum of a 24 V DC supply (V): 28.8 per IEC 61131-2; other DC supplies scale with it. */
  dcSupplyMax: number;
  ambientC: number;
  surgeLevelKv: number;
  surgeCoupling: SurgeCoupling;
  esdLevelKv: number;
  powerDerating: number;
  voltageDerating: number;
  wireColourConvention: WireColourConvention;
  faultMode: FaultMode;
  likelihoodWeights?: Partial<LikelihoodWeights> | null;
  /** Surge and ESD in both polarities (default, as IEC 61000-4-5 and -4-2 test) or positive only. */
  transientPolarity?: 'both' | 'positive' | null;
}

export interface ChannelSnapshot extends ChannelRef {
  signalType?: string | null;
  guardRecipeId?: string | null;
  /** As-built figures over the recipe: lib/presets/overrides.ts format. */
  guardOverrides?: GuardOverrides | null;
}

export interface GuardRecipeSnapshot {
  id: string;
  name: string;
  guard: Guard;
}

/** Everything an audit reads. The server builds it from the models; the hash is taken over it. */
export interface ProjectSnapshot {
  cabinets: CabinetSnapshot[];
  strips: StripSnapshot[];
  terminals: TerminalSnapshot[];
  channels: ChannelSnapshot[];
  guards: GuardRecipeSnapshot[];
  settings: ProjectSettings;
}

/** One stress case as the audit applies it, with where its numbers come from. */
export interface AuditCase {
  /** Stable across runs: 'surge+', 'esd-', 'mains:line-earth', 'dc', … */
  id: string;
  label: string;
  /** The source of the numbers, tagged as REFERENCE.md tags it. */
  basis: string;
  stress: StressCase;
  appliedTo: HazardTerminal;
  /** Open-circuit peak of the source (V), magnitude; breaks ties between equal scores. */
  peakVoltage: number;
}

export interface FindingExposure {
  hazardTerminalId: string;
  hazardLabel: string;
  targetTerminalId: string;
  targetLabel: string;
  mechanism: Mechanism;
  route: ExposureRoute;
  likelihood: LikelihoodClass;
  weight: number;
  reason: string;
}

/** One channel × one stress case (× one hazard and route for exposure cases). */
export interface Finding {
  /** Stable across runs; see lib/audit/README.md. */
  key: string;
  channelId: string;
  channelTag: string;
  caseId: string;
  caseLabel: string;
  basis: string;
  /** null when the hazard lacks the facts to build its case (the finding is incomplete). */
  stress: StressCase | null;
  appliedTo: HazardTerminal;
  /** null for the project-wide surge and ESD cases. */
  exposure: FindingExposure | null;
  verdict: Verdict;
  reason: string;
  /** Smallest margin over every rating check of every element; null when none could be judged. */
  margin: number | null;
  /** Worst value / absolute rating over every check (0 when nothing is rated). */
  utilisation: number;
  /** Nearest-hazard score (exposure findings only): see lib/audit/score.ts. */
  score: number | null;
  elements: ElementStress[];
  input: StressResult['input'] | null;
  rails: RailInjection[];
  sourcePeakCurrent: number | null;
}

export interface NearestHazard {
  findingKey: string;
  hazardTerminalId: string;
  hazardLabel: string;
  mechanism: Mechanism;
  route: ExposureRoute;
  likelihood: LikelihoodClass;
  verdict: Verdict;
  score: number;
}

export interface ChannelAudit {
  channelId: string;
  tag: string;
  worstVerdict: Verdict;
  exposureCount: number;
  nearestHazard: NearestHazard | null;
}

export interface AuditSummary {
  channels: number;
  findings: number;
  findingsByVerdict: Record<Verdict, number>;
  channelsByVerdict: Record<Verdict, number>;
  /** Exposures found by the mapping (target terminal × hazard × route). */
  exposuresByMechanism: Record<Mechanism, number>;
  /** Stress findings by mechanism; surge and ESD count as 'transient'. */
  findingsByMechanism: Record<Mechanism | 'transient', number>;
  checksByKind: Record<CheckKind, number>;
  /** Distinct engine solutions (the rest came from the cache). */
  solverCalls: number;
}

export interface AuditResult {
  /** Version of the audit rules; part of the hash. */
  version: string;
  /** SHA-256 of the canonical snapshot (lib/audit/hash.ts). */
  hash: string;
  findings: Finding[];
  checks: CheckFinding[];
  channels: ChannelAudit[];
  exposures: ExposureMap;
  summary: AuditSummary;
}

export interface AuditProgress {
  phase: 'exposures' | 'stress' | 'checks' | 'done';
  done: number;
  total: number;
}

export type StressSolver = (
  guard: Guard,
  stressCase: StressCase,
  conditions: StressConditions,
) => StressResult;

export interface AuditOptions {
  onProgress?: (p: AuditProgress) => void;
}

export type { Exposure };
