/**
 * Test networks (invented; part figures are typical datasheet values, not a named part).
 * Written as a user would enter them (engineering notation) and parsed by the schema, so the
 * tests also exercise the parser.
 */
import { parseGuard, parseStressCase } from '@/lib/stress';
import type { Guard, StressCase, StressConditions } from '@/lib/stress';

const input24 = { positiveRail: '24V', negativeRail: 0, absMaxBeyondRail: '0.3V' };

export const NETWORKS: Record<string, Guard> = {
  /** 10 kΩ + 12 V back-to-back zener pair: the trade's worked example. */
  zener10k: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '10k',
          ratedPower: '0.25W',
          limitingVoltage: '250V',
        },
        shunts: [
          {
            kind: 'zener',
            id: 'D1',
            bidirectional: true,
            zenerVoltage: '12V',
            testCurrent: '5mA',
            dynamicImpedance: '9',
            powerRating: '0.5W',
          },
        ],
      },
    ],
    input: { ...input24, inputResistance: '1M' },
  }),
  /** Two stages: 100 Ω + unidirectional 26 V TVS, then 1 kΩ + rail diodes; IC input with clamps. */
  tvsRail2: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '100',
          ratedPower: '0.5W',
          limitingVoltage: '350V',
          overloadVoltage: '700V',
        },
        shunts: [
          {
            kind: 'tvs',
            id: 'TV1',
            bidirectional: false,
            standoffVoltage: '26V',
            breakdownVoltage: '28.9V',
            clampVoltage: '42.1V',
            peakPulseCurrent: '14.3A',
            peakPulsePower: '600W',
          },
        ],
      },
      {
        series: {
          kind: 'resistor',
          id: 'R2',
          resistance: '1k',
          ratedPower: '0.125W',
          limitingVoltage: '150V',
          overloadVoltage: '300V',
        },
        shunts: [
          {
            kind: 'railDiodes',
            id: 'D2',
            forwardVoltage: '1V',
            forwardCurrent: '10mA',
            averageCurrent: '150mA',
            surgeCurrent: '1A',
          },
        ],
      },
    ],
    input: {
      ...input24,
      inputResistance: '5k',
      internalClamps: true,
      absMaxCurrent: '10mA',
      positiveRailMinLoad: '20mA',
    },
  }),
  /** Nothing but a series resistor in front of a resistive input: no clamp at all. */
  noClamp: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '4k7',
          ratedPower: '0.25W',
          limitingVoltage: '200V',
          overloadVoltage: '400V',
        },
        shunts: [],
      },
    ],
    input: { ...input24, inputResistance: '10k' },
  }),
  /** A 0603 100 Ω chip resistor in front of a 1 W 5.1 V zener: the resistor cannot take mains. */
  resistorFails: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '100',
          ratedPower: '0.1W',
          limitingVoltage: '75V',
          overloadVoltage: '150V',
        },
        shunts: [
          {
            kind: 'zener',
            id: 'Z1',
            bidirectional: false,
            zenerVoltage: '5.1V',
            testCurrent: '49mA',
            dynamicImpedance: '7',
            powerRating: '1W',
          },
        ],
      },
    ],
    input: {
      positiveRail: '5V',
      negativeRail: 0,
      absMaxBeyondRail: '0.3V',
      inputResistance: '100k',
    },
  }),
  /** Two-stage zener pair ladder. */
  zenerPair2: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '2k2',
          ratedPower: '1W',
          limitingVoltage: '500V',
        },
        shunts: [
          {
            kind: 'zener',
            id: 'Z1',
            bidirectional: true,
            zenerVoltage: '15V',
            testCurrent: '17mA',
            dynamicImpedance: '14',
            powerRating: '1W',
          },
        ],
      },
      {
        series: {
          kind: 'resistor',
          id: 'R2',
          resistance: '1k',
          ratedPower: '0.25W',
          limitingVoltage: '200V',
        },
        shunts: [
          {
            kind: 'zener',
            id: 'Z2',
            bidirectional: false,
            zenerVoltage: '5.1V',
            testCurrent: '5mA',
            dynamicImpedance: '60',
            powerRating: '0.3W',
          },
        ],
      },
    ],
    input: {
      positiveRail: '5V',
      negativeRail: 0,
      absMaxBeyondRail: '0.3V',
      inputResistance: '47k',
      internalClamps: true,
    },
  }),
  /** Bidirectional 24 V TVS behind 22 Ω. */
  tvsBi: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '22',
          ratedPower: '1W',
          limitingVoltage: '500V',
          overloadVoltage: '1000V',
        },
        shunts: [
          {
            kind: 'tvs',
            id: 'TV1',
            bidirectional: true,
            standoffVoltage: '24V',
            breakdownVoltage: '26.7V',
            clampVoltage: '38.9V',
            peakPulseCurrent: '15.4A',
            peakPulsePower: '600W',
          },
        ],
      },
    ],
    input: { ...input24, inputResistance: '3k' },
  }),
  /** Surge terminal: varistor behind a fuse and 10 Ω, then the input. */
  varistorTerminal: parseGuard({
    stages: [
      {
        series: {
          kind: 'fuse',
          id: 'F1',
          ratedCurrent: '100mA',
          voltageRating: '250V',
          meltingI2t: '0.02',
          resistance: '1.5',
        },
        shunts: [
          {
            kind: 'varistor',
            id: 'RV1',
            maxContinuousVoltage: '30V',
            varistorVoltage: '47V',
            clampVoltage: '93V',
            clampCurrent: '5A',
            surgeCurrent: '500A',
            surgeEnergy: '2J',
          },
        ],
      },
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '10',
          ratedPower: '0.5W',
          limitingVoltage: '350V',
        },
        shunts: [],
      },
    ],
    input: { ...input24, inputResistance: '2k7' },
  }),
  /** With a filter capacitor: 1 kΩ, 100 nF, 15 V zener, then the input. */
  filterCap: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '1k',
          ratedPower: '0.5W',
          limitingVoltage: '350V',
          overloadVoltage: '700V',
        },
        shunts: [
          { kind: 'capacitor', id: 'C1', capacitance: '100n', voltageRating: '50V' },
          {
            kind: 'zener',
            id: 'Z1',
            bidirectional: false,
            zenerVoltage: '15V',
            testCurrent: '17mA',
            dynamicImpedance: '14',
            powerRating: '1W',
          },
        ],
      },
    ],
    input: { ...input24, inputResistance: '10k' },
  }),
  /** A slow filter: 47 kΩ into 1 µF (τ ≈ 47 ms, several mains periods), then a 5.1 V zener. */
  slowFilter: parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '47k',
          ratedPower: '0.5W',
          limitingVoltage: '350V',
        },
        shunts: [
          { kind: 'capacitor', id: 'C1', capacitance: '1u', voltageRating: '16V' },
          {
            kind: 'zener',
            id: 'Z1',
            bidirectional: false,
            zenerVoltage: '5.1V',
            testCurrent: '5mA',
            dynamicImpedance: '60',
            powerRating: '0.3W',
          },
        ],
      },
    ],
    input: {
      positiveRail: '5V',
      negativeRail: 0,
      absMaxBeyondRail: '0.3V',
      inputResistance: '100k',
    },
  }),
  /** ESD capacitor at the terminal, 47 Ω, rail diodes to a 5 V rail with little load. */
  esdCapRail: parseGuard({
    stages: [
      {
        series: { kind: 'wire', id: 'W1', resistance: '0.2' },
        shunts: [{ kind: 'capacitor', id: 'C1', capacitance: '4n7', voltageRating: '100V' }],
      },
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '47',
          ratedPower: '0.1W',
          limitingVoltage: '75V',
          overloadVoltage: '150V',
        },
        shunts: [
          {
            kind: 'railDiodes',
            id: 'D1',
            forwardVoltage: '1V',
            forwardCurrent: '10mA',
            averageCurrent: '200mA',
            surgeCurrent: '2A',
          },
        ],
      },
    ],
    input: {
      positiveRail: '5V',
      negativeRail: 0,
      absMaxBeyondRail: '0.3V',
      internalClamps: true,
      absMaxCurrent: '5mA',
      positiveRailMinLoad: '2mA',
    },
  }),
  /** 4–20 mA input: PTC, 33 V TVS, 250 Ω burden as the input resistance. */
  loop420: parseGuard({
    stages: [
      {
        series: {
          kind: 'ptc',
          id: 'PTC1',
          resistance: '10',
          holdCurrent: '50mA',
          tripCurrent: '100mA',
          maxVoltage: '60V',
          maxCurrent: '10A',
        },
        shunts: [
          {
            kind: 'tvs',
            id: 'TV1',
            bidirectional: true,
            standoffVoltage: '33V',
            breakdownVoltage: '36.7V',
            clampVoltage: '53.3V',
            peakPulseCurrent: '11.3A',
          },
        ],
      },
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '47',
          ratedPower: '0.25W',
          limitingVoltage: '200V',
        },
        shunts: [
          {
            kind: 'shuntResistor',
            id: 'RB',
            resistance: '250',
            ratedPower: '0.25W',
            limitingVoltage: '200V',
          },
        ],
      },
    ],
    input: { ...input24, inputResistance: '1M', internalClamps: true },
  }),
  /** Only a wire link: nothing limits the current into the input's clamps. */
  wireOnly: parseGuard({
    stages: [{ series: { kind: 'wire', id: 'W1', resistance: '0.05' }, shunts: [] }],
    input: { ...input24, internalClamps: true, absMaxCurrent: '10mA' },
  }),
  /** No guard at all. */
  none: parseGuard({ stages: [], input: { ...input24, internalClamps: true } }),
};

export const CASES: Record<string, StressCase> = {
  dc24: parseStressCase({ kind: 'dc', voltage: '28.8V', sourceResistance: '0.1' }),
  dc48: parseStressCase({ kind: 'dc', voltage: '-48V', sourceResistance: '0.5' }),
  // IEC 60038: 230 V +10 % = 253 V rms; source impedance 0.5 Ω (a stiff supply)
  ac230: parseStressCase({
    kind: 'ac',
    rmsVoltage: '253V',
    frequency: '50Hz',
    sourceResistance: '0.5',
  }),
  // 120 V nominal at ANSI C84.1 Range A maximum 126 V (memory ⚠)
  ac120: parseStressCase({
    kind: 'ac',
    rmsVoltage: '126V',
    frequency: '60Hz',
    sourceResistance: '0.5',
  }),
  ac24: parseStressCase({
    kind: 'ac',
    rmsVoltage: '26.4V',
    frequency: '60Hz',
    sourceResistance: '1',
  }),
  surge1k: parseStressCase({ kind: 'surge', peakVoltage: '1kV', couplingResistance: '40' }),
  surge2k: parseStressCase({ kind: 'surge', peakVoltage: '-2kV', couplingResistance: '10' }),
  esd4k: parseStressCase({ kind: 'esd', voltage: '4kV' }),
  esd8k: parseStressCase({ kind: 'esd', voltage: '-8kV' }),
};

export const CONDITIONS: StressConditions = {
  ambientC: 40,
  powerDerating: 0.5,
  voltageDerating: 0.8,
};

/** One 1 kΩ, 0.25 W, 200 V resistor and nothing else: the rating checks on their own. */
export function lone1kResistor(): Guard {
  return parseGuard({
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: '1k',
          ratedPower: '0.25W',
          limitingVoltage: '200V',
        },
        shunts: [],
      },
    ],
    input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3, inputResistance: '1m' },
  });
}
