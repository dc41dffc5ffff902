/**
 * Runs one stress case through the ladder solver and accumulates what the ratings need:
 * per-element peaks, integrals (energy, V², I², |I|), protected-input extremes, rail injection.
 *
 * Sampling:
 *  - DC: one solve (capacitors carry no current in the steady state).
 *  - AC without capacitors: the network is static, so each sample depends only on the
 *    instantaneous source voltage. A cycle sampled uniformly at 4N points has only 2N+1
 *    distinct values (sin is symmetric about the quarter-cycle), so N+1 solves per half-wave
 *    give the same sums as the full 4N-point periodic trapezoid rule.
 *  - AC with capacitors: trapezoidal companion models, uniform steps, enough whole cycles to
 *    settle (5 time constants), then one measured cycle.
 *  - Surge and ESD: integrated in time from t = 0 with a step that starts small on the front
 *    and grows geometrically, limited by the local rate of change; backward Euler for the
 *    first two steps (damps the switching discontinuity), trapezoidal after.
 */
import { BRANCH_CAPACITOR, BRANCH_JUNCTION, type CompiledNetwork } from './network';
import { LadderSolver } from './ladder';
import type { StressCase } from './types';
import {
  ESD_BRANCHES,
  ESD_CAPACITANCE,
  ESD_RESISTANCE,
  ESD_TIP_CAPACITANCE,
  ESD_TIP_RESISTANCE,
  SURGE_GENERATOR_IMPEDANCE,
  SURGE_PEAK_TIME,
  SURGE_SPAN,
  surgeWeightsFor,
  surgeOpenCircuitVoltage,
} from './waveforms';

/** Intervals of the charge-voltage quadrature for ESD into a static network. */
const ESD_STATIC_INTERVALS = 24;

/**
 * ESD into a network without capacitors: the only state is the generator capacitor's voltage
 * Vc, and dVc/dt = −i(Vc)/C with i the static network's current. So every time integral
 * becomes an integral over Vc: ∫ f dt = C ∫ f(Vc) / i(Vc) dVc, from the charge voltage down to 0
 * (composite Simpson in Vc). Where the current has all but stopped (|i| below 1e-9 of its
 * peak: a clamp that no longer conducts holds the remaining charge), the rest is dropped.
 */
function esdStatic(solver: LadderSolver, recorder: Recorder, charge: number): void {
  if (!(Math.abs(charge) >= 1e-9)) {
    // no charge worth integrating (below a nanovolt): one sample of the idle network
    solver.solve(0, ESD_RESISTANCE);
    recorder.record(0, 0, ESD_RESISTANCE, 0);
    recorder.sim.duration = 0;
    return;
  }
  // Tip phase (the first nanoseconds): the tip branch discharges from V towards the terminal
  // voltage while the body (τ ≥ 50 ns) still holds V. Its excess over the body-only state,
  // ∫ (f(body + tip) − f(body)) dt = C_tip ∫ (f(V, Vt) − f(V)) / i_tip dVt, on nodes crowding
  // towards the equilibrium Vt* where the tip current stops.
  const rBody = ESD_RESISTANCE;
  const rTip = ESD_TIP_RESISTANCE;
  solver.solve(charge, rBody);
  const equilibrium = solver.terminalVoltage;
  const tipNodes = 6;
  let tipTime = 0;
  const combinedR = 1 / (1 / rBody + 1 / rTip);
  for (let j = tipNodes; j >= 1; j--) {
    const q = j / tipNodes;
    const vt = equilibrium + (charge - equilibrium) * q * q;
    const width =
      Math.abs(charge - equilibrium) *
      ((j === tipNodes ? 0 : ((j + 1) / tipNodes) ** 2 - q * q) +
        (q * q - ((j - 1) / tipNodes) ** 2)) *
      0.5;
    solver.solve(combinedR * (charge / rBody + vt / rTip), combinedR);
    const iTip = Math.abs((vt - solver.terminalVoltage) / rTip);
    const weight = iTip > 0 ? (ESD_TIP_CAPACITANCE * width) / iTip : 0;
    tipTime += weight;
    recorder.record(0, charge, combinedR, weight);
  }
  // subtract the body-only state over the same time (the body integral below counts it)
  solver.solve(charge, rBody);
  recorder.record(0, charge, rBody, -tipTime);

  // Body: Vc from the full charge down to 0 on knee-refined nodes, weight = C·w/|i| with w the
  // quadrature weight in Vc (Simpson on smooth triples, trapezoid around the knees); the
  // charge the tip still holds at Vt* discharges with the body, so it joins the body's C.
  const bodyCapacitance =
    ESD_CAPACITANCE + (charge !== 0 ? ESD_TIP_CAPACITANCE * (equilibrium / charge) : 0);
  const { nodes, smooth } = esdNodes(solver.net, charge);
  const w = quadratureWeights(nodes.map(Math.abs), smooth);
  let peak = 0;
  let duration = 0;
  for (let j = nodes.length - 1; j >= 0; j--) {
    const vc = nodes[j];
    solver.solve(vc, rBody);
    const i = Math.abs(solver.sourceCurrent);
    if (j === nodes.length - 1) peak = i;
    const weight = i > 1e-9 * peak ? (bodyCapacitance * w[j]) / i : 0;
    duration += weight;
    recorder.record(0, vc, rBody, weight);
  }
  // Integrate what the pulse adds above the idle network: ∫ (f − f_idle) dt. An element that
  // dissipates at rest (a leaking rail diode, a shunt to a rail) would otherwise make
  // C·dV/i grow without bound as the charge runs out, and the energy would depend on where
  // the quadrature stops (it even went negative through the tip correction).
  solver.solve(0, rBody);
  recorder.record(0, 0, rBody, -duration);
  recorder.sim.duration = duration;
}

const SURGE_BASE_LEVELS = 16;

/** Normalised surge levels in [0, 1]: Chebyshev–Lobatto spacing plus knee clusters (not smooth). */
function surgeLevels(net: CompiledNetwork, peak: number): { levels: number[]; smooth: boolean[] } {
  const magnitude = Math.abs(peak);
  const values: [number, boolean][] = [];
  for (let j = 0; j <= SURGE_BASE_LEVELS; j++)
    values.push([0.5 - 0.5 * Math.cos((Math.PI * j) / SURGE_BASE_LEVELS), true]);
  if (magnitude > 0) {
    for (const knee of clampKnees(net, peak < 0 ? -1 : 1)) {
      for (const f of ESD_KNEE_FACTORS) {
        const u = (knee * f) / magnitude;
        if (u > 0 && u < 1) values.push([u, false]);
      }
    }
  }
  values.sort((a, b) => a[0] - b[0]);
  const levels: number[] = [];
  const smooth: boolean[] = [];
  for (const [v, isSmooth] of values) {
    if (levels.length > 0 && v - levels[levels.length - 1] <= 1e-9) {
      smooth[smooth.length - 1] = smooth[smooth.length - 1] && isSmooth;
      continue;
    }
    levels.push(v);
    smooth.push(isSmooth);
  }
  return { levels, smooth };
}

/**
 * Charge-voltage nodes for the ESD quadrature: Vc = V·s³ on a uniform s grid (crowding towards
 * 0 V), plus a cluster just above each clamp's knee, where the network's current changes
 * character and the integrand bends sharply. Sorted ascending in |Vc|, signed like `charge`.
 */
function esdNodes(net: CompiledNetwork, charge: number): { nodes: number[]; smooth: boolean[] } {
  const magnitude = Math.abs(charge);
  const sign = charge < 0 ? -1 : 1;
  const values: [number, boolean][] = [];
  for (let j = 0; j <= ESD_STATIC_INTERVALS; j++) {
    const s = j / ESD_STATIC_INTERVALS;
    values.push([magnitude * s * s * s, true]);
  }
  for (const knee of clampKnees(net, sign)) {
    if (!(knee > 0 && knee < magnitude)) continue;
    for (const f of ESD_KNEE_FACTORS) {
      const v = knee * f;
      if (v > 0 && v < magnitude) values.push([v, false]);
    }
  }
  values.sort((a, b) => a[0] - b[0]);
  const nodes: number[] = [];
  const smooth: boolean[] = [];
  for (const [v, isSmooth] of values) {
    if (nodes.length > 0 && v - Math.abs(nodes[nodes.length - 1]) <= 1e-9 * magnitude) {
      smooth[smooth.length - 1] = smooth[smooth.length - 1] && isSmooth;
      continue;
    }
    nodes.push(sign * v);
    smooth.push(isSmooth);
  }
  return { nodes, smooth };
}

/**
 * Quadrature weights on ascending nodes x: Simpson's rule (for unequal steps) on consecutive
 * smooth triples, the trapezoid rule on intervals next to a non-smooth (knee) node.
 */
export function quadratureWeights(x: number[], smooth: boolean[]): Float64Array {
  const n = x.length;
  const w = new Float64Array(n);
  let j = 0;
  while (j + 1 < n) {
    if (j + 2 < n && smooth[j] && smooth[j + 1] && smooth[j + 2]) {
      const h1 = x[j + 1] - x[j];
      const h2 = x[j + 2] - x[j + 1];
      const total = h1 + h2;
      w[j] += (total / 6) * (2 - h2 / h1);
      w[j + 1] += (total * total * total) / (6 * h1 * h2);
      w[j + 2] += (total / 6) * (2 - h1 / h2);
      j += 2;
    } else {
      const h = x[j + 1] - x[j];
      w[j] += h / 2;
      w[j + 1] += h / 2;
      j += 1;
    }
  }
  return w;
}

const ESD_KNEE_FACTORS = [0.95, 1, 1.02, 1.05, 1.1, 1.2, 1.4, 1.8, 2.6];

/** Node voltages (magnitude, for a source of the given sign) at which each clamp reaches ~0.1 mA. */
function clampKnees(net: CompiledNetwork, sign: number): number[] {
  const knees: number[] = [];
  for (let b = 0; b < net.branchType.length; b++) {
    const type = net.branchType[b];
    if (type === BRANCH_JUNCTION) {
      const dir = net.branchDirection[b];
      if (dir !== sign) continue;
      const u =
        net.branchOffset[b] +
        net.branchNvt[b] * Math.log1p(1e-4 / net.branchIsat[b]) +
        1e-4 * net.branchRs[b];
      knees.push(Math.abs(net.branchReference[b] + dir * u));
    } else if (type === 2) {
      knees.push(net.branchV1[b]);
    }
  }
  return knees;
}

export interface SimulationOptions {
  waveform?: boolean;
  maxWaveformPoints?: number;
  /** Record every sample's node voltages and currents (tests: Kirchhoff checks). */
  trace?: boolean;
  /** Samples per quarter-cycle for static AC (default 16). */
  acQuarterSamples?: number;
  /** Integrate surge/ESD in time even where a static shortcut applies (tests compare both). */
  forceTimeStepping?: boolean;
}

export interface TraceSample {
  t: number;
  sourceVoltage: number;
  sourceResistance: number;
  terminalVoltage: number;
  nodeVoltages: number[];
  seriesCurrents: number[];
  branchCurrents: number[];
  /** Capacitor companion (conductance, reference) per branch at this sample. */
  companion: [number, number][];
}

export interface Simulation {
  steady: boolean;
  /** Period (AC), 1 (DC) or integration span (pulses): averages are integrals / duration. */
  duration: number;
  peakV: Float64Array;
  peakI: Float64Array;
  peakP: Float64Array;
  energy: Float64Array;
  sumV2: Float64Array;
  sumI2: Float64Array;
  sumAbsI: Float64Array;
  branchPeakI: Float64Array;
  branchSumAbsI: Float64Array;
  sourcePeakCurrent: number;
  sourcePeakVoltage: number;
  inputMaxV: number;
  inputMinV: number;
  inputPeakCurrent: number;
  railPeak: [number, number];
  railSum: [number, number];
  samples: number;
  evaluations: number;
  waveform?: { t: number[]; traces: { name: string; unit: 'V' | 'A'; values: number[] }[] };
  trace?: TraceSample[];
  notes: string[];
}

const DEFAULT_AC_QUARTER_SAMPLES = 12;
const MAX_SETTLE_CYCLES = 30;

class Recorder {
  readonly net: CompiledNetwork;
  readonly solver: LadderSolver;
  readonly sim: Simulation;
  private readonly elementCount: number;
  private readonly branchCount: number;
  // integrands of the current and previous sample: per element p, v², i², |i|; per branch |i|; rails
  private cur: Float64Array;
  private prev: Float64Array;
  private hasPrev = false;
  private tPrev = 0;
  private readonly wantWave: boolean;
  private readonly wantTrace: boolean;
  private waveT: number[] = [];
  private waveValues: number[][] = [];

  constructor(solver: LadderSolver, steady: boolean, options: SimulationOptions) {
    this.net = solver.net;
    this.solver = solver;
    const e = this.net.elements.length;
    const b = this.net.branchType.length;
    this.elementCount = e;
    this.branchCount = b;
    this.cur = new Float64Array(4 * e + b + 2);
    this.prev = new Float64Array(4 * e + b + 2);
    this.wantWave = options.waveform === true;
    this.wantTrace = options.trace === true;
    this.sim = {
      steady,
      duration: 0,
      peakV: new Float64Array(e),
      peakI: new Float64Array(e),
      peakP: new Float64Array(e),
      energy: new Float64Array(e),
      sumV2: new Float64Array(e),
      sumI2: new Float64Array(e),
      sumAbsI: new Float64Array(e),
      branchPeakI: new Float64Array(b),
      branchSumAbsI: new Float64Array(b),
      sourcePeakCurrent: 0,
      sourcePeakVoltage: 0,
      inputMaxV: -Infinity,
      inputMinV: Infinity,
      inputPeakCurrent: 0,
      railPeak: [0, 0],
      railSum: [0, 0],
      samples: 0,
      evaluations: 0,
      notes: [],
    };
    if (this.wantTrace) this.sim.trace = [];
    if (this.wantWave) this.waveValues = this.waveNames().map(() => []);
  }

  waveNames(): { name: string; unit: 'V' | 'A' }[] {
    const names: { name: string; unit: 'V' | 'A' }[] = [
      { name: 'source', unit: 'V' },
      { name: 'terminal', unit: 'V' },
      { name: 'input', unit: 'V' },
      { name: 'source current', unit: 'A' },
    ];
    for (const el of this.net.elements) {
      if (el.role !== 'input') names.push({ name: `I(${el.id})`, unit: 'A' });
    }
    names.push({ name: 'I(input)', unit: 'A' });
    return names;
  }

  /**
   * Record the solver's present state. mode 'weight': add integrand × weight;
   * mode 'trapezoid': add the trapezoid over (tPrev, t) using the previous sample.
   */
  record(t: number, vs: number, rs: number, weight: number | null): void {
    const net = this.net;
    const s = this.solver;
    const sim = this.sim;
    const e = this.elementCount;
    const cur = this.cur;
    cur.fill(0);
    sim.samples++;
    if (Math.abs(vs) > sim.sourcePeakVoltage) sim.sourcePeakVoltage = Math.abs(vs);
    if (Math.abs(s.sourceCurrent) > sim.sourcePeakCurrent)
      sim.sourcePeakCurrent = Math.abs(s.sourceCurrent);
    const nodes = net.nodeCount;
    const inputV = s.v[nodes - 1];
    if (inputV > sim.inputMaxV) sim.inputMaxV = inputV;
    if (inputV < sim.inputMinV) sim.inputMinV = inputV;

    // series elements
    for (let k = 0; k < nodes; k++) {
      const index = net.seriesElementOfNode[k];
      if (index < 0) continue;
      const v = (k === 0 ? s.terminalVoltage : s.v[k - 1]) - s.v[k];
      const i = s.seriesCurrent[k];
      this.accumulateElement(index, v, i, v * i);
    }
    // shunt branches, grouped per element
    let inputCurrent = 0;
    let railPositive = 0;
    let railNegative = 0;
    let currentElement = -1;
    let elI = 0;
    let elP = 0;
    let elV = 0;
    for (let b = 0; b < this.branchCount; b++) {
      const index = net.branchElement[b];
      if (index !== currentElement) {
        if (currentElement >= 0) this.accumulateElement(currentElement, elV, elI, elP);
        currentElement = index;
        elI = 0;
        elP = 0;
        elV = 0;
      }
      const node = net.branchNode[b];
      const i = s.branchCurrent[b];
      const reference = net.branchType[b] === BRANCH_CAPACITOR ? 0 : net.branchReference[b];
      const across = s.v[node] - reference;
      elI += i;
      elP += i * across;
      if (Math.abs(across) > Math.abs(elV)) elV = across;
      const mag = Math.abs(i);
      if (mag > sim.branchPeakI[b]) sim.branchPeakI[b] = mag;
      cur[4 * e + b] = mag;
      if (index === net.inputElement) inputCurrent += i;
      const rail = net.branchRail[b];
      if (rail > 0) railPositive += i;
      else if (rail < 0) railNegative -= i;
    }
    if (currentElement >= 0) this.accumulateElement(currentElement, elV, elI, elP);
    if (Math.abs(inputCurrent) > sim.inputPeakCurrent)
      sim.inputPeakCurrent = Math.abs(inputCurrent);
    railPositive = Math.max(railPositive, 0);
    railNegative = Math.max(railNegative, 0);
    if (railPositive > sim.railPeak[0]) sim.railPeak[0] = railPositive;
    if (railNegative > sim.railPeak[1]) sim.railPeak[1] = railNegative;
    const railBase = 4 * e + this.branchCount;
    cur[railBase] = railPositive;
    cur[railBase + 1] = railNegative;

    // integrate
    const energy = sim.energy;
    const sumV2 = sim.sumV2;
    const sumI2 = sim.sumI2;
    const sumAbsI = sim.sumAbsI;
    const branchSum = sim.branchSumAbsI;
    const branches = this.branchCount;
    if (weight !== null) {
      for (let k = 0; k < e; k++) {
        const base = 4 * k;
        energy[k] += weight * cur[base];
        sumV2[k] += weight * cur[base + 1];
        sumI2[k] += weight * cur[base + 2];
        sumAbsI[k] += weight * cur[base + 3];
      }
      for (let b = 0; b < branches; b++) branchSum[b] += weight * cur[4 * e + b];
      sim.railSum[0] += weight * cur[railBase];
      sim.railSum[1] += weight * cur[railBase + 1];
    } else if (this.hasPrev) {
      const half = 0.5 * (t - this.tPrev);
      const prev = this.prev;
      for (let k = 0; k < e; k++) {
        const base = 4 * k;
        energy[k] += half * (cur[base] + prev[base]);
        sumV2[k] += half * (cur[base + 1] + prev[base + 1]);
        sumI2[k] += half * (cur[base + 2] + prev[base + 2]);
        sumAbsI[k] += half * (cur[base + 3] + prev[base + 3]);
      }
      for (let b = 0; b < branches; b++) branchSum[b] += half * (cur[4 * e + b] + prev[4 * e + b]);
      sim.railSum[0] += half * (cur[railBase] + prev[railBase]);
      sim.railSum[1] += half * (cur[railBase + 1] + prev[railBase + 1]);
    }
    this.cur = this.prev;
    this.prev = cur;
    this.hasPrev = true;
    this.tPrev = t;

    if (this.wantWave) this.recordWave(t, vs, inputCurrent);
    if (this.wantTrace) {
      sim.trace!.push({
        t,
        sourceVoltage: vs,
        sourceResistance: rs,
        terminalVoltage: s.terminalVoltage,
        nodeVoltages: Array.from(s.v),
        seriesCurrents: Array.from(s.seriesCurrent),
        branchCurrents: Array.from(s.branchCurrent),
        companion: Array.from(
          s.companionConductance,
          (g, b) => [g, s.companionReference[b]] as [number, number],
        ),
      });
    }
  }

  private accumulateElement(index: number, v: number, i: number, p: number): void {
    const sim = this.sim;
    const av = Math.abs(v);
    const ai = Math.abs(i);
    if (av > sim.peakV[index]) sim.peakV[index] = av;
    if (ai > sim.peakI[index]) sim.peakI[index] = ai;
    if (p > sim.peakP[index]) sim.peakP[index] = p;
    const base = 4 * index;
    this.cur[base] = p;
    this.cur[base + 1] = v * v;
    this.cur[base + 2] = i * i;
    this.cur[base + 3] = ai;
  }

  private recordWave(t: number, vs: number, inputCurrent: number): void {
    const s = this.solver;
    const net = this.net;
    const values: number[] = [vs, s.terminalVoltage, s.v[net.nodeCount - 1], s.sourceCurrent];
    const perElement = new Float64Array(net.elements.length);
    for (let k = 0; k < net.nodeCount; k++) {
      const index = net.seriesElementOfNode[k];
      if (index >= 0) perElement[index] = s.seriesCurrent[k];
    }
    for (let b = 0; b < net.branchType.length; b++) {
      const index = net.branchElement[b];
      if (net.elements[index].role === 'shunt') perElement[index] += s.branchCurrent[b];
    }
    net.elements.forEach((el, index) => {
      if (el.role !== 'input') values.push(perElement[index]);
    });
    values.push(inputCurrent);
    this.waveT.push(t);
    values.forEach((value, k) => this.waveValues[k].push(value));
  }

  finish(maxPoints: number): void {
    if (!this.wantWave) return;
    const names = this.waveNames();
    const count = this.waveT.length;
    const stride = Math.max(1, Math.ceil(count / Math.max(2, maxPoints)));
    const pick = <T>(list: T[]): T[] => list.filter((_, k) => k % stride === 0 || k === count - 1);
    this.sim.waveform = {
      t: pick(this.waveT),
      traces: names.map((n, k) => ({
        name: n.name,
        unit: n.unit,
        values: pick(this.waveValues[k]),
      })),
    };
  }
}

/** Set every capacitor's companion model for a step h from its last voltage and current. */
function updateCompanions(solver: LadderSolver, h: number, trapezoidal: boolean): void {
  const net = solver.net;
  for (let b = 0; b < net.branchType.length; b++) {
    if (net.branchType[b] !== BRANCH_CAPACITOR) continue;
    const c = net.branchCapacitance[b];
    const v = solver.v[net.branchNode[b]];
    const i = solver.branchCurrent[b];
    if (trapezoidal) {
      // i(n+1) = (2C/h)(v(n+1) − v(n)) − i(n)  →  g = 2C/h, reference = v(n) + i(n)/g
      const g = (2 * c) / h;
      solver.companionConductance[b] = g;
      solver.companionReference[b] = v + i / g;
    } else {
      // backward Euler: i(n+1) = (C/h)(v(n+1) − v(n))
      solver.companionConductance[b] = c / h;
      solver.companionReference[b] = v;
    }
  }
}

/** Source for one time step: Thevenin (vs, rs) given the step, plus a state update after it. */
interface SteppedSource {
  /** Thevenin source for the step ending at t (length h). */
  thevenin(t: number, h: number, trapezoidal: boolean): [number, number];
  /** After the solve at t: advance the source's own state. */
  commit(current: number, terminalVoltage: number): void;
  /** Open-circuit value for reporting. */
  openCircuit(t: number): number;
}

interface StepPlan {
  h0: number;
  growth: number;
  hMax: number;
  /** Run at least this long, then until the source current has fallen below 1e-4 of its peak. */
  tEnd: number;
  /** A time the grid must hit exactly (the surge's open-circuit peak). */
  tMust?: number;
  maxSteps: number;
}

function stepThrough(
  solver: LadderSolver,
  recorder: Recorder,
  source: SteppedSource,
  plan: StepPlan,
): number {
  const net = solver.net;
  let t = 0;
  // t = 0+: uncharged capacitors hold 0 V (backward Euler with a vanishing step is a short to 0).
  updateCompanionsInitial(solver);
  let [vs, rs] = source.thevenin(0, 0, false);
  solver.solve(vs, rs);
  source.commit(solver.sourceCurrent, solver.terminalVoltage);
  recorder.record(0, source.openCircuit(0), rs, null);
  let h = plan.h0;
  let steps = 0;
  let peakSource = Math.abs(solver.sourceCurrent);
  let lastCurrent = solver.sourceCurrent;
  let lastTerminal = solver.terminalVoltage;
  let mustPending = plan.tMust !== undefined;
  while (steps < plan.maxSteps) {
    if (t >= plan.tEnd && Math.abs(lastCurrent) <= 1e-4 * peakSource) break;
    let step = h;
    if (mustPending && t + step >= plan.tMust! - 1e-15) {
      step = plan.tMust! - t;
      mustPending = false;
    }
    const trapezoidal = steps >= 2;
    if (net.capacitorCount > 0) updateCompanions(solver, step, trapezoidal);
    t += step;
    [vs, rs] = source.thevenin(t, step, trapezoidal);
    solver.solve(vs, rs);
    source.commit(solver.sourceCurrent, solver.terminalVoltage);
    recorder.record(t, source.openCircuit(t), rs, null);
    steps++;
    const current = solver.sourceCurrent;
    const terminal = solver.terminalVoltage;
    if (Math.abs(current) > peakSource) peakSource = Math.abs(current);
    // Limit the next step by the relative change seen over this one (≈ 5 % per step).
    const rel = Math.max(
      Math.abs(current - lastCurrent) / Math.max(Math.abs(current), 1e-3 * peakSource, 1e-30),
      Math.abs(terminal - lastTerminal) /
        Math.max(Math.abs(terminal), Math.abs(lastTerminal), 1e-9),
    );
    lastCurrent = current;
    lastTerminal = terminal;
    let next = step * plan.growth;
    if (rel > 0.05) next = Math.min(next, step * Math.max(0.5, 0.05 / rel));
    h = Math.min(Math.max(next, plan.h0), plan.hMax);
  }
  if (steps >= plan.maxSteps)
    recorder.sim.notes.push(
      `integration stopped after ${plan.maxSteps} steps at ${t.toExponential(3)} s`,
    );
  return t;
}

function updateCompanionsInitial(solver: LadderSolver): void {
  const net = solver.net;
  for (let b = 0; b < net.branchType.length; b++) {
    if (net.branchType[b] !== BRANCH_CAPACITOR) continue;
    solver.companionConductance[b] = net.branchCapacitance[b] / 1e-15;
    solver.companionReference[b] = 0;
  }
}

/** Largest capacitor time constant bound: C × (source resistance + series resistance up to its node). */
function capacitorTimeConstant(net: CompiledNetwork, sourceResistance: number): number {
  let tau = 0;
  for (let b = 0; b < net.branchType.length; b++) {
    if (net.branchType[b] !== BRANCH_CAPACITOR) continue;
    let r = sourceResistance;
    for (let k = 0; k <= net.branchNode[b]; k++) r += net.seriesResistance[k];
    tau = Math.max(tau, net.branchCapacitance[b] * r);
  }
  return tau;
}

/** Applied sign: a hazard on the return terminal reverses the polarity the guard sees. */
export function simulate(
  net: CompiledNetwork,
  stressCase: StressCase,
  sign: 1 | -1,
  options: SimulationOptions = {},
): Simulation {
  const solver = new LadderSolver(net);
  const steady = stressCase.kind === 'dc' || stressCase.kind === 'ac';
  const recorder = new Recorder(solver, steady, options);
  const sim = recorder.sim;
  const maxPoints = options.maxWaveformPoints ?? 2000;

  switch (stressCase.kind) {
    case 'dc': {
      const vs = sign * stressCase.voltage;
      solver.solve(vs, stressCase.sourceResistance);
      recorder.record(0, vs, stressCase.sourceResistance, 1);
      sim.duration = 1;
      break;
    }
    case 'ac': {
      const peak = sign * stressCase.rmsVoltage * Math.SQRT2;
      const rs = stressCase.sourceResistance;
      const period = 1 / stressCase.frequency;
      if (net.capacitorCount === 0) {
        const quarter =
          options.acQuarterSamples ?? (options.waveform ? 90 : DEFAULT_AC_QUARTER_SAMPLES);
        const h = period / (4 * quarter);
        if (options.waveform || options.trace) {
          // full cycle in time order (same sums as the symmetric plan)
          for (let m = 0; m < 4 * quarter; m++) {
            const t = m * h;
            const vs = peak * Math.sin((2 * Math.PI * m) / (4 * quarter));
            solver.solve(vs, rs);
            recorder.record(t, vs, rs, h);
          }
        } else {
          for (const polarity of [1, -1]) {
            for (let j = polarity === 1 ? 0 : 1; j <= quarter; j++) {
              const vs = polarity * peak * Math.sin((Math.PI / 2) * (j / quarter));
              const weight = j === 0 ? 2 * h : j === quarter ? h : 2 * h;
              solver.solve(vs, rs);
              recorder.record(0, vs, rs, weight);
            }
          }
        }
      } else {
        const stepsPerCycle = 2000;
        const h = period / stepsPerCycle;
        const tau = capacitorTimeConstant(net, rs);
        const settleCycles = Math.min(MAX_SETTLE_CYCLES, Math.ceil((5 * tau) / period));
        if (settleCycles === MAX_SETTLE_CYCLES) {
          sim.notes.push(
            `capacitor time constant is long against the period: steady state approximated after ${MAX_SETTLE_CYCLES} cycles`,
          );
        }
        // Settle on a coarser grid (360 steps per cycle: the state it leaves differs from the
        // fine grid's by the trapezoidal error only), then measure one cycle on the fine grid.
        const settleSteps = 360;
        const omega = 2 * Math.PI * stressCase.frequency;
        let steps = 0;
        updateCompanionsInitial(solver);
        solver.solve(0, rs);
        for (let m = 1; m <= settleCycles * settleSteps; m++) {
          const coarse = period / settleSteps;
          updateCompanions(solver, coarse, steps >= 2);
          steps++;
          solver.solve(peak * Math.sin(omega * m * coarse), rs);
        }
        // the first fine sample, at the start of the measured cycle, closes the periodic trapezoid
        recorder.record(0, peak * Math.sin(omega * settleCycles * period), rs, 0);
        for (let m = 1; m <= stepsPerCycle; m++) {
          updateCompanions(solver, h, steps >= 2);
          steps++;
          const t = m * h;
          const vs = peak * Math.sin(omega * (settleCycles * period + t));
          solver.solve(vs, rs);
          recorder.record(t, vs, rs, h);
        }
      }
      sim.duration = period;
      break;
    }
    case 'surge': {
      const peak = sign * stressCase.peakVoltage;
      const rs = SURGE_GENERATOR_IMPEDANCE + stressCase.couplingResistance;
      if (
        net.capacitorCount === 0 &&
        !options.waveform &&
        !options.trace &&
        !options.forceTimeStepping
      ) {
        // Static network: each quantity is a function of the source level u = v/peak only,
        // so ∫ f(peak·s(t)) dt = Σ W_j f(peak·u_j) with the waveform's level weights W_j,
        // on Chebyshev-spaced levels plus clusters just above each clamp's knee.
        const { levels, smooth } = surgeLevels(net, peak);
        const weights = surgeWeightsFor(levels, smooth);
        for (let j = 0; j < levels.length; j++) {
          solver.solve(peak * levels[j], rs);
          recorder.record(0, peak * levels[j], rs, weights[j]);
        }
        const span = SURGE_SPAN;
        sim.duration = span;
        break;
      }
      const source: SteppedSource = {
        thevenin: (t) => [surgeOpenCircuitVoltage(t, peak), rs],
        commit: () => undefined,
        openCircuit: (t) => surgeOpenCircuitVoltage(t, peak),
      };
      const tau = capacitorTimeConstant(net, rs);
      sim.duration = stepThrough(solver, recorder, source, {
        h0: 5e-9,
        growth: 1.06,
        hMax: 4e-6,
        tEnd: SURGE_SPAN + 5 * tau,
        tMust: SURGE_PEAK_TIME,
        maxSteps: 20000,
      });
      break;
    }
    case 'esd': {
      if (
        net.capacitorCount === 0 &&
        !options.waveform &&
        !options.trace &&
        !options.forceTimeStepping
      ) {
        esdStatic(solver, recorder, sign * stressCase.voltage);
        break;
      }
      // Each generator branch (150 pF / 330 Ω body, and the tip branch) is a charged capacitor
      // in series with its resistor; its trapezoidal (or backward Euler) companion is a
      // Thevenin source per step, and the branches in parallel combine into one.
      const branches = ESD_BRANCHES.map((b) => ({
        c: b.capacitance,
        r: b.resistance,
        v: sign * stressCase.voltage,
        i: 0,
        veq: 0,
        req: 0,
      }));
      let pendingH = 0;
      let pendingTrap = false;
      const c = ESD_CAPACITANCE;
      const source: SteppedSource = {
        thevenin: (_t, h, trapezoidal) => {
          pendingH = h;
          pendingTrap = trapezoidal;
          let conductance = 0;
          let norton = 0;
          for (const b of branches) {
            if (h === 0) {
              b.veq = b.v;
              b.req = b.r;
            } else if (trapezoidal) {
              b.veq = b.v - (h / (2 * b.c)) * b.i;
              b.req = b.r + h / (2 * b.c);
            } else {
              b.veq = b.v;
              b.req = b.r + h / b.c;
            }
            conductance += 1 / b.req;
            norton += b.veq / b.req;
          }
          return [norton / conductance, 1 / conductance];
        },
        commit: (_current, terminal) => {
          for (const b of branches) {
            const i = (b.veq - terminal) / b.req;
            if (pendingH > 0)
              b.v -= pendingTrap ? (pendingH / (2 * b.c)) * (i + b.i) : (pendingH / b.c) * i;
            b.i = i;
          }
        },
        openCircuit: () => branches[0].v,
      };
      const tauSource = c * ESD_RESISTANCE;
      const tau = Math.max(capacitorTimeConstant(net, ESD_RESISTANCE), tauSource);
      sim.duration = stepThrough(solver, recorder, source, {
        h0: 2e-11,
        growth: 1.08,
        hMax: 1e-6,
        tEnd: 10 * tau,
        maxSteps: 20000,
      });
      break;
    }
  }
  recorder.finish(maxPoints);
  sim.evaluations = solver.evaluations;
  return sim;
}
