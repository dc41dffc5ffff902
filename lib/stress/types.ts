/**
 * The stress engine's public contract. Every quantity is in SI units (V, A, Ω, W, J, F, s,
 * A²s, °C). Engineering-notation strings ("4k99", "0.25W") are parsed at the boundary
 * (lib/units); nothing below this file sees a string value.
 */

export type Verdict = 'holds' | 'marginal' | 'fails' | 'unprotected' | 'incomplete';

/** Worst first: the order used to combine verdicts (a channel takes its worst element's). */
export const VERDICT_SEVERITY: Record<Verdict, number> = {
  unprotected: 4,
  fails: 3,
  incomplete: 2,
  marginal: 1,
  holds: 0,
};

// ---------------------------------------------------------------- series elements

export interface ResistorElement {
  kind: 'resistor';
  id: string;
  resistance: number;
  /** Rated power at 70 °C (IEC 60115-1 style rating). */
  ratedPower?: number;
  /** Limiting element voltage (maximum working voltage). */
  limitingVoltage?: number;
  /** Maximum overload voltage, used for short pulses (surge, ESD) where given. */
  overloadVoltage?: number;
  /** Single-pulse energy rating, where the datasheet gives one. */
  pulseEnergy?: number;
}

export interface PtcElement {
  kind: 'ptc';
  id: string;
  resistance: number;
  holdCurrent: number;
  tripCurrent: number;
  maxVoltage?: number;
  /** Maximum interrupt current, where given. */
  maxCurrent?: number;
}

export interface FuseElement {
  kind: 'fuse';
  id: string;
  ratedCurrent: number;
  voltageRating?: number;
  /** Melting I²t in A²s. */
  meltingI2t?: number;
  /** Cold resistance; 0 when not given. */
  resistance?: number;
}

export interface WireElement {
  kind: 'wire';
  id: string;
  resistance: number;
}

export type SeriesElement = ResistorElement | PtcElement | FuseElement | WireElement;

// ---------------------------------------------------------------- shunt elements

/** Two diodes from the node to the supply rails (the classic steering pair). */
export interface RailDiodesElement {
  kind: 'railDiodes';
  id: string;
  forwardVoltage: number;
  /** Current at which forwardVoltage is specified. */
  forwardCurrent: number;
  averageCurrent?: number;
  /** Non-repetitive surge current rating. */
  surgeCurrent?: number;
  /** Pulse width at which surgeCurrent applies (s); default 8.3 ms half-sine. */
  surgeDuration?: number;
  /** Junction ideality for the model (default 2; see lib/stress/junction.ts). */
  emissionCoefficient?: number;
  /** Bulk series resistance for the model (default 5 % of forwardVoltage / forwardCurrent). */
  seriesResistance?: number;
}

export interface ZenerElement {
  kind: 'zener';
  id: string;
  /** true: back-to-back pair clamping both polarities at Vz + one forward drop. */
  bidirectional: boolean;
  zenerVoltage: number;
  testCurrent?: number;
  dynamicImpedance: number;
  powerRating?: number;
  /** Forward drop at a current (default 1.0 V at 100 mA, a typical small zener). */
  forwardVoltage?: number;
  forwardCurrent?: number;
}

export interface TvsElement {
  kind: 'tvs';
  id: string;
  bidirectional: boolean;
  standoffVoltage: number;
  breakdownVoltage: number;
  clampVoltage: number;
  /** Peak pulse current on 10/1000 µs at which clampVoltage is specified. */
  peakPulseCurrent: number;
  /** Peak pulse power on 10/1000 µs; defaults to clampVoltage × peakPulseCurrent. */
  peakPulsePower?: number;
  /** Current at which breakdownVoltage is specified (default 1 mA). */
  testCurrent?: number;
  /** Steady-state power dissipation rating, where given (continuous faults). */
  steadyPower?: number;
  /** Unidirectional only: forward drop at a current (default 1.0 V at 1 A ≈ 3.6 V at 50 A). */
  forwardVoltage?: number;
  forwardCurrent?: number;
}

export interface VaristorElement {
  kind: 'varistor';
  id: string;
  maxContinuousVoltage: number;
  /** Varistor voltage at 1 mA. */
  varistorVoltage: number;
  clampVoltage: number;
  clampCurrent: number;
  /** 8/20 µs single-surge current rating. */
  surgeCurrent?: number;
  /** Energy rating (J), 10/1000 µs or 2 ms as the datasheet gives. */
  surgeEnergy?: number;
  /** Maximum continuous DC voltage, where given; maxContinuousVoltage is the AC rms figure. */
  maxContinuousDcVoltage?: number;
}

export interface CapacitorElement {
  kind: 'capacitor';
  id: string;
  capacitance: number;
  voltageRating?: number;
}

export interface ShuntResistorElement {
  kind: 'shuntResistor';
  id: string;
  resistance: number;
  ratedPower?: number;
  limitingVoltage?: number;
  overloadVoltage?: number;
}

export type ShuntElement =
  | RailDiodesElement
  | ZenerElement
  | TvsElement
  | VaristorElement
  | CapacitorElement
  | ShuntResistorElement;

export type GuardElement = SeriesElement | ShuntElement;

// ---------------------------------------------------------------- network

/** One series element followed by the shunt elements at the node after it. */
export interface GuardStage {
  series: SeriesElement;
  shunts: ShuntElement[];
}

export interface ProtectedInput {
  /** Supply rails of the input stage, e.g. +24 and 0, or +5 and 0. */
  positiveRail: number;
  negativeRail: number;
  /** Absolute maximum: how far beyond each rail the pin may go (typically 0.3 V). */
  absMaxBeyondRail: number;
  /** Absolute maximum input (clamp) current; common practice 10 mA when unstated. */
  absMaxCurrent?: number;
  /** Input resistance to the negative rail (burden or pull-down); omit for high impedance. */
  inputResistance?: number;
  /** Minimum load on each rail: current it can absorb before pumping up. */
  positiveRailMinLoad?: number;
  negativeRailMinLoad?: number;
  /**
   * Whether the input has its own clamp diodes to the rails (most ICs do). Modelled as a
   * small-signal diode pair; the absolute maximum current applies to it.
   */
  internalClamps?: boolean;
  /** Forward drop of the internal clamps at a current (default 0.7 V at 1 mA, common practice). */
  clampForwardVoltage?: number;
  clampForwardCurrent?: number;
}

export interface Guard {
  stages: GuardStage[];
  input: ProtectedInput;
}

// ---------------------------------------------------------------- stress cases

export type HazardTerminal = 'signal' | 'return';

export interface DcCase {
  kind: 'dc';
  /** Applied voltage (already at its maximum, signed). */
  voltage: number;
  sourceResistance: number;
}

export interface AcCase {
  kind: 'ac';
  /** RMS voltage already at nominal × (1 + tolerance). */
  rmsVoltage: number;
  frequency: number;
  sourceResistance: number;
}

/** IEC 61000-4-5 combination wave: 1.2/50 µs open circuit, 8/20 µs short circuit, 2 Ω. */
export interface SurgeCase {
  kind: 'surge';
  /** Open-circuit peak voltage (the test level), signed. */
  peakVoltage: number;
  /** Extra coupling resistance beyond the generator's 2 Ω (0, 10 or 40 Ω per IEC 61000-4-5). */
  couplingResistance: number;
}

/** IEC 61000-4-2 contact discharge: 150 pF through 330 Ω. */
export interface EsdCase {
  kind: 'esd';
  /** Charge voltage, signed. */
  voltage: number;
}

export type StressCase = DcCase | AcCase | SurgeCase | EsdCase;

export interface StressConditions {
  /** Cabinet ambient temperature for derating. */
  ambientC: number;
  /**
   * Derating margin as a fraction of the absolute rating the part may use before it is
   * called marginal (common practice: 0.5–0.6 of rated power, 0.8 of rated voltage).
   */
  powerDerating: number;
  voltageDerating: number;
  /** Which terminal of the channel the hazard lands on. Default 'signal'. */
  appliedTo?: HazardTerminal;
}

// ---------------------------------------------------------------- results

export type StressQuantity =
  'power' | 'voltage' | 'current' | 'energy' | 'surgeCurrent' | 'pulsePower' | 'i2t';

export interface RatingCheck {
  quantity: StressQuantity;
  /** The stress the element sees. */
  value: number;
  /** Absolute rating, null when the datasheet figure needed is missing. */
  rating: number | null;
  /** Rating after derating (temperature and margin). */
  deratedRating: number | null;
  /** (deratedRating − value) / deratedRating; negative when over. */
  margin: number | null;
  verdict: Verdict;
  /** Absolute rating at the cabinet ambient (temperature derating only), where it differs. */
  temperatureRating?: number | null;
  /** One line naming the element and the numbers for this check. */
  reason?: string;
}

export interface ElementStress {
  elementId: string;
  kind: GuardElement['kind'];
  stage: number;
  role: 'series' | 'shunt';
  peakVoltage: number;
  peakCurrent: number;
  /** Average power over whole cycles (AC) or steady (DC); null for pulses. */
  averagePower: number | null;
  /** Pulse energy (surge, ESD); null for steady cases. */
  pulseEnergy: number | null;
  /** Peak instantaneous power. */
  peakPower?: number;
  /** RMS voltage across and current through, over whole cycles (steady cases). */
  rmsVoltage?: number | null;
  rmsCurrent?: number | null;
  checks: RatingCheck[];
  verdict: Verdict;
  /** One line naming the element and the numbers. */
  reason: string;
}

export interface RailInjection {
  rail: 'positive' | 'negative';
  /** Peak (pulse) or average (steady) current pushed into the rail. */
  injectedCurrent: number;
  minLoad: number | null;
  /** true: the rail can rise; null: minimum load unknown. */
  pumpsUp: boolean | null;
}

export interface WaveformTrace {
  name: string;
  unit: 'V' | 'A';
  values: number[];
}

export interface Waveform {
  /** Sample times (s). */
  t: number[];
  traces: WaveformTrace[];
}

export interface StressResult {
  case: StressCase;
  verdict: Verdict;
  reason: string;
  /** Peak current drawn from the source. */
  sourcePeakCurrent: number;
  elements: ElementStress[];
  input: {
    peakVoltage: number;
    peakCurrent: number;
    verdict: Verdict;
    reason: string;
  };
  rails: RailInjection[];
  /** Present when requested (solveStress options.waveform). */
  waveform?: Waveform;
  /** Assumptions and model notes that apply to this result (defaults used, model limits). */
  notes?: string[];
}
