/**
 * Closed vocabularies of the data model. Pure constants (no Sequelize) so zod schemas and
 * components can share them with the models.
 */

export const PROJECT_ROLES = ['engineer', 'technician', 'reviewer', 'viewer'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const CIRCUIT_CLASSES = [
  'hazard',
  'sensitive',
  'return',
  'earth',
  'spare',
  'barrier',
] as const;
export type CircuitClass = (typeof CIRCUIT_CLASSES)[number];

export const HAZARD_KINDS = [
  'mains-line',
  'mains-neutral',
  'dc-supply',
  'motor-output',
  'heater-output',
  'other',
] as const;
export type HazardKind = (typeof HAZARD_KINDS)[number];

export const CURRENT_KINDS = ['ac', 'dc'] as const;
export type CurrentKind = (typeof CURRENT_KINDS)[number];

export const SIGNAL_TYPES = [
  'current-4-20',
  'voltage-0-10',
  'digital-24',
  'thermocouple',
  'rtd',
  'counter',
  'other',
] as const;
export type SignalType = (typeof SIGNAL_TYPES)[number];

/** IEC 60664-1 overvoltage categories. */
export const OVERVOLTAGE_CATEGORIES = ['I', 'II', 'III', 'IV'] as const;
export type OvervoltageCategory = (typeof OVERVOLTAGE_CATEGORIES)[number];

/** IEC 61000-4-5 coupling paths: line–earth adds 10 Ω, signal lines 40 Ω, line–line none. */
export const SURGE_COUPLINGS = ['line-earth', 'line-line', 'signal'] as const;
export type SurgeCoupling = (typeof SURGE_COUPLINGS)[number];

export const WIRE_COLOUR_CONVENTIONS = ['iec60204-1', 'nfpa79', 'none'] as const;
export type WireColourConvention = (typeof WIRE_COLOUR_CONVENTIONS)[number];

export const FAULT_MODES = ['line-earth', 'line-line'] as const;
export type FaultMode = (typeof FAULT_MODES)[number];

export const AUDIT_RUN_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type AuditRunStatus = (typeof AUDIT_RUN_STATUSES)[number];

export const REVIEW_STATES = ['draft', 'submitted', 'signed', 'returned'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const FINDING_KINDS = ['stress', 'segregation', 'colour'] as const;
export type FindingKind = (typeof FINDING_KINDS)[number];

export const VERDICTS = ['holds', 'marginal', 'fails', 'unprotected', 'incomplete'] as const;

export const STRESS_CASE_KINDS = ['dc', 'ac', 'surge', 'esd'] as const;

export const EXPOSURE_MECHANISMS = [
  'neighbour',
  'stacked',
  'same-cable',
  'look-alike',
  'bridge',
] as const;
export type ExposureMechanism = (typeof EXPOSURE_MECHANISMS)[number];

export const DECISION_OUTCOMES = ['accept', 'require-fix'] as const;
export type DecisionOutcome = (typeof DECISION_OUTCOMES)[number];

/** What an as-built markup records. */
export const MARKUP_KINDS = [
  'relanded', // a wire landed on another terminal
  'swapped', // two terminals' wiring exchanged
  'component', // a different part fitted (e.g. the as-built resistor)
  'barrier', // a barrier or end plate added or removed
  'wiring', // wire number, colour, cable or core differs
  'note', // an observation without a schedule change
] as const;
export type MarkupKind = (typeof MARKUP_KINDS)[number];

export const MARKUP_STATUSES = ['proposed', 'accepted', 'rejected'] as const;
export type MarkupStatus = (typeof MARKUP_STATUSES)[number];

export const ATTACHMENT_KINDS = ['photo', 'import', 'document'] as const;
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

export const STORAGE_KINDS = ['disk', 's3'] as const;
export type StorageKind = (typeof STORAGE_KINDS)[number];
