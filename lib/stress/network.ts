/**
 * Compiles a Guard into flat arrays the ladder solver walks without allocating.
 *
 * Topology (from the field terminal inward): source → series element of stage 1 → node 1
 * (stage 1's shunts) → series element of stage 2 → node 2 … → node N, where the protected
 * input also sits. Every shunt returns to the channel's common (0 V) or, for rail diodes and
 * internal clamps, to a supply rail held at its nominal voltage (an ideal rail: the current
 * pushed into it is reported as rail injection). A guard with no stages gets one internal
 * zero-ohm link so the protected input is node 1.
 */
import type { Guard, GuardElement, ShuntElement } from './types';
import {
  breakdownParams,
  forwardDiodeParams,
  junctionVoltage,
  THERMAL_VOLTAGE,
  tvsBreakdownParams,
  type JunctionParams,
} from './junction';

export const BRANCH_LINEAR = 0;
export const BRANCH_JUNCTION = 1;
export const BRANCH_POWER_LAW = 2;
export const BRANCH_CAPACITOR = 3;

/** Defaults used when the datasheet figure is absent (common practice, no source). */
export const MODEL_DEFAULTS = {
  zenerTestCurrent: 5e-3,
  zenerForwardVoltage: 1.0,
  zenerForwardCurrent: 0.1,
  tvsTestCurrent: 1e-3,
  tvsForwardVoltage: 1.0,
  tvsForwardCurrent: 1.0,
  clampForwardVoltage: 0.7,
  clampForwardCurrent: 1e-3,
  varistorReferenceCurrent: 1e-3,
} as const;

/** A shunt branch in SI, as derived from datasheet figures (also used to write SPICE netlists). */
export interface BranchSpec {
  type:
    | typeof BRANCH_LINEAR
    | typeof BRANCH_JUNCTION
    | typeof BRANCH_POWER_LAW
    | typeof BRANCH_CAPACITOR;
  /** Reference the branch returns to: the common, or a rail. */
  reference: 'common' | 'positiveRail' | 'negativeRail';
  /** Junction orientation: +1 conducts when the node is above the reference. */
  direction: 1 | -1;
  junction?: JunctionParams;
  /** Linear: conductance (S). */
  conductance?: number;
  /** Power law (varistor): i = i1·sgn(v)·(|v|/v1)^alpha. */
  i1?: number;
  v1?: number;
  alpha?: number;
  capacitance?: number;
}

export interface ElementInfo {
  element: GuardElement | null; // null: the protected input
  id: string;
  kind: GuardElement['kind'] | 'input';
  stage: number; // 1-based
  role: 'series' | 'shunt' | 'input';
  node: number; // 0-based node index (shunts, input); for series: the node after it
}

export interface CompiledNetwork {
  nodeCount: number;
  seriesResistance: Float64Array;
  /** Branches of node k are branchStart[k] … branchStart[k+1]−1. */
  branchStart: Int32Array;
  branchType: Uint8Array;
  branchDirection: Float64Array;
  branchReference: Float64Array; // volts
  branchRail: Int8Array; // +1 positive rail, −1 negative rail, 0 common
  branchElement: Int32Array;
  branchJunction: (JunctionParams | null)[];
  /** Junction constants for the hot path (see junctionCurrentFast). */
  branchIsat: Float64Array;
  branchRs: Float64Array;
  branchNvt: Float64Array;
  branchInverseNvt: Float64Array;
  branchLogPrefactor: Float64Array;
  branchOffset: Float64Array;
  branchConductance: Float64Array;
  branchI1: Float64Array;
  branchV1: Float64Array;
  branchAlpha: Float64Array;
  branchCapacitance: Float64Array;
  branchSpecs: BranchSpec[];
  branchNode: Int32Array;
  capacitorCount: number;
  elements: ElementInfo[];
  /** Index in `elements` of the series element of each node's stage (−1: internal link). */
  seriesElementOfNode: Int32Array;
  inputElement: number;
  positiveRail: number;
  negativeRail: number;
  notes: string[];
}

/** Shunt branches of one element, from its datasheet figures. */
export function shuntBranches(el: ShuntElement, notes: string[]): BranchSpec[] {
  switch (el.kind) {
    case 'railDiodes': {
      const j = forwardDiodeParams(
        el.forwardVoltage,
        el.forwardCurrent,
        el.emissionCoefficient,
        el.seriesResistance,
      );
      return [
        { type: BRANCH_JUNCTION, reference: 'positiveRail', direction: 1, junction: j },
        { type: BRANCH_JUNCTION, reference: 'negativeRail', direction: -1, junction: j },
      ];
    }
    case 'zener': {
      const it = el.testCurrent ?? MODEL_DEFAULTS.zenerTestCurrent;
      if (el.testCurrent === undefined)
        notes.push(`${el.id}: zener test current not given, 5 mA assumed`);
      const fv = el.forwardVoltage ?? MODEL_DEFAULTS.zenerForwardVoltage;
      const fi = el.forwardCurrent ?? MODEL_DEFAULTS.zenerForwardCurrent;
      const forward = forwardDiodeParams(fv, fi);
      if (el.bidirectional) {
        // Back-to-back pair: one junction per polarity through Vz + the forward drop at Iz,
        // with the forward diode's bulk resistance added to the slope.
        const knee = el.zenerVoltage + junctionVoltage(forward, it);
        const j = breakdownParams(knee, it, el.dynamicImpedance + forward.seriesResistance);
        return [
          { type: BRANCH_JUNCTION, reference: 'common', direction: 1, junction: j },
          { type: BRANCH_JUNCTION, reference: 'common', direction: -1, junction: j },
        ];
      }
      const j = breakdownParams(el.zenerVoltage, it, el.dynamicImpedance);
      return [
        { type: BRANCH_JUNCTION, reference: 'common', direction: 1, junction: j },
        { type: BRANCH_JUNCTION, reference: 'common', direction: -1, junction: forward },
      ];
    }
    case 'tvs': {
      const it = el.testCurrent ?? MODEL_DEFAULTS.tvsTestCurrent;
      const j = tvsBreakdownParams(el.breakdownVoltage, it, el.clampVoltage, el.peakPulseCurrent);
      if (el.bidirectional) {
        return [
          { type: BRANCH_JUNCTION, reference: 'common', direction: 1, junction: j },
          { type: BRANCH_JUNCTION, reference: 'common', direction: -1, junction: j },
        ];
      }
      const forward = forwardDiodeParams(
        el.forwardVoltage ?? MODEL_DEFAULTS.tvsForwardVoltage,
        el.forwardCurrent ?? MODEL_DEFAULTS.tvsForwardCurrent,
      );
      return [
        { type: BRANCH_JUNCTION, reference: 'common', direction: 1, junction: j },
        { type: BRANCH_JUNCTION, reference: 'common', direction: -1, junction: forward },
      ];
    }
    case 'varistor': {
      // Power law through (V1mA, 1 mA) and (Vc, Ic): alpha = ln(Ic / 1 mA) / ln(Vc / V1mA),
      // the usual way a varistor's non-linearity exponent is read off its V–I curve.
      const i1 = MODEL_DEFAULTS.varistorReferenceCurrent;
      const alpha = Math.log(el.clampCurrent / i1) / Math.log(el.clampVoltage / el.varistorVoltage);
      return [
        {
          type: BRANCH_POWER_LAW,
          reference: 'common',
          direction: 1,
          i1,
          v1: el.varistorVoltage,
          alpha,
        },
      ];
    }
    case 'capacitor':
      return [
        { type: BRANCH_CAPACITOR, reference: 'common', direction: 1, capacitance: el.capacitance },
      ];
    case 'shuntResistor':
      return [
        { type: BRANCH_LINEAR, reference: 'common', direction: 1, conductance: 1 / el.resistance },
      ];
  }
}

/** Branches of the protected input: its input resistance and its internal clamps. */
export function inputBranches(guard: Guard): BranchSpec[] {
  const input = guard.input;
  const out: BranchSpec[] = [];
  if (input.inputResistance !== undefined) {
    out.push({
      type: BRANCH_LINEAR,
      reference: 'negativeRail',
      direction: 1,
      conductance: 1 / input.inputResistance,
    });
  }
  if (input.internalClamps) {
    const j = forwardDiodeParams(
      input.clampForwardVoltage ?? MODEL_DEFAULTS.clampForwardVoltage,
      input.clampForwardCurrent ?? MODEL_DEFAULTS.clampForwardCurrent,
    );
    out.push({ type: BRANCH_JUNCTION, reference: 'positiveRail', direction: 1, junction: j });
    out.push({ type: BRANCH_JUNCTION, reference: 'negativeRail', direction: -1, junction: j });
  }
  return out;
}

export function seriesResistanceOf(el: GuardElement): number {
  switch (el.kind) {
    case 'resistor':
    case 'wire':
    case 'ptc':
      return el.resistance;
    case 'fuse':
      return el.resistance ?? 0;
    default:
      return 0;
  }
}

export function compileGuard(guard: Guard): CompiledNetwork {
  const notes: string[] = [];
  const stages = guard.stages.length > 0 ? guard.stages : null;
  const nodeCount = stages ? stages.length : 1;
  const seriesResistance = new Float64Array(nodeCount);
  const seriesElementOfNode = new Int32Array(nodeCount).fill(-1);
  const elements: ElementInfo[] = [];
  const perNode: { spec: BranchSpec; element: number }[][] = [];
  for (let k = 0; k < nodeCount; k++) perNode.push([]);

  if (stages) {
    stages.forEach((stage, k) => {
      seriesResistance[k] = seriesResistanceOf(stage.series);
      seriesElementOfNode[k] = elements.length;
      elements.push({
        element: stage.series,
        id: stage.series.id,
        kind: stage.series.kind,
        stage: k + 1,
        role: 'series',
        node: k,
      });
      for (const shunt of stage.shunts) {
        const index = elements.length;
        elements.push({
          element: shunt,
          id: shunt.id,
          kind: shunt.kind,
          stage: k + 1,
          role: 'shunt',
          node: k,
        });
        for (const spec of shuntBranches(shunt, notes)) perNode[k].push({ spec, element: index });
      }
    });
  }
  const inputElement = elements.length;
  elements.push({
    element: null,
    id: 'input',
    kind: 'input',
    stage: nodeCount,
    role: 'input',
    node: nodeCount - 1,
  });
  for (const spec of inputBranches(guard))
    perNode[nodeCount - 1].push({ spec, element: inputElement });

  const flat = perNode.flat();
  const count = flat.length;
  const branchStart = new Int32Array(nodeCount + 1);
  let cursor = 0;
  for (let k = 0; k < nodeCount; k++) {
    branchStart[k] = cursor;
    cursor += perNode[k].length;
  }
  branchStart[nodeCount] = cursor;

  const net: CompiledNetwork = {
    nodeCount,
    seriesResistance,
    branchStart,
    branchType: new Uint8Array(count),
    branchDirection: new Float64Array(count),
    branchReference: new Float64Array(count),
    branchRail: new Int8Array(count),
    branchElement: new Int32Array(count),
    branchJunction: new Array<JunctionParams | null>(count).fill(null),
    branchIsat: new Float64Array(count),
    branchRs: new Float64Array(count),
    branchNvt: new Float64Array(count),
    branchInverseNvt: new Float64Array(count),
    branchLogPrefactor: new Float64Array(count),
    branchOffset: new Float64Array(count),
    branchConductance: new Float64Array(count),
    branchI1: new Float64Array(count),
    branchV1: new Float64Array(count),
    branchAlpha: new Float64Array(count),
    branchCapacitance: new Float64Array(count),
    branchSpecs: flat.map((b) => b.spec),
    branchNode: new Int32Array(count),
    capacitorCount: 0,
    elements,
    seriesElementOfNode,
    inputElement,
    positiveRail: guard.input.positiveRail,
    negativeRail: guard.input.negativeRail,
    notes,
  };
  let b = 0;
  for (let k = 0; k < nodeCount; k++) {
    for (const { spec, element } of perNode[k]) {
      net.branchNode[b] = k;
      net.branchType[b] = spec.type;
      net.branchDirection[b] = spec.direction;
      // Rail injection counts clamp junctions only; an input resistance to the negative rail
      // is the input's own load, not a clamp.
      net.branchRail[b] =
        spec.type !== BRANCH_JUNCTION
          ? 0
          : spec.reference === 'positiveRail'
            ? 1
            : spec.reference === 'negativeRail'
              ? -1
              : 0;
      net.branchReference[b] =
        spec.reference === 'positiveRail'
          ? guard.input.positiveRail
          : spec.reference === 'negativeRail'
            ? guard.input.negativeRail
            : 0;
      net.branchElement[b] = element;
      net.branchJunction[b] = spec.junction ?? null;
      if (spec.junction) {
        const j = spec.junction;
        const nvt = j.emission * THERMAL_VOLTAGE;
        net.branchIsat[b] = j.saturationCurrent;
        net.branchRs[b] = j.seriesResistance;
        net.branchNvt[b] = nvt;
        net.branchInverseNvt[b] = 1 / nvt;
        net.branchLogPrefactor[b] =
          Math.log((j.saturationCurrent * j.seriesResistance) / nvt) +
          (j.saturationCurrent * j.seriesResistance) / nvt;
        net.branchOffset[b] = j.offset;
      }
      net.branchConductance[b] = spec.conductance ?? 0;
      net.branchI1[b] = spec.i1 ?? 0;
      net.branchV1[b] = spec.v1 ?? 1;
      net.branchAlpha[b] = spec.alpha ?? 1;
      net.branchCapacitance[b] = spec.capacitance ?? 0;
      if (spec.type === BRANCH_CAPACITOR) net.capacitorCount++;
      b++;
    }
  }
  return net;
}
