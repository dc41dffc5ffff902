/**
 * One time sample of the guard network: find every node voltage for a given source
 * (Thevenin: open-circuit voltage `vs` behind `rs`).
 *
 * The unknown is the innermost node voltage x. Walking outward from it is explicit: the
 * current into node N's shunts flows through series element N, which fixes node N−1, whose
 * shunts add their current, and so on out to the source. So the source voltage needed,
 * F(x), is a composition of monotone maps with dF/dx ≥ 1 (every shunt draws more current as
 * its node rises; every series resistance is ≥ 0). F(x) = vs therefore has exactly one root,
 * and one evaluation brackets it: the root lies within |F(x) − vs| of x. Newton's step is
 * taken inside the bracket and bisection otherwise, so the solve cannot fail or diverge and
 * needs no damping heuristics (safeguarded Newton, as in Numerical Recipes' rtsafe).
 */
import {
  BRANCH_CAPACITOR,
  BRANCH_JUNCTION,
  BRANCH_LINEAR,
  BRANCH_POWER_LAW,
  type CompiledNetwork,
} from './network';
import { junctionCurrentFast } from './junction';

/** exp(60) ≈ 1e26: beyond this a power-law branch continues linearly (never reached by a real solution). */
const POWER_LAW_EXPONENT_LIMIT = 60;
const MAX_ITERATIONS = 300;

export class LadderSolver {
  readonly net: CompiledNetwork;
  /** Node voltages (node k = after stage k+1's series element). */
  readonly v: Float64Array;
  /** Current through the series element of node k (towards the node). */
  readonly seriesCurrent: Float64Array;
  /** Current from the node into each branch, and its conductance. */
  readonly branchCurrent: Float64Array;
  readonly branchConductance: Float64Array;
  /** Capacitor companion model per branch: i = g·(v − reference). */
  readonly companionConductance: Float64Array;
  readonly companionReference: Float64Array;
  /** Terminal voltage (before series element 1) and source current of the last solve. */
  terminalVoltage = 0;
  sourceCurrent = 0;
  /** Newton/bisection evaluations in all solves so far (for the benchmark). */
  evaluations = 0;
  private lastX = 0;
  private lastVs = 0;
  private lastDerivative = 1;
  private derivative = 1;
  private readonly scratch = { i: 0, g: 0 };

  constructor(net: CompiledNetwork) {
    this.net = net;
    const count = net.branchType.length;
    this.v = new Float64Array(net.nodeCount);
    this.seriesCurrent = new Float64Array(net.nodeCount);
    this.branchCurrent = new Float64Array(count);
    this.branchConductance = new Float64Array(count);
    this.companionConductance = new Float64Array(count);
    this.companionReference = new Float64Array(count);
  }

  /** Source voltage needed for innermost node voltage x; fills every node and branch. */
  private evaluate(x: number, rs: number): number {
    this.evaluations++;
    const net = this.net;
    const n = net.nodeCount;
    const v = this.v;
    const scratch = this.scratch;
    let current = 0; // current flowing inward through the series element feeding this node
    let dCurrent = 0; // d(current)/dx
    let voltage = x;
    let dVoltage = 1;
    for (let k = n - 1; k >= 0; k--) {
      v[k] = voltage;
      for (let b = net.branchStart[k], end = net.branchStart[k + 1]; b < end; b++) {
        let i = 0;
        let g = 0;
        switch (net.branchType[b]) {
          case BRANCH_LINEAR:
            g = net.branchConductance[b];
            i = g * (voltage - net.branchReference[b]);
            break;
          case BRANCH_CAPACITOR:
            g = this.companionConductance[b];
            i = g * (voltage - this.companionReference[b]);
            break;
          case BRANCH_JUNCTION: {
            const dir = net.branchDirection[b];
            junctionCurrentFast(
              net.branchIsat[b],
              net.branchRs[b],
              net.branchNvt[b],
              net.branchInverseNvt[b],
              net.branchLogPrefactor[b],
              dir * (voltage - net.branchReference[b]) - net.branchOffset[b],
              scratch,
            );
            i = dir * scratch.i;
            g = scratch.g;
            break;
          }
          case BRANCH_POWER_LAW: {
            const u = voltage - net.branchReference[b];
            const magnitude = Math.abs(u);
            if (magnitude > 0) {
              const alpha = net.branchAlpha[b];
              const v1 = net.branchV1[b];
              const exponent = alpha * Math.log(magnitude / v1);
              let mag: number;
              if (exponent <= POWER_LAW_EXPONENT_LIMIT) {
                mag = net.branchI1[b] * Math.exp(exponent);
                g = (alpha * mag) / magnitude;
              } else {
                const edge = v1 * Math.exp(POWER_LAW_EXPONENT_LIMIT / alpha);
                const edgeCurrent = net.branchI1[b] * Math.exp(POWER_LAW_EXPONENT_LIMIT);
                g = (alpha * edgeCurrent) / edge;
                mag = edgeCurrent + g * (magnitude - edge);
              }
              i = u > 0 ? mag : -mag;
            }
            break;
          }
        }
        this.branchCurrent[b] = i;
        this.branchConductance[b] = g;
        current += i;
        dCurrent += g * dVoltage;
      }
      this.seriesCurrent[k] = current;
      const r = net.seriesResistance[k];
      voltage += r * current;
      dVoltage += r * dCurrent;
    }
    this.terminalVoltage = voltage;
    this.sourceCurrent = current;
    this.derivative = dVoltage + rs * dCurrent;
    return voltage + rs * current;
  }

  /**
   * Solve for source `vs` behind `rs`. Starts from the previous solution (consecutive samples
   * are close). Returns the number of evaluations used.
   */
  solve(vs: number, rs: number): number {
    const start = this.evaluations;
    const tolerance = 1e-11 * Math.max(1, Math.abs(vs));
    // First Newton step from the previous solution, using its derivative (no evaluation).
    let x = this.lastX + (vs - this.lastVs) / this.lastDerivative;
    let r = this.evaluate(x, rs) - vs;
    if (Math.abs(r) > tolerance) {
      // dF/dx ≥ 1, so the root lies between x and x − r.
      let lo = r > 0 ? x - r : x;
      let hi = r > 0 ? x : x - r;
      for (let k = 0; k < MAX_ITERATIONS; k++) {
        let next = x - r / this.derivative;
        if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
        x = next;
        r = this.evaluate(x, rs) - vs;
        if (r > 0) hi = x;
        else lo = x;
        if (Math.abs(r) <= tolerance || hi - lo <= 4e-16 * Math.max(1, Math.abs(x))) break;
      }
    }
    this.lastX = x;
    this.lastVs = vs;
    this.lastDerivative = this.derivative;
    return this.evaluations - start;
  }

  /** Forget the warm start (a new case). */
  reset(): void {
    this.lastX = 0;
    this.lastVs = 0;
    this.lastDerivative = 1;
    this.companionConductance.fill(0);
    this.companionReference.fill(0);
  }
}
