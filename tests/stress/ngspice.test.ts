/**
 * Agreement with ngspice (a general-purpose circuit simulator, Debian package `ngspice`) on
 * the same networks: the netlist is generated from the same guard JSON (tests/stress/spice).
 * Figures compared: source peak current, and per element the peak current, peak power and
 * average power (AC/DC, over the last whole cycle) or pulse energy (surge/ESD), within 2 %.
 * Quantities below 1e-4 of the largest of their kind in the same run are compared against
 * that floor instead (a leakage of nanowatts has no meaningful relative error).
 */
import { existsSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { solveStress, type StressCase } from '@/lib/stress';
import { NGSPICE, spiceFigures } from './spice/netlist';
import { CASES, CONDITIONS, NETWORKS } from './networks';

const TOLERANCE = 0.02;

interface Pair {
  network: keyof typeof NETWORKS;
  case: keyof typeof CASES;
  spice?: Parameters<typeof spiceFigures>[3];
  what: string;
}

const PAIRS: Pair[] = [
  { network: 'zener10k', case: 'dc24', what: 'DC, one stage, zener pair' },
  { network: 'zener10k', case: 'ac120', what: 'AC 60 Hz, one stage, zener pair (trade example)' },
  { network: 'zener10k', case: 'surge1k', what: 'surge 1 kV / 42 Ω' },
  {
    network: 'zener10k',
    case: 'esd8k',
    what: 'ESD −8 kV',
    spice: { pulseEnd: 20e-6, pulseStep: 0.2e-9 },
  },
  {
    network: 'tvsRail2',
    case: 'ac230',
    what: 'AC 50 Hz, two stages, TVS + rail diodes + internal clamps',
  },
  { network: 'tvsRail2', case: 'surge2k', what: 'surge −2 kV / 12 Ω, two stages' },
  {
    network: 'tvsRail2',
    case: 'esd4k',
    what: 'ESD 4 kV, two stages',
    spice: { pulseEnd: 3e-6, pulseStep: 0.05e-9 },
  },
  { network: 'noClamp', case: 'ac230', what: 'AC 50 Hz, no clamp at all' },
  { network: 'noClamp', case: 'dc48', what: 'DC −48 V, no clamp' },
  { network: 'resistorFails', case: 'ac230', what: 'AC 50 Hz, resistor fails' },
  { network: 'zenerPair2', case: 'ac120', what: 'AC 60 Hz, two-stage zener ladder' },
  { network: 'zenerPair2', case: 'surge1k', what: 'surge, two-stage zener ladder' },
  { network: 'tvsBi', case: 'surge2k', what: 'surge into a bidirectional TVS' },
  { network: 'tvsBi', case: 'ac24', what: 'AC 26.4 V on a 24 V TVS' },
  { network: 'varistorTerminal', case: 'surge2k', what: 'surge into a varistor behind a fuse' },
  { network: 'varistorTerminal', case: 'ac24', what: 'AC on a varistor terminal' },
  {
    network: 'filterCap',
    case: 'ac230',
    what: 'AC 50 Hz with a filter capacitor (time-stepped)',
    spice: { cycles: 3 },
  },
  { network: 'filterCap', case: 'surge1k', what: 'surge with a filter capacitor' },
  // τ = 1 µF × 47.0005 kΩ ≈ 47 ms: the engine settles ceil(5τ/T) = 12 cycles, ngspice runs the same 12 + 1
  {
    network: 'slowFilter',
    case: 'ac230',
    what: 'AC 50 Hz through a slow RC filter (settling over 12 cycles)',
    spice: { cycles: 13, stepsPerCycle: 2000 },
  },
  {
    network: 'esdCapRail',
    case: 'esd8k',
    what: 'ESD into a terminal capacitor and rail diodes',
    spice: { pulseEnd: 3e-6, pulseStep: 0.05e-9 },
  },
  { network: 'loop420', case: 'dc48', what: 'DC −48 V on a 4–20 mA loop input with PTC and TVS' },
];

function close(
  label: string,
  engine: number,
  spice: number,
  floor: number,
  failures: string[],
): void {
  const scale = Math.max(Math.abs(spice), floor);
  const error = Math.abs(engine - spice) / scale;
  if (!(error <= TOLERANCE))
    failures.push(
      `${label}: engine ${engine.toPrecision(6)} vs ngspice ${spice.toPrecision(6)} (${(100 * error).toFixed(2)} %)`,
    );
}

describe('agreement with ngspice', () => {
  beforeAll(() => {
    if (!existsSync(NGSPICE)) {
      throw new Error(
        `ngspice is required for the engine agreement tests and was not found at ${NGSPICE} (apt-get install -y ngspice)`,
      );
    }
  });

  const covered = new Set(PAIRS.map((p) => p.network));
  it('covers at least 12 networks and every kind of case', () => {
    expect(PAIRS.length).toBeGreaterThanOrEqual(12);
    expect(covered.size).toBeGreaterThanOrEqual(9);
    const kinds = new Set(PAIRS.map((p) => CASES[p.case].kind));
    expect([...kinds].sort()).toEqual(['ac', 'dc', 'esd', 'surge']);
    const frequencies = new Set(
      PAIRS.map((p) => CASES[p.case])
        .filter((c): c is Extract<StressCase, { kind: 'ac' }> => c.kind === 'ac')
        .map((c) => c.frequency),
    );
    expect(frequencies).toEqual(new Set([50, 60]));
  });

  for (const pair of PAIRS) {
    it(`${pair.network} × ${pair.case}: ${pair.what}`, { timeout: 120_000 }, () => {
      const guard = NETWORKS[pair.network];
      const stressCase = CASES[pair.case];
      const spice = spiceFigures(guard, stressCase, 1, pair.spice ?? {});
      const engine = solveStress(guard, stressCase, CONDITIONS);
      const failures: string[] = [];
      close('source peak current', engine.sourcePeakCurrent, spice.sourcePeakCurrent, 0, failures);
      const steady = stressCase.kind === 'ac' || stressCase.kind === 'dc';
      const maxPeakPower = Math.max(...engine.elements.map((e) => e.peakPower ?? 0));
      const maxEnergy = Math.max(
        ...engine.elements.map((e) => (steady ? e.averagePower! : e.pulseEnergy!)),
      );
      for (const el of engine.elements) {
        const s = spice.elements[el.elementId];
        close(
          `${el.elementId} peak current`,
          el.peakCurrent,
          s.peakCurrent,
          1e-4 * engine.sourcePeakCurrent,
          failures,
        );
        if (el.kind === 'capacitor') {
          // An ideal capacitor dissipates nothing (its net energy is ~0 in both): it is rated,
          // and compared, on its peak voltage; its instantaneous (reactive) power is not a stress.
          close(`${el.elementId} peak voltage`, el.peakVoltage, s.peakVoltage, 0, failures);
          continue;
        }
        close(
          `${el.elementId} peak power`,
          el.peakPower!,
          s.peakPower,
          1e-4 * maxPeakPower,
          failures,
        );
        if (steady)
          close(
            `${el.elementId} average power`,
            el.averagePower!,
            s.average,
            1e-4 * maxEnergy,
            failures,
          );
        else
          close(
            `${el.elementId} pulse energy`,
            el.pulseEnergy!,
            s.energy,
            1e-4 * maxEnergy,
            failures,
          );
      }
      close(
        'input peak voltage',
        engine.input.peakVoltage,
        Math.max(Math.abs(spice.inputMaxV), Math.abs(spice.inputMinV)),
        0,
        failures,
      );
      expect(failures, failures.join('\n')).toEqual([]);
    });
  }
});
