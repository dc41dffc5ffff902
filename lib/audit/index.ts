export * from './types';
export { runAuditWith } from './run';
export { hazardCase, transientCases, mainsBasis, lineToLineRatio, DEFAULT_SOURCE_RESISTANCE, SURGE_COUPLING_RESISTANCE } from './cases';
export { snapshotHash, canonicalSnapshot, AUDIT_VERSION } from './hash';
export { canonicalJson } from './canonical';
export { sha256, sha256Hex } from './sha256';
export { diffAudits, diffSnapshots, type AuditDelta, type FindingChange, type SnapshotChange, type SnapshotEntity } from './diff';
export { hazardScore, utilisationOf, marginOf } from './score';
export { AuditInputError, snapshotProblems, assertAuditable } from './validate';
