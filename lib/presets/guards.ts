/**
 * Generic guard presets: common input types and protection terminal blocks with TYPICAL
 * figures, in SI units, in the Guard format of lib/stress/types.ts. They carry no
 * manufacturer's name and are not any particular part: every figure must be checked against
 * the datasheet of the part actually fitted. Pure data and helpers; no I/O.
 */
import type { Guard, GuardStage } from '@/lib/stress/types';

/** Shown beside every preset, in the UI and in reports. */
export const TYPICAL_CAUTION = "typical — verify against the actual part's datasheet" as const;

export interface GuardPreset {
  key: string;
  name: string;
  description: string;
  caution: typeof TYPICAL_CAUTION;
  guard: Guard;
}

/** A protection terminal block: stages placed on the field side of an input's own guard. */
export interface TerminalBlockPreset {
  key: string;
  name: string;
  description: string;
  caution: typeof TYPICAL_CAUTION;
  stages: GuardStage[];
}

// ------------------------------------------------------------------ typical parts
// Figures are typical of widely made generic parts, from memory unless a source is named;
// the caution above applies to every one.

/** 600 W (10/1000 µs) TVS, 33 V stand-off: VBR 36.7 V min, VC 53.3 V at 11.3 A (JEDEC-style family, from memory). */
const tvs600W33V = (id: string, bidirectional: boolean) =>
  ({
    kind: 'tvs',
    id,
    bidirectional,
    standoffVoltage: 33,
    breakdownVoltage: 36.7,
    clampVoltage: 53.3,
    peakPulseCurrent: 11.3,
    peakPulsePower: 600,
  }) as const;

/** Small-signal steering pair to the rails: ~1 V at 50 mA, 4 A for 1 µs (from memory). */
const smallSignalRailDiodes = (id: string) =>
  ({
    kind: 'railDiodes',
    id,
    forwardVoltage: 1.0,
    forwardCurrent: 0.05,
    averageCurrent: 0.2,
    surgeCurrent: 4,
    surgeDuration: 1e-6,
  }) as const;

// ------------------------------------------------------------------ input presets

/** 1.5 kW (10/1000 µs) unidirectional TVS, 33.3 V stand-off: VBR 37.1 V min, VC 53.9 V at 27.8 A (from memory). */
const tvs1500W33V = (id: string) =>
  ({
    kind: 'tvs',
    id,
    bidirectional: false,
    standoffVoltage: 33.3,
    breakdownVoltage: 37.1,
    clampVoltage: 53.9,
    peakPulseCurrent: 27.8,
    peakPulsePower: 1500,
  }) as const;

/**
 * 24 V DC sinking (current-sinking, "positive logic") digital input: a TVS right at the
 * terminal, then the series resistor and a small filter capacitor into an optocoupler
 * branch. At 24 V the branch draws about 24 V / 4.4 kΩ ≈ 5.5 mA, inside the 2–15 mA ON band
 * of an IEC 61131-2 type 1 input.
 */
export const DIGITAL_24V_SINKING: GuardPreset = {
  key: 'di-24v-sinking',
  name: '24 V DC sinking digital input',
  description:
    '1.5 kW 33 V unidirectional TVS at the terminal; series 2k2 0.5 W resistor and 10 nF to 0 V, into an optocoupler input branch (≈ 2k2 equivalent).',
  caution: TYPICAL_CAUTION,
  guard: {
    stages: [
      { series: { kind: 'wire', id: 'W1', resistance: 0.05 }, shunts: [tvs1500W33V('D1')] },
      {
        // 0207-size film resistor; single-pulse energy of the order of 0.1 J (from memory).
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: 2200,
          ratedPower: 0.5,
          limitingVoltage: 350,
          pulseEnergy: 0.1,
        },
        shunts: [{ kind: 'capacitor', id: 'C1', capacitance: 10e-9, voltageRating: 100 }],
      },
    ],
    input: {
      positiveRail: 30,
      negativeRail: 0,
      // LED reverse voltage of a typical optocoupler input (from memory): 5 V below 0 V.
      absMaxBeyondRail: 5,
      absMaxCurrent: 0.05,
      inputResistance: 2200,
      internalClamps: false,
    },
  },
};

/**
 * 4–20 mA analog input with its 250 Ω burden (20 mA × 250 Ω = 5 V full scale): PTC and
 * bidirectional TVS at the terminal, then a series resistor and steering diodes to the
 * converter's rails.
 */
export const CURRENT_LOOP_4_20_BURDEN: GuardPreset = {
  key: 'ai-4-20-burden',
  name: '4–20 mA input with 250 Ω burden',
  description:
    'PTC 10 Ω (hold 50 mA) and 33 V bidirectional TVS; then 100 Ω, steering diodes to +10 V / 0 V and the 250 Ω 0.6 W burden.',
  caution: TYPICAL_CAUTION,
  guard: {
    stages: [
      {
        series: {
          kind: 'ptc',
          id: 'F1',
          resistance: 10,
          holdCurrent: 0.05,
          tripCurrent: 0.1,
          maxVoltage: 60,
          maxCurrent: 10,
        },
        shunts: [tvs600W33V('D1', true)],
      },
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: 100,
          ratedPower: 0.25,
          limitingVoltage: 200,
        },
        shunts: [
          smallSignalRailDiodes('D2'),
          {
            kind: 'shuntResistor',
            id: 'RB',
            resistance: 250,
            ratedPower: 0.6,
            limitingVoltage: 350,
          },
        ],
      },
    ],
    input: {
      positiveRail: 10,
      negativeRail: 0,
      absMaxBeyondRail: 0.3,
      absMaxCurrent: 0.01,
      internalClamps: true,
      // A lightly loaded analog rail: how much injected current it can absorb (assumed).
      positiveRailMinLoad: 0.005,
    },
  },
};

/** 0–10 V analog voltage input: divider-style high impedance input behind a resistor and clamps. */
export const VOLTAGE_0_10: GuardPreset = {
  key: 'ai-0-10v',
  name: '0–10 V analog voltage input',
  description:
    '10 kΩ 0.25 W series resistor, 100 nF and steering diodes to +12 V / −12 V, 100 kΩ input.',
  caution: TYPICAL_CAUTION,
  guard: {
    stages: [
      {
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: 10e3,
          ratedPower: 0.25,
          limitingVoltage: 200,
        },
        shunts: [
          smallSignalRailDiodes('D1'),
          { kind: 'capacitor', id: 'C1', capacitance: 100e-9, voltageRating: 50 },
        ],
      },
    ],
    input: {
      positiveRail: 12,
      negativeRail: -12,
      absMaxBeyondRail: 0.3,
      absMaxCurrent: 0.01,
      inputResistance: 100e3,
      internalClamps: true,
      positiveRailMinLoad: 0.01,
      negativeRailMinLoad: 0.01,
    },
  },
};

/** Thermocouple / millivolt input: a 1 kΩ filter resistor and clamps to a ±2.5 V converter. */
export const THERMOCOUPLE_MV: GuardPreset = {
  key: 'ai-thermocouple',
  name: 'Thermocouple / mV input',
  description: '1 kΩ 0.1 W (0603-size) series resistor, 100 nF, steering diodes to ±2.5 V.',
  caution: TYPICAL_CAUTION,
  guard: {
    stages: [
      {
        // Small chip resistor: its limiting element voltage (≈ 75 V for 0603, common practice) is the weak point.
        series: {
          kind: 'resistor',
          id: 'R1',
          resistance: 1000,
          ratedPower: 0.1,
          limitingVoltage: 75,
          overloadVoltage: 150,
        },
        shunts: [
          smallSignalRailDiodes('D1'),
          { kind: 'capacitor', id: 'C1', capacitance: 100e-9, voltageRating: 25 },
        ],
      },
    ],
    input: {
      positiveRail: 2.5,
      negativeRail: -2.5,
      absMaxBeyondRail: 0.3,
      absMaxCurrent: 0.01,
      internalClamps: true,
      positiveRailMinLoad: 0.002,
      negativeRailMinLoad: 0.002,
    },
  },
};

export const INPUT_PRESETS: readonly GuardPreset[] = [
  DIGITAL_24V_SINKING,
  CURRENT_LOOP_4_20_BURDEN,
  VOLTAGE_0_10,
  THERMOCOUPLE_MV,
];

// ------------------------------------------------------------------ terminal blocks

/** Fused terminal block with a 5 × 20 mm 500 mA fast-acting glass fuse. */
export const FUSED_TERMINAL: TerminalBlockPreset = {
  key: 'tb-fused-500mA',
  name: 'Fused terminal block, 500 mA fast',
  description:
    '5 × 20 mm fast-acting fuse: 500 mA, 250 V, melting I²t ≈ 0.3 A²s, cold resistance ≈ 0.3 Ω.',
  caution: TYPICAL_CAUTION,
  stages: [
    {
      series: {
        kind: 'fuse',
        id: 'TB-F1',
        ratedCurrent: 0.5,
        voltageRating: 250,
        meltingI2t: 0.3,
        resistance: 0.3,
      },
      shunts: [],
    },
  ],
};

/**
 * Surge-protective terminal block for 24 V signalling: a metal-oxide varistor from the line
 * to earth (the usual part inside such blocks). 7 mm disc class for 25 V AC / 31 V DC.
 */
export const VARISTOR_SURGE_TERMINAL: TerminalBlockPreset = {
  key: 'tb-varistor-24v',
  name: 'Varistor surge terminal block, 24 V',
  description:
    'MOV line–earth: 31 V DC continuous, 39 V at 1 mA, 77 V at 2.5 A, 250 A 8/20 µs, 1.2 J.',
  caution: TYPICAL_CAUTION,
  stages: [
    {
      series: { kind: 'wire', id: 'TB-W1', resistance: 0.01 },
      shunts: [
        {
          kind: 'varistor',
          id: 'TB-RV1',
          maxContinuousVoltage: 31,
          varistorVoltage: 39,
          clampVoltage: 77,
          clampCurrent: 2.5,
          surgeCurrent: 250,
          surgeEnergy: 1.2,
        },
      ],
    },
  ],
};

export const TERMINAL_BLOCK_PRESETS: readonly TerminalBlockPreset[] = [
  FUSED_TERMINAL,
  VARISTOR_SURGE_TERMINAL,
];

/** The guard with a terminal block's stages in front of it (field side first). */
export function withTerminalBlock(block: TerminalBlockPreset, guard: Guard): Guard {
  const ids = new Set(guard.stages.flatMap((s) => [s.series.id, ...s.shunts.map((e) => e.id)]));
  const clash = block.stages
    .flatMap((s) => [s.series.id, ...s.shunts.map((e) => e.id)])
    .find((id) => ids.has(id));
  if (clash)
    throw new Error(`Element id "${clash}" of ${block.name} is already used in the guard.`);
  return structuredClone({ stages: [...block.stages, ...guard.stages], input: guard.input });
}

/** Every preset as a full guard, for seeding a project's recipe library. */
export function presetRecipes(): Array<{
  key: string;
  name: string;
  description: string;
  guard: Guard;
}> {
  const described = (p: { description: string }) => `${p.description} (${TYPICAL_CAUTION})`;
  return [
    ...INPUT_PRESETS.map((p) => ({
      key: p.key,
      name: p.name,
      description: described(p),
      guard: structuredClone(p.guard),
    })),
    {
      key: `${FUSED_TERMINAL.key}+${DIGITAL_24V_SINKING.key}`,
      name: `${DIGITAL_24V_SINKING.name} behind a fused terminal`,
      description: `${described(FUSED_TERMINAL)} Then: ${described(DIGITAL_24V_SINKING)}`,
      guard: withTerminalBlock(FUSED_TERMINAL, DIGITAL_24V_SINKING.guard),
    },
    {
      key: `${VARISTOR_SURGE_TERMINAL.key}+${CURRENT_LOOP_4_20_BURDEN.key}`,
      name: `${CURRENT_LOOP_4_20_BURDEN.name} behind a varistor surge terminal`,
      description: `${described(VARISTOR_SURGE_TERMINAL)} Then: ${described(CURRENT_LOOP_4_20_BURDEN)}`,
      guard: withTerminalBlock(VARISTOR_SURGE_TERMINAL, CURRENT_LOOP_4_20_BURDEN.guard),
    },
  ];
}
