/**
 * Benchmarks of the stress engine (issue 3): cases per second over a realistic mix, the speed
 * ratio to ngspice on the same cases (where ngspice is installed), and 10 000 channels × 4
 * cases through the memoised entry point the audit uses.
 */
import { existsSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import {
  clearStressCache,
  solveStress,
  solveStressCached,
  stressCacheStats,
  type Guard,
  type StressCase,
  type StressConditions,
} from '../../lib/stress';
import { NGSPICE, spiceFigures } from '../../tests/stress/spice/netlist';
import { timeRuns, type BenchFigure } from './exposure';

const CONDITIONS: StressConditions = { ambientC: 40, powerDerating: 0.5, voltageDerating: 0.8 };

/** Deterministic pseudo-random numbers (mulberry32). */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const E12 = [1, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];

/** Typical input guards (invented), one or two stages, with values drawn per channel. */
export function guardRecipe(kind: number, rnd: () => number): Guard {
  const r = (lo: number, decades: number) =>
    Number((E12[Math.floor(rnd() * 12)] * lo * 10 ** Math.floor(rnd() * decades)).toPrecision(3));
  const input24 = { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3 };
  switch (kind % 5) {
    case 0: // 24 V digital input: resistor + bidirectional zener
      return {
        stages: [
          {
            series: {
              kind: 'resistor',
              id: 'R1',
              resistance: r(1e3, 2),
              ratedPower: 0.25,
              limitingVoltage: 200,
            },
            shunts: [
              {
                kind: 'zener',
                id: 'Z1',
                bidirectional: true,
                zenerVoltage: 27,
                testCurrent: 5e-3,
                dynamicImpedance: 35,
                powerRating: 0.5,
              },
            ],
          },
        ],
        input: { ...input24, inputResistance: 4.7e3 },
      };
    case 1: // IC input: resistor + TVS, resistor + rail diodes, internal clamps
      return {
        stages: [
          {
            series: {
              kind: 'resistor',
              id: 'R1',
              resistance: r(10, 2),
              ratedPower: 0.5,
              limitingVoltage: 350,
              overloadVoltage: 700,
            },
            shunts: [
              {
                kind: 'tvs',
                id: 'TV1',
                bidirectional: false,
                standoffVoltage: 26,
                breakdownVoltage: 28.9,
                clampVoltage: 42.1,
                peakPulseCurrent: 14.3,
              },
            ],
          },
          {
            series: {
              kind: 'resistor',
              id: 'R2',
              resistance: r(1e3, 1),
              ratedPower: 0.125,
              limitingVoltage: 150,
            },
            shunts: [
              {
                kind: 'railDiodes',
                id: 'D1',
                forwardVoltage: 1,
                forwardCurrent: 0.01,
                averageCurrent: 0.15,
                surgeCurrent: 1,
              },
            ],
          },
        ],
        input: {
          ...input24,
          inputResistance: 5e3,
          internalClamps: true,
          positiveRailMinLoad: 0.02,
        },
      };
    case 2: // 4–20 mA: PTC + TVS, burden
      return {
        stages: [
          {
            series: {
              kind: 'ptc',
              id: 'F1',
              resistance: 10,
              holdCurrent: 0.05,
              tripCurrent: 0.1,
              maxVoltage: 60,
            },
            shunts: [
              {
                kind: 'tvs',
                id: 'TV1',
                bidirectional: true,
                standoffVoltage: 33,
                breakdownVoltage: 36.7,
                clampVoltage: 53.3,
                peakPulseCurrent: 11.3,
              },
            ],
          },
          {
            series: {
              kind: 'resistor',
              id: 'R1',
              resistance: r(10, 2),
              ratedPower: 0.25,
              limitingVoltage: 200,
            },
            shunts: [
              {
                kind: 'shuntResistor',
                id: 'RB',
                resistance: 250,
                ratedPower: 0.25,
                limitingVoltage: 200,
              },
            ],
          },
        ],
        input: { ...input24, inputResistance: 1e6, internalClamps: true },
      };
    case 3: // surge terminal: fuse + varistor, then a resistor
      return {
        stages: [
          {
            series: {
              kind: 'fuse',
              id: 'F1',
              ratedCurrent: 0.1,
              voltageRating: 250,
              meltingI2t: 0.02,
              resistance: 1.5,
            },
            shunts: [
              {
                kind: 'varistor',
                id: 'RV1',
                maxContinuousVoltage: 30,
                varistorVoltage: 47,
                clampVoltage: 93,
                clampCurrent: 5,
                surgeCurrent: 500,
                surgeEnergy: 2,
              },
            ],
          },
          {
            series: {
              kind: 'resistor',
              id: 'R1',
              resistance: r(10, 2),
              ratedPower: 0.5,
              limitingVoltage: 350,
            },
            shunts: [],
          },
        ],
        input: { ...input24, inputResistance: 2.7e3 },
      };
    default: // analog voltage input with rail diodes only
      return {
        stages: [
          {
            series: {
              kind: 'resistor',
              id: 'R1',
              resistance: r(1e3, 2),
              ratedPower: 0.25,
              limitingVoltage: 200,
            },
            shunts: [
              {
                kind: 'railDiodes',
                id: 'D1',
                forwardVoltage: 1,
                forwardCurrent: 0.01,
                averageCurrent: 0.2,
                surgeCurrent: 2,
              },
            ],
          },
        ],
        input: {
          positiveRail: 10,
          negativeRail: -10,
          absMaxBeyondRail: 0.3,
          inputResistance: 1e6,
          internalClamps: true,
          positiveRailMinLoad: 0.005,
          negativeRailMinLoad: 0.005,
        },
      };
  }
}

export const CASE_MIX: StressCase[] = [
  { kind: 'dc', voltage: 28.8, sourceResistance: 0.1 },
  { kind: 'ac', rmsVoltage: 253, frequency: 50, sourceResistance: 0.5 },
  { kind: 'ac', rmsVoltage: 132, frequency: 60, sourceResistance: 0.5 },
  { kind: 'surge', peakVoltage: 1000, couplingResistance: 40 },
  { kind: 'esd', voltage: 8000 },
];

/** Uncached engine throughput, per kind of case and overall. */
export function benchEngine(runs = 5): BenchFigure[] {
  const rnd = random(11);
  const guards = Array.from({ length: 200 }, (_, k) => guardRecipe(k, rnd));
  const figures: BenchFigure[] = [];
  const perKind = new Map<string, StressCase[]>();
  for (const c of CASE_MIX) perKind.set(c.kind === 'ac' ? `ac ${c.frequency} Hz` : c.kind, [c]);
  perKind.set('mix (DC, AC 50/60 Hz, surge, ESD)', CASE_MIX);
  // warm the JIT on the whole mix first, so the first kind measured is not penalised
  for (let k = 0; k < 3; k++)
    for (const g of guards) for (const c of CASE_MIX) solveStress(g, c, CONDITIONS);
  for (const [name, cases] of perKind) {
    const count = guards.length * cases.length;
    const t = timeRuns(() => {
      for (const g of guards) for (const c of cases) solveStress(g, c, CONDITIONS);
    }, runs);
    figures.push({
      name: `engine, ${name}`,
      goalMs: Number.NaN,
      ...t,
      runs,
      detail: `${count} solves (1–2 stage guards): ${((1000 * count) / t.cpuMedianMs).toFixed(0)} cases/s CPU, ${((1000 * t.cpuMedianMs) / count).toFixed(1)} µs per case`,
    });
  }
  return figures;
}

/** Engine versus ngspice on the same guard and case: wall time per case. */
export function benchNgspice(): BenchFigure | null {
  if (!existsSync(NGSPICE)) return null;
  const rnd = random(5);
  const pairs = CASE_MIX.flatMap((c, k) =>
    [guardRecipe(k, rnd), guardRecipe(k + 1, rnd)].map((g) => [g, c] as const),
  );
  let spiceMs = 0;
  let engineMs = 0;
  for (const [g, c] of pairs) {
    const t0 = performance.now();
    spiceFigures(g, c, 1, c.kind === 'esd' ? { pulseEnd: 3e-6, pulseStep: 0.05e-9 } : {});
    spiceMs += performance.now() - t0;
    const reps = 200;
    solveStress(g, c, CONDITIONS);
    const t1 = performance.now();
    for (let k = 0; k < reps; k++) solveStress(g, c, CONDITIONS);
    engineMs += (performance.now() - t1) / reps;
  }
  return {
    name: 'engine vs ngspice (same networks, same cases)',
    goalMs: Number.NaN,
    medianMs: engineMs / pairs.length,
    cpuMedianMs: Number.NaN,
    runs: pairs.length,
    detail: `${pairs.length} cases: ngspice ${(spiceMs / pairs.length).toFixed(0)} ms per case (batch run, netlist to figures), engine ${((1000 * engineMs) / pairs.length).toFixed(0)} µs per case: ${(spiceMs / engineMs).toFixed(0)}× faster`,
  };
}

/** 10 000 channels × 4 cases through solveStressCached (cold cache each run). */
export function benchChannels(runs = 3): BenchFigure {
  const rnd = random(23);
  // 40 recipes (value variants of the five kinds); one channel in ten has an as-built override.
  const recipes = Array.from({ length: 40 }, (_, k) => guardRecipe(k, rnd));
  const channels = Array.from({ length: 10_000 }, () => {
    const base = recipes[Math.floor(rnd() * recipes.length)];
    if (rnd() < 0.1) {
      const copy = structuredClone(base);
      const s = copy.stages[0].series;
      if (s.kind === 'resistor')
        s.resistance = Number((s.resistance * (0.5 + rnd())).toPrecision(3));
      return copy;
    }
    return base;
  });
  const cases: StressCase[] = [CASE_MIX[0], CASE_MIX[1], CASE_MIX[3], CASE_MIX[4]];
  let stats = stressCacheStats();
  const t = timeRuns(() => {
    clearStressCache();
    for (const g of channels) for (const c of cases) solveStressCached(g, c, CONDITIONS);
    stats = stressCacheStats();
  }, runs);
  return {
    name: 'engine, 10 000 channels × 4 cases (memoised)',
    goalMs: 2000,
    ...t,
    runs,
    detail: `${channels.length * cases.length} case evaluations, ${stats.misses} distinct solves (40 recipes, 10 % with an as-built override)`,
  };
}

export function benchStress(): BenchFigure[] {
  const out = [...benchEngine(), benchChannels()];
  const spice = benchNgspice();
  if (spice) out.push(spice);
  return out;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href)
  for (const f of benchStress()) console.log(f);
