export * from './types';
export { runAuditWith } from './run';
export {
  hazardCase,
  transientCases,
  mainsBasis,
  lineToLineRatio,
  DEFAULT_SOURCE_RESISTANCE,
  SURGE_COUPLING_RESISTANCE,
} from './cases';
export { snapshotHash, canonicalSnapshot, AUDIT_VERSION } from './hash';
export { canonicalJson } from './canonical';
export { sha256, sha256Hex } from './sha256';
export {
  diffAudits,
  diffSnapshots,
  type AuditDelta,
  type FindingChange,
  type SnapshotChange,
  type SnapshotEntity,
} from './diff';
export { hazardScore, utilisationOf, marginOf } from './score';
export { AuditInputError, snapshotProblems, assertAuditable } from './validate';

import { compileGuard, type CompiledNetwork } from '../stress/network';
import { solveWithNetwork } from '../stress/solve';
import type { Guard } from '../stress/types';
import { runAuditWith } from './run';
import type { AuditOptions, AuditResult, ProjectSnapshot, StressSolver } from './types';

/** The engine, compiling each distinct guard once per run (the run shares guard objects). */
function engineSolver(): StressSolver {
  const networks = new WeakMap<Guard, CompiledNetwork>();
  return (guard, stressCase, conditions) => {
    let net = networks.get(guard);
    if (!net) networks.set(guard, (net = compileGuard(guard)));
    return solveWithNetwork(guard, net, stressCase, conditions);
  };
}

/**
 * The audit of a project snapshot with the stress engine (lib/stress). Pure: no I/O; the
 * result carries the input hash, every finding with its key, the checks, each channel's
 * nearest mis-wire hazard and the summary counts.
 */
export function runAudit(snapshot: ProjectSnapshot, options: AuditOptions = {}): AuditResult {
  return runAuditWith(snapshot, engineSolver(), options);
}
