/**
 * Properties of the solver on random valid networks (fast-check).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveStress, type StressResult } from '@/lib/stress';
import { junctionCurrent } from '@/lib/stress/junction';
import { BRANCH_CAPACITOR, BRANCH_JUNCTION, BRANCH_LINEAR } from '@/lib/stress/network';
import { caseArb, guardArb, scaled } from './arbitraries';
import { CONDITIONS } from './networks';

/** Every number anywhere in the result is finite. */
function allFinite(value: unknown, path = 'result'): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? null : path;
  if (Array.isArray(value)) {
    for (let k = 0; k < value.length; k++) {
      const bad = allFinite(value[k], `${path}[${k}]`);
      if (bad) return bad;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (k === 'trace') continue;
      const bad = allFinite(v, `${path}.${k}`);
      if (bad) return bad;
    }
  }
  return null;
}

/**
 * Stress figures that must not fall when the hazard grows. Model leakage (reverse saturation
 * currents, nanoamperes) is not stress: 1 µA / 1 µW / 1 nJ absolute slack, 1e-6 relative for
 * quadrature differences between the two runs.
 */
// A fixed seed keeps CI repeatable; FC_SEED=<n> explores other random networks (do so after
// changing the engine: that is how the idle-energy defect of the ESD quadrature was found).
fc.configureGlobal({ seed: process.env.FC_SEED ? Number(process.env.FC_SEED) : 20261201 });

function noLess(a: StressResult, b: StressResult): string | null {
  const le = (x: number, y: number, abs: number) => y >= x * (1 - 1e-6) - abs;
  if (!le(a.sourcePeakCurrent, b.sourcePeakCurrent, 1e-6))
    return `source current ${a.sourcePeakCurrent} → ${b.sourcePeakCurrent}`;
  for (let k = 0; k < a.elements.length; k++) {
    const x = a.elements[k];
    const y = b.elements[k];
    if (!le(x.peakCurrent, y.peakCurrent, 1e-6))
      return `${x.elementId} peak current ${x.peakCurrent} → ${y.peakCurrent}`;
    if (!le(x.peakPower ?? 0, y.peakPower ?? 0, 1e-6))
      return `${x.elementId} peak power ${x.peakPower} → ${y.peakPower}`;
    if (x.averagePower !== null && !le(x.averagePower, y.averagePower!, 1e-6))
      return `${x.elementId} average power ${x.averagePower} → ${y.averagePower}`;
    if (x.pulseEnergy !== null && !le(x.pulseEnergy, y.pulseEnergy!, 1e-9))
      return `${x.elementId} energy ${x.pulseEnergy} → ${y.pulseEnergy}`;
  }
  if (!le(a.input.peakCurrent, b.input.peakCurrent, 1e-6))
    return `input current ${a.input.peakCurrent} → ${b.input.peakCurrent}`;
  return null;
}

describe('solver properties (fast-check)', () => {
  it('every output is finite, for random valid networks and cases', () => {
    fc.assert(
      fc.property(guardArb(), caseArb, fc.boolean(), (guard, stressCase, returnSide) => {
        const result = solveStress(guard, stressCase, {
          ...CONDITIONS,
          appliedTo: returnSide ? 'return' : 'signal',
        });
        expect(allFinite(result)).toBeNull();
      }),
      { numRuns: 300 },
    );
  });

  it('every output is finite with a capacitor in the network (time-stepped)', () => {
    fc.assert(
      fc.property(guardArb({ withCapacitor: true }), caseArb, (guard, stressCase) => {
        const result = solveStress(guard, stressCase, CONDITIONS);
        expect(allFinite(result)).toBeNull();
      }),
      { numRuns: 60 },
    );
  });

  it('stress never decreases when the source voltage rises', () => {
    fc.assert(
      fc.property(
        guardArb(),
        caseArb,
        fc.double({ min: 1.05, max: 3, noNaN: true }),
        (guard, stressCase, k) => {
          const weaker = solveStress(guard, stressCase, CONDITIONS);
          // Below a fault (under 1 mA from the source) only the rails' reverse leakage flows,
          // out through the source, split between a pair's two diodes as the node moves: a tiny
          // excitation can lower one diode's leakage (and the source's share of it) more than it
          // raises the other's (seen: 514.1 µW at 0 V, 512.2 µW at 50 mV DC in one pair). That is
          // the diode law, not a solver error, and no fault; the law under test is about faults,
          // as in the series-resistance property below.
          fc.pre(weaker.sourcePeakCurrent >= 1e-3);
          const stronger = solveStress(guard, scaled(stressCase, k), CONDITIONS);
          expect(noLess(weaker, stronger)).toBeNull();
        },
      ),
      { numRuns: 300 },
    );
  });

  it('adding series resistance never raises the fault current', () => {
    fc.assert(
      fc.property(
        guardArb(),
        caseArb,
        fc.integer({ min: 0, max: 2 }),
        fc.double({ min: 1, max: 10_000, noNaN: true }),
        (guard, stressCase, at, extra) => {
          const stage = Math.min(at, guard.stages.length - 1);
          const before = solveStress(guard, stressCase, CONDITIONS);
          // A hazard too small to drive a fault (under 1 mA) leaves only the rails' reverse leakage
          // flowing out through the source; that is not fault current and obeys no such law.
          fc.pre(before.sourcePeakCurrent >= 1e-3);
          const more = structuredClone(guard);
          const series = more.stages[stage].series;
          if (series.kind === 'fuse') series.resistance = (series.resistance ?? 0) + extra;
          else series.resistance += extra;
          const after = solveStress(more, stressCase, CONDITIONS);
          expect(after.sourcePeakCurrent).toBeLessThanOrEqual(
            before.sourcePeakCurrent * (1 + 1e-6) + 1e-6,
          );
        },
      ),
      { numRuns: 300 },
    );
  });

  it(
    "Kirchhoff's current law holds at every node of every sample (currents re-evaluated from the node voltages)",
    { timeout: 180_000 },
    () => {
      fc.assert(
        fc.property(
          fc.oneof(guardArb(), guardArb({ withCapacitor: true })),
          caseArb,
          (guard, stressCase) => {
            const result = solveStress(guard, stressCase, CONDITIONS, { trace: true });
            const { network: net, samples } = result.trace!;
            let worst = 0; // largest residual as a fraction of its tolerance
            for (const s of samples) {
              const scale = Math.max(Math.abs(s.seriesCurrents[0]), 1e-9);
              // independent branch currents from the model equations
              const branch = net.branchSpecs.map((spec, b) => {
                const v = s.nodeVoltages[net.branchNode[b]];
                if (spec.type === BRANCH_LINEAR)
                  return spec.conductance! * (v - net.branchReference[b]);
                if (spec.type === BRANCH_CAPACITOR)
                  return s.companion[b][0] * (v - s.companion[b][1]);
                if (spec.type === BRANCH_JUNCTION) {
                  const out = { i: 0, g: 0 };
                  junctionCurrent(
                    spec.junction!,
                    spec.direction * (v - net.branchReference[b]) - spec.junction!.offset,
                    out,
                  );
                  return spec.direction * out.i;
                }
                const u = v - net.branchReference[b];
                return Math.sign(u) * spec.i1! * Math.abs(u / spec.v1!) ** spec.alpha!;
              });
              // series currents from Ohm's law where there is resistance; the source from its own
              const into = (k: number) => {
                const r = net.seriesResistance[k];
                const upstream = k === 0 ? s.terminalVoltage : s.nodeVoltages[k - 1];
                return r > 0 ? (upstream - s.nodeVoltages[k]) / r : s.seriesCurrents[k];
              };
              // Tolerances: the solver stops once the source equation's residual is within
              // 1e-11·max(1, |vs|) V, which (vs − v)/rs turns into a current error of that over rs;
              // every node equation is exact up to rounding (ε·|v|/R from Ohm's law).
              const maxV = Math.max(
                1,
                Math.abs(s.sourceVoltage),
                ...s.nodeVoltages.map(Math.abs),
                Math.abs(s.terminalVoltage),
              );
              const rounding = (r: number) => (r > 0 ? (1e-13 * maxV) / r : 0);
              if (s.sourceResistance > 0 && stressCase.kind !== 'esd') {
                const source = (s.sourceVoltage - s.terminalVoltage) / s.sourceResistance;
                const tolerance =
                  1e-6 * scale +
                  (2e-11 * Math.max(1, Math.abs(s.sourceVoltage))) / s.sourceResistance +
                  rounding(net.seriesResistance[0]) +
                  1e-12;
                worst = Math.max(worst, Math.abs(source - into(0)) / tolerance);
              }
              for (let k = 0; k < net.nodeCount; k++) {
                let out = k + 1 < net.nodeCount ? into(k + 1) : 0;
                for (let b = net.branchStart[k]; b < net.branchStart[k + 1]; b++) out += branch[b];
                const tolerance =
                  1e-6 * scale +
                  rounding(net.seriesResistance[k]) +
                  (k + 1 < net.nodeCount ? rounding(net.seriesResistance[k + 1]) : 0) +
                  1e-12;
                worst = Math.max(worst, Math.abs(into(k) - out) / tolerance);
              }
            }
            expect(worst).toBeLessThanOrEqual(1);
          },
        ),
        { numRuns: 80 },
      );
    },
  );
});
