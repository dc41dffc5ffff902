/**
 * solveStress: one guard, one stress case → per-element stresses, checks and verdicts.
 */
import { formatEng } from '../units';
import { compileGuard, type CompiledNetwork, type ElementInfo } from './network';
import {
  check,
  note,
  resistorTemperatureFactor,
  semiconductorTemperatureFactor,
  tvsPulseFactor,
  varistorPulseFactor,
  varistorTemperatureFactor,
  worstIndex,
} from './ratings';
import { simulate, type Simulation, type SimulationOptions, type TraceSample } from './simulate';
import type {
  ElementStress,
  Guard,
  RailInjection,
  RatingCheck,
  StressCase,
  StressConditions,
  StressResult,
  Verdict,
} from './types';
import { VERDICT_SEVERITY } from './types';

export interface SolveOptions {
  /** Include voltage and current waveforms over the case (for plots). */
  waveform?: boolean;
  maxWaveformPoints?: number;
  /** Debug: every sample's node voltages and branch currents (Kirchhoff checks in tests). */
  trace?: boolean;
  /** Tests: integrate pulses in time even where a static shortcut applies. */
  forceTimeStepping?: boolean;
  acQuarterSamples?: number;
}

export interface StressResultWithTrace extends StressResult {
  trace?: { network: CompiledNetwork; samples: TraceSample[] };
}

/** Currents and powers this small count as "not conducting" when a rating is missing. */
const NEGLIGIBLE_CURRENT = 1e-6;
const NEGLIGIBLE_POWER = 1e-3;
/** Clamp current limit when the datasheet gives none (REFERENCE.md: common practice). */
export const DEFAULT_INPUT_CLAMP_CURRENT = 10e-3;
/** IEC 60127-2 style: a miniature fuse is not required to open below 1.5 × rating, and opens within 30 min at 2.1 × (memory ⚠). */
export const FUSE_SURE_OPEN_FACTOR = 2.1;

/**
 * Melting I²t gives the opening time only for short times (adiabatic heating; datasheets
 * state it below about 10 ms: common practice, no source). Beyond, the fault is taken to persist.
 */
export const FUSE_CREDIT_TIME = 10e-3;

/**
 * The first fuse to open on a DC fault, and when (melting I²t / I², the current being on from
 * the first instant), if within the credit time. An AC fault is not credited: how fast the fuse
 * opens and what the other parts see before it does depend on the phase at which the fault
 * starts, so they are judged as if it persisted (conservative).
 */
function fuseOpening(
  net: CompiledNetwork,
  sim: Simulation,
  sourceVoltage: number,
  stressCase: StressCase,
): { id: string; time: number } | null {
  if (stressCase.kind !== 'dc') return null;
  let best: { id: string; time: number } | null = null;
  net.elements.forEach((info, index) => {
    const el = info.element;
    if (!el || el.kind !== 'fuse' || el.meltingI2t === undefined) return;
    const f = figuresOf(sim, net, index, sourceVoltage);
    if (!(f.rmsI >= FUSE_SURE_OPEN_FACTOR * el.ratedCurrent)) return;
    // interrupting beyond its voltage rating is not credited (the fuse itself fails its check)
    if (el.voltageRating === undefined || sourceVoltage > el.voltageRating) return;
    const time = el.meltingI2t / (f.rmsI * f.rmsI);
    if (time <= FUSE_CREDIT_TIME && (best === null || time < best.time))
      best = { id: info.id, time };
  });
  return best;
}

/** DC figures turned into a pulse of the given length: same peaks, energy = power × time. */
function asPulse(f: ElementFigures, time: number): ElementFigures {
  const energy = f.average * time;
  return {
    ...f,
    steady: false,
    energy,
    i2t: f.rmsI * f.rmsI * time,
    halfValueTime: f.peakP > 0 ? (Math.LN2 * energy) / f.peakP : 0,
  };
}

interface ElementFigures {
  steady: boolean;
  peakV: number;
  peakI: number;
  peakP: number;
  average: number; // average power (steady)
  energy: number; // pulse energy
  rmsV: number;
  rmsI: number;
  i2t: number;
  /** Half-value-equivalent duration of the power pulse: ln 2 · E / P_peak. */
  halfValueTime: number;
  /** Per-diode average (steady) and peak current, for rail diodes. */
  diodeAverage: number;
  diodePeak: number;
  sourceVoltage: number; // rms (AC) or |V| (DC) or peak (pulses) of the applied hazard
}

function figuresOf(
  sim: Simulation,
  net: CompiledNetwork,
  index: number,
  sourceVoltage: number,
): ElementFigures {
  const d = sim.duration > 0 ? sim.duration : 1;
  const energy = sim.energy[index];
  const peakP = sim.peakP[index];
  let diodeAverage = 0;
  let diodePeak = 0;
  for (let b = 0; b < net.branchType.length; b++) {
    if (net.branchElement[b] !== index) continue;
    diodeAverage = Math.max(diodeAverage, sim.branchSumAbsI[b] / d);
    diodePeak = Math.max(diodePeak, sim.branchPeakI[b]);
  }
  return {
    steady: sim.steady,
    peakV: sim.peakV[index],
    peakI: sim.peakI[index],
    peakP,
    average: energy / d,
    energy,
    rmsV: Math.sqrt(Math.max(sim.sumV2[index], 0) / d),
    rmsI: Math.sqrt(Math.max(sim.sumI2[index], 0) / d),
    i2t: sim.sumI2[index],
    halfValueTime: peakP > 0 ? (Math.LN2 * energy) / peakP : 0,
    diodeAverage,
    diodePeak,
    sourceVoltage,
  };
}

const W = (x: number) => formatEng(x, 'W');
const V = (x: number) => formatEng(x, 'V');
const A = (x: number) => formatEng(x, 'A');
const J = (x: number) => formatEng(x, 'J');
const S = (x: number) => formatEng(x, 's');

function resistorChecks(
  id: string,
  el: {
    ratedPower?: number;
    limitingVoltage?: number;
    overloadVoltage?: number;
    pulseEnergy?: number;
  },
  f: ElementFigures,
  c: StressConditions,
): RatingCheck[] {
  const tf = resistorTemperatureFactor(c.ambientC);
  const out: RatingCheck[] = [];
  if (f.steady) {
    const power = check({
      quantity: 'power',
      value: f.average,
      rating: el.ratedPower,
      temperatureFactor: tf,
      margin: c.powerDerating,
      label: `${id}: ${W(f.peakP)} peak /`,
      suffix: 'average',
      unit: 'W',
      missing: 'rated power not given',
    });
    out.push(power);
    out.push(
      check({
        quantity: 'voltage',
        value: f.rmsV,
        rating: el.limitingVoltage,
        temperatureFactor: 1,
        margin: c.voltageDerating,
        label: `${id}: ${f.peakV !== f.rmsV ? 'rms ' : ''}voltage`,
        unit: 'V',
        missing: 'limiting element voltage not given',
      }),
    );
  } else {
    if (el.overloadVoltage !== undefined) {
      out.push(
        check({
          quantity: 'voltage',
          value: f.peakV,
          rating: el.overloadVoltage,
          temperatureFactor: 1,
          margin: c.voltageDerating,
          label: `${id}: pulse voltage`,
          unit: 'V',
        }),
      );
    } else if (
      el.limitingVoltage !== undefined &&
      f.peakV <= el.limitingVoltage * c.voltageDerating
    ) {
      out.push(
        check({
          quantity: 'voltage',
          value: f.peakV,
          rating: el.limitingVoltage,
          temperatureFactor: 1,
          margin: c.voltageDerating,
          label: `${id}: pulse voltage`,
          unit: 'V',
        }),
      );
    } else {
      out.push(
        note(
          'voltage',
          f.peakV,
          'incomplete',
          `${id}: ${V(f.peakV)} pulse voltage${el.limitingVoltage !== undefined ? ` exceeds the ${V(el.limitingVoltage)} limiting element voltage (derated ${V(el.limitingVoltage * c.voltageDerating)})` : ''}; maximum overload voltage not given`,
        ),
      );
    }
    if (el.pulseEnergy !== undefined) {
      out.push(
        check({
          quantity: 'energy',
          value: f.energy,
          rating: el.pulseEnergy,
          temperatureFactor: 1,
          margin: c.powerDerating,
          label: `${id}: pulse energy`,
          unit: 'J',
        }),
      );
    } else if (el.ratedPower !== undefined && f.peakP <= el.ratedPower * tf * c.powerDerating) {
      // A resistor that may dissipate P continuously survives a pulse whose peak power is below P.
      out.push(
        note(
          'energy',
          f.energy,
          'holds',
          `${id}: ${J(f.energy)} pulse at ${W(f.peakP)} peak, within its continuous rating`,
          el.ratedPower,
        ),
      );
    } else {
      out.push(
        note(
          'energy',
          f.energy,
          'incomplete',
          `${id}: ${J(f.energy)} pulse (${W(f.peakP)} peak, ${S(f.halfValueTime)} half-value); single-pulse energy rating not given`,
        ),
      );
    }
  }
  return out;
}

function elementChecks(
  info: ElementInfo,
  f: ElementFigures,
  c: StressConditions,
  caseKind: StressCase['kind'],
): RatingCheck[] {
  const el = info.element!;
  const id = info.id;
  const st = semiconductorTemperatureFactor(c.ambientC);
  switch (el.kind) {
    case 'resistor':
    case 'shuntResistor':
      return resistorChecks(id, el, f, c);
    case 'wire':
      return [
        note(
          'current',
          f.peakI,
          'holds',
          `${id}: ${A(f.peakI)} peak; wiring has no rating to check here`,
        ),
      ];
    case 'fuse': {
      if (f.steady) {
        const opens = f.rmsI >= FUSE_SURE_OPEN_FACTOR * el.ratedCurrent;
        if (!opens) {
          return [
            note(
              'current',
              f.rmsI,
              'holds',
              `${id}: ${A(f.rmsI)} rms does not open the ${A(el.ratedCurrent)} fuse (sure to open only above ${FUSE_SURE_OPEN_FACTOR} × rating); the rest of the network must withstand the fault continuously`,
              el.ratedCurrent,
            ),
          ];
        }
        const time = el.meltingI2t !== undefined ? el.meltingI2t / (f.rmsI * f.rmsI) : null;
        const when =
          time !== null
            ? `in about ${S(time)} (melting I²t ${formatEng(el.meltingI2t!, 'A²s')})`
            : '(opening time unknown: melting I²t not given)';
        const checks: RatingCheck[] = [
          note(
            'current',
            f.rmsI,
            'holds',
            `${id}: ${A(f.rmsI)} rms opens the ${A(el.ratedCurrent)} fuse ${when}; ${
              time !== null && time <= FUSE_CREDIT_TIME && caseKind === 'dc'
                ? 'the rest of the network is judged for that time'
                : `the rest of the network is judged as if the fault persisted (${
                    caseKind === 'ac'
                      ? 'on AC the time depends on the phase the fault starts at'
                      : time !== null
                        ? `beyond ${S(FUSE_CREDIT_TIME)} the melting I²t does not give the opening time`
                        : 'conservative'
                  })`
            }`,
            el.ratedCurrent,
          ),
        ];
        checks.push(
          check({
            quantity: 'voltage',
            value: f.sourceVoltage,
            rating: el.voltageRating,
            temperatureFactor: 1,
            margin: 1,
            label: `${id}: interrupts`,
            unit: 'V',
            missing: 'voltage rating not given: cannot tell whether it interrupts safely',
          }),
        );
        return checks;
      }
      if (el.meltingI2t === undefined) {
        return [
          note(
            'i2t',
            f.i2t,
            'incomplete',
            `${id}: pulse I²t ${formatEng(f.i2t, 'A²s')}; melting I²t not given`,
          ),
        ];
      }
      if (f.i2t >= el.meltingI2t) {
        return [
          note(
            'i2t',
            f.i2t,
            'marginal',
            `${id}: pulse I²t ${formatEng(f.i2t, 'A²s')} reaches the ${formatEng(el.meltingI2t, 'A²s')} melting I²t: the fuse opens (channel protected, fuse to be replaced)`,
            el.meltingI2t,
          ),
        ];
      }
      return [
        check({
          quantity: 'i2t',
          value: f.i2t,
          rating: el.meltingI2t,
          temperatureFactor: 1,
          margin: 1,
          label: `${id}: pulse I²t`,
          unit: 'A²s',
        }),
      ];
    }
    case 'ptc': {
      if (!f.steady) {
        if (el.maxVoltage === undefined)
          return [
            note(
              'voltage',
              f.peakV,
              'holds',
              `${id}: ${V(f.peakV)} across during the pulse (too short to trip)`,
            ),
          ];
        return [
          check({
            quantity: 'voltage',
            value: f.peakV,
            rating: el.maxVoltage,
            temperatureFactor: 1,
            margin: c.voltageDerating,
            label: `${id}: pulse voltage`,
            unit: 'V',
          }),
        ];
      }
      if (f.rmsI < el.holdCurrent) {
        return [
          note(
            'current',
            f.rmsI,
            'holds',
            `${id}: ${A(f.rmsI)} rms is below its ${A(el.holdCurrent)} hold current: it does not trip; the rest of the network must withstand the fault continuously`,
            el.holdCurrent,
          ),
        ];
      }
      if (f.rmsI < el.tripCurrent) {
        return [
          note(
            'current',
            f.rmsI,
            'holds',
            `${id}: ${A(f.rmsI)} rms lies between hold ${A(el.holdCurrent)} and trip ${A(el.tripCurrent)}: it may not trip; the rest of the network must withstand the fault continuously`,
            el.tripCurrent,
          ),
        ];
      }
      const out: RatingCheck[] = [
        check({
          quantity: 'voltage',
          value: f.sourceVoltage,
          rating: el.maxVoltage,
          temperatureFactor: 1,
          margin: 1,
          label: `${id}: trips (${A(f.rmsI)} rms ≥ ${A(el.tripCurrent)}) and then holds off`,
          unit: 'V',
          missing: 'maximum voltage not given',
        }),
      ];
      if (el.maxCurrent !== undefined) {
        out.push(
          check({
            quantity: 'current',
            value: f.peakI,
            rating: el.maxCurrent,
            temperatureFactor: 1,
            margin: 1,
            label: `${id}: fault current`,
            unit: 'A',
          }),
        );
      }
      return out;
    }
    case 'railDiodes': {
      if (f.steady) {
        if (el.averageCurrent === undefined && f.diodeAverage <= NEGLIGIBLE_CURRENT) {
          return [
            note(
              'current',
              f.diodeAverage,
              'holds',
              `${id}: no significant current (${A(f.diodeAverage)} average per diode)`,
            ),
          ];
        }
        return [
          check({
            quantity: 'current',
            value: f.diodeAverage,
            rating: el.averageCurrent,
            temperatureFactor: st,
            margin: c.powerDerating,
            label: `${id}: average current per diode`,
            unit: 'A',
            missing: 'average current rating not given',
          }),
        ];
      }
      if (el.surgeCurrent !== undefined) {
        // The surge rating is for a longer pulse (8.3 ms): applied unscaled to shorter pulses (conservative).
        return [
          check({
            quantity: 'surgeCurrent',
            value: f.diodePeak,
            rating: el.surgeCurrent,
            temperatureFactor: st,
            margin: c.powerDerating,
            label: `${id}: peak current per diode`,
            unit: 'A',
          }),
        ];
      }
      if (
        el.averageCurrent !== undefined &&
        f.diodePeak <= el.averageCurrent * st * c.powerDerating
      ) {
        return [
          note(
            'surgeCurrent',
            f.diodePeak,
            'holds',
            `${id}: ${A(f.diodePeak)} peak per diode, within its continuous current rating`,
            el.averageCurrent,
          ),
        ];
      }
      if (el.averageCurrent === undefined && f.diodePeak <= NEGLIGIBLE_CURRENT) {
        return [note('surgeCurrent', f.diodePeak, 'holds', `${id}: no significant current`)];
      }
      return [
        note(
          'surgeCurrent',
          f.diodePeak,
          'incomplete',
          `${id}: ${A(f.diodePeak)} peak per diode; surge current rating not given`,
        ),
      ];
    }
    case 'zener': {
      if (f.steady) {
        if (el.powerRating === undefined && f.average <= NEGLIGIBLE_POWER * 1e-3) {
          return [note('power', f.average, 'holds', `${id}: no significant dissipation`)];
        }
        const ch = check({
          quantity: 'power',
          value: f.average,
          rating: el.powerRating,
          temperatureFactor: st,
          margin: c.powerDerating,
          label: `${id}: ${W(f.peakP)} peak /`,
          suffix: 'average',
          unit: 'W',
          missing: 'power rating not given',
        });
        return [ch];
      }
      if (el.powerRating !== undefined && f.peakP <= el.powerRating * st * c.powerDerating) {
        return [
          note(
            'power',
            f.peakP,
            'holds',
            `${id}: ${W(f.peakP)} peak pulse power, within its continuous rating`,
            el.powerRating,
          ),
        ];
      }
      return [
        note(
          'pulsePower',
          f.peakP,
          'incomplete',
          `${id}: ${W(f.peakP)} peak, ${J(f.energy)} pulse; a zener pulse rating is needed to judge this`,
        ),
      ];
    }
    case 'tvs': {
      const pppm = el.peakPulsePower ?? el.clampVoltage * el.peakPulseCurrent;
      if (f.steady) {
        // Conduction in either direction (breakdown, or forward for a unidirectional part) is
        // judged on power first: a forward-biased TVS can carry a large current at 1 V.
        if (el.steadyPower !== undefined && f.average > NEGLIGIBLE_POWER) {
          return [
            check({
              quantity: 'power',
              value: f.average,
              rating: el.steadyPower,
              temperatureFactor: st,
              margin: c.powerDerating,
              label: `${id}: ${W(f.peakP)} peak /`,
              suffix: 'average',
              unit: 'W',
            }),
          ];
        }
        if (f.average > NEGLIGIBLE_POWER) {
          return [
            note(
              'power',
              f.average,
              'fails',
              `${id}: conducts ${W(f.average)} average (${A(f.peakI)} peak) continuously; a TVS is not rated for a continuous fault and fails short`,
            ),
          ];
        }
        if (f.peakV <= el.standoffVoltage) {
          return [
            note(
              'voltage',
              f.peakV,
              'holds',
              `${id}: ${V(f.peakV)} peak stays below its ${V(el.standoffVoltage)} stand-off voltage`,
              el.standoffVoltage,
            ),
          ];
        }
        return [
          note(
            'voltage',
            f.peakV,
            'marginal',
            `${id}: ${V(f.peakV)} peak exceeds its ${V(el.standoffVoltage)} stand-off voltage (${W(f.average)} average)`,
            el.standoffVoltage,
          ),
        ];
      }
      const factor = tvsPulseFactor(f.halfValueTime);
      return [
        check({
          quantity: 'pulsePower',
          value: f.peakP,
          rating: pppm * factor,
          temperatureFactor: st,
          margin: c.powerDerating,
          label: `${id}: peak pulse power (${S(f.halfValueTime)} half-value, ${formatEng(pppm, 'W')} 10/1000 µs × ${factor.toPrecision(3)})`,
          unit: 'W',
        }),
      ];
    }
    case 'varistor': {
      if (f.steady) {
        const isAc = caseKind === 'ac';
        const rating = isAc
          ? el.maxContinuousVoltage
          : (el.maxContinuousDcVoltage ?? el.maxContinuousVoltage);
        return [
          check({
            quantity: 'voltage',
            value: f.rmsV,
            rating,
            temperatureFactor: 1,
            margin: c.voltageDerating,
            label: `${id}: continuous ${isAc ? 'rms ' : ''}voltage`,
            unit: 'V',
          }),
        ];
      }
      const out: RatingCheck[] = [];
      const tf = varistorTemperatureFactor(c.ambientC);
      const pf = varistorPulseFactor(f.halfValueTime);
      out.push(
        check({
          quantity: 'surgeCurrent',
          value: f.peakI,
          rating: el.surgeCurrent !== undefined ? el.surgeCurrent * pf : undefined,
          temperatureFactor: tf,
          margin: c.powerDerating,
          label: `${id}: surge current`,
          unit: 'A',
          missing: '8/20 µs surge current rating not given',
        }),
      );
      if (el.surgeEnergy !== undefined) {
        out.push(
          check({
            quantity: 'energy',
            value: f.energy,
            rating: el.surgeEnergy,
            temperatureFactor: tf,
            margin: c.powerDerating,
            label: `${id}: pulse energy`,
            unit: 'J',
          }),
        );
      }
      return out;
    }
    case 'capacitor':
      return [
        check({
          quantity: 'voltage',
          value: f.peakV,
          rating: el.voltageRating,
          temperatureFactor: 1,
          margin: c.voltageDerating,
          label: `${id}: peak voltage`,
          unit: 'V',
          missing: 'voltage rating not given',
        }),
      ];
  }
}

function combine(checks: RatingCheck[], fallback: string): { verdict: Verdict; reason: string } {
  const index = worstIndex(checks);
  if (index < 0) return { verdict: 'holds', reason: fallback };
  return { verdict: checks[index].verdict, reason: checks[index].reason ?? fallback };
}

/** The guard limits current when it has any series resistance worth the name or any clamp. */
function limitsCurrent(guard: Guard): boolean {
  let series = 0;
  for (const stage of guard.stages) {
    if (stage.series.kind !== 'fuse' && stage.series.kind !== 'wire')
      series += stage.series.resistance;
    else if (stage.series.kind === 'fuse') return true; // a fuse limits the fault's duration
    for (const shunt of stage.shunts)
      if (shunt.kind !== 'capacitor' && shunt.kind !== 'shuntResistor') return true;
  }
  return series >= 1;
}

export function solveWithNetwork(
  guard: Guard,
  net: CompiledNetwork,
  stressCase: StressCase,
  conditions: StressConditions,
  options: SolveOptions = {},
): StressResultWithTrace {
  const sign = conditions.appliedTo === 'return' ? -1 : 1;
  const simOptions: SimulationOptions = {
    waveform: options.waveform,
    maxWaveformPoints: options.maxWaveformPoints,
    trace: options.trace,
    forceTimeStepping: options.forceTimeStepping,
    acQuarterSamples: options.acQuarterSamples,
  };
  const sim = simulate(net, stressCase, sign, simOptions);
  const sourceVoltage =
    stressCase.kind === 'ac'
      ? stressCase.rmsVoltage
      : stressCase.kind === 'dc'
        ? Math.abs(stressCase.voltage)
        : sim.sourcePeakVoltage;

  const elements: ElementStress[] = [];
  // A fuse that opens on a steady fault within the melting-I²t range ends the fault for every
  // element in series with it: they are judged on a pulse of that length instead.
  const opening = sim.steady ? fuseOpening(net, sim, sourceVoltage, stressCase) : null;
  net.elements.forEach((info, index) => {
    if (info.role === 'input') return;
    let f = figuresOf(sim, net, index, sourceVoltage);
    const credited = opening !== null && info.kind !== 'fuse';
    if (credited) f = asPulse(f, opening.time);
    const checks = elementChecks(info, f, conditions, stressCase.kind);
    if (credited)
      for (const ch of checks)
        if (ch.reason) ch.reason += ` (for the ${S(opening.time)} until ${opening.id} opens)`;
    const { verdict, reason } = combine(checks, `${info.id}: no rating applies`);
    const isRailPair = info.kind === 'railDiodes';
    elements.push({
      elementId: info.id,
      kind: info.kind as ElementStress['kind'],
      stage: info.stage,
      role: info.role === 'series' ? 'series' : 'shunt',
      peakVoltage: f.peakV,
      peakCurrent: isRailPair ? f.diodePeak : f.peakI,
      // An ideal capacitor dissipates nothing: it is judged on its peak voltage.
      averagePower: sim.steady ? (info.kind === 'capacitor' ? 0 : f.average) : null,
      pulseEnergy: sim.steady ? null : info.kind === 'capacitor' ? 0 : f.energy,
      peakPower: f.peakP,
      rmsVoltage: sim.steady ? f.rmsV : null,
      rmsCurrent: sim.steady ? f.rmsI : null,
      checks,
      verdict,
      reason,
    });
  });

  // ---- protected input
  const input = guard.input;
  const upperLimit = input.positiveRail + input.absMaxBeyondRail;
  const lowerLimit = input.negativeRail - input.absMaxBeyondRail;
  const peakInputV = Math.max(Math.abs(sim.inputMaxV), Math.abs(sim.inputMinV));
  let clampPeak = 0;
  for (let b = 0; b < net.branchType.length; b++) {
    if (net.branchElement[b] === net.inputElement && net.branchRail[b] !== 0)
      clampPeak = Math.max(clampPeak, sim.branchPeakI[b]);
  }
  const beyond =
    sim.inputMaxV > upperLimit
      ? sim.inputMaxV - upperLimit
      : sim.inputMinV < lowerLimit
        ? lowerLimit - sim.inputMinV
        : 0;
  const extreme =
    sim.inputMaxV > upperLimit ||
    sim.inputMaxV - input.positiveRail >= input.negativeRail - sim.inputMinV
      ? sim.inputMaxV
      : sim.inputMinV;
  let inputVerdict: Verdict;
  let inputReason: string;
  if (input.internalClamps) {
    const limit = input.absMaxCurrent ?? DEFAULT_INPUT_CLAMP_CURRENT;
    const ch = check({
      quantity: 'current',
      value: clampPeak,
      rating: limit,
      temperatureFactor: 1,
      margin: conditions.voltageDerating,
      label: `input: clamp current (pin at ${V(extreme)})`,
      unit: 'A',
    });
    inputVerdict = ch.verdict;
    inputReason = ch.reason!;
    if (input.absMaxCurrent === undefined) inputReason += ' (10 mA assumed: common practice)';
  } else if (beyond > 0) {
    inputVerdict = 'fails';
    inputReason = `input: ${V(extreme)} is ${V(beyond)} beyond its absolute maximum (rails ${V(input.negativeRail)} … ${V(input.positiveRail)} ± ${V(input.absMaxBeyondRail)}) and it has no clamps`;
  } else if (sim.inputMaxV > input.positiveRail || sim.inputMinV < input.negativeRail) {
    inputVerdict = 'marginal';
    inputReason = `input: ${V(extreme)} lies beyond a rail but within its ${V(input.absMaxBeyondRail)} absolute maximum`;
  } else {
    inputVerdict = 'holds';
    inputReason = `input: ${V(extreme)} peak stays within its rails`;
  }
  if (input.internalClamps && beyond > 0 && inputVerdict === 'holds') {
    inputReason += `; the pin goes ${V(beyond)} beyond its absolute maximum voltage, allowed while the clamp current is limited`;
  }
  if (!limitsCurrent(guard) && VERDICT_SEVERITY[inputVerdict] >= VERDICT_SEVERITY.marginal) {
    inputVerdict = 'unprotected';
    inputReason = `${guard.stages.length === 0 ? 'no guard' : 'nothing in the guard limits current'}: the input sees the hazard (${inputReason.replace(/^input: /, '')})`;
  }

  // ---- rails
  const rails: RailInjection[] = [];
  const railChecks: { verdict: Verdict; reason: string }[] = [];
  const railDefs: ['positive' | 'negative', number, number | undefined][] = [
    ['positive', input.positiveRail, input.positiveRailMinLoad],
    ['negative', input.negativeRail, input.negativeRailMinLoad],
  ];
  railDefs.forEach(([rail, voltage, minLoad], k) => {
    const injected = sim.steady
      ? sim.railSum[k] / (sim.duration > 0 ? sim.duration : 1)
      : sim.railPeak[k];
    const name = `${rail === 'positive' ? '+' : ''}${V(voltage)} rail`;
    let pumpsUp: boolean | null;
    let verdict: Verdict;
    let reason: string;
    if (injected <= NEGLIGIBLE_CURRENT) {
      pumpsUp = minLoad !== undefined ? false : null;
      verdict = 'holds';
      reason = `${name}: no significant current injected`;
      if (minLoad === undefined) pumpsUp = false;
    } else if (minLoad === undefined) {
      if (voltage === 0) {
        pumpsUp = false;
        verdict = 'holds';
        reason = `${name}: ${A(injected)} into the common (taken to absorb it)`;
      } else {
        pumpsUp = null;
        verdict = 'incomplete';
        reason = `${name}: ${A(injected)} ${sim.steady ? 'average' : 'peak'} injected; the rail's minimum load is not given (rail pump-up cannot be judged)`;
      }
    } else if (injected > minLoad) {
      pumpsUp = true;
      verdict = sim.steady ? 'fails' : 'marginal';
      reason = `${name}: ${A(injected)} ${sim.steady ? 'average' : 'peak'} injected against ${A(minLoad)} minimum load: the rail can rise${sim.steady ? ' (add a rail clamp)' : ' during the pulse (rail capacitance not modelled)'}`;
    } else {
      pumpsUp = false;
      verdict = 'holds';
      reason = `${name}: ${A(injected)} injected, within its ${A(minLoad)} minimum load`;
    }
    rails.push({ rail, injectedCurrent: injected, minLoad: minLoad ?? null, pumpsUp });
    railChecks.push({ verdict, reason });
  });

  // ---- channel verdict: the worst of elements, input, rails (first worst wins: outermost first)
  const all: { verdict: Verdict; reason: string }[] = [
    ...elements.map((e) => ({ verdict: e.verdict, reason: e.reason })),
    { verdict: inputVerdict, reason: inputReason },
    ...railChecks,
  ];
  const worst = all[worstIndex(all)];
  const notes = [...net.notes, ...sim.notes];
  if (sign === -1)
    notes.push(
      'hazard on the return terminal: applied with reversed polarity relative to the circuit common',
    );
  if (stressCase.kind === 'surge')
    notes.push(
      'surge: open-circuit 1.2/50 µs voltage behind 2 Ω + coupling (conservative in energy into low impedance)',
    );
  if (stressCase.kind === 'esd')
    notes.push(
      "ESD: 150 pF discharged through 330 Ω (carries the full charge; the standard's sub-nanosecond first peak is not modelled)",
    );

  const result: StressResultWithTrace = {
    case: stressCase,
    verdict: worst.verdict,
    reason: worst.reason,
    sourcePeakCurrent: sim.sourcePeakCurrent,
    elements,
    input: {
      peakVoltage: peakInputV,
      peakCurrent: sim.inputPeakCurrent,
      verdict: inputVerdict,
      reason: inputReason,
    },
    rails,
    notes,
  };
  if (sim.waveform) result.waveform = sim.waveform;
  if (sim.trace) result.trace = { network: net, samples: sim.trace };
  return result;
}

export function solveStress(
  guard: Guard,
  stressCase: StressCase,
  conditions: StressConditions,
  options: SolveOptions = {},
): StressResultWithTrace {
  return solveWithNetwork(guard, compileGuard(guard), stressCase, conditions, options);
}
