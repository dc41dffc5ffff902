/**
 * The demo scenario: an invented salt maker (Vessmoor Brine Works) upgrading its evaporator
 * line, and an invented creamery's small whey skid. Every name, tag and person here is made
 * up. The schedule is built to show what Crossfault is for: mains beside sensor inputs, a
 * two-level block with 24 V over an analog input, a multicore cable carrying mains and signal
 * cores, look-alike terminal numbers and wire numbers on parallel strips, barriers on some
 * strips and not on others, jumper combs, wrong wire colours, and guards ranging from none at
 * all to a robust multi-stage network.
 */
import type { Guard } from '@/lib/stress/types';
import type { InferCreationAttributes } from 'sequelize';
import type { Project } from '@/models/Project';
import type { ProjectRole } from '@/models/enums';
import { presetRecipes } from '@/lib/presets/guards';
import {
  channelReturn,
  dcSupply,
  earth,
  heaterOutput,
  mainsLine,
  mainsNeutral,
  motorOutput,
  signal,
  spare,
  strip,
  WireNumbers,
  zeroVolt,
  type CabinetPlan,
  type ChannelPlan,
  type StripEntry,
  type Supply,
  type TerminalEntry,
} from './plan';

/** Local demo only; never used outside a developer's machine. */
export const DEMO_PASSWORD = 'crossfault-demo';

export interface DemoUser {
  email: string;
  name: string;
  isAdmin: boolean;
  /** The role this account demonstrates. */
  demoRole: 'admin' | ProjectRole;
}

export const DEMO_USERS: readonly DemoUser[] = [
  {
    email: 'tamsin.admin@vessmoor.example',
    name: 'Tamsin Greaves',
    isAdmin: true,
    demoRole: 'admin',
  },
  {
    email: 'orla.engineer@vessmoor.example',
    name: 'Orla Penhallow',
    isAdmin: false,
    demoRole: 'engineer',
  },
  {
    email: 'bram.technician@vessmoor.example',
    name: 'Bram Kettering',
    isAdmin: false,
    demoRole: 'technician',
  },
  {
    email: 'nadia.reviewer@vessmoor.example',
    name: 'Nadia Oyelaran',
    isAdmin: false,
    demoRole: 'reviewer',
  },
  {
    email: 'felix.viewer@vessmoor.example',
    name: 'Felix Armitage',
    isAdmin: false,
    demoRole: 'viewer',
  },
];

export interface RecipePlan {
  name: string;
  description: string;
  guard: Guard;
  isPreset: boolean;
}

export interface MarkupPlan {
  terminalLabel: string;
  author: string;
  kind: 'component' | 'wiring' | 'relanded' | 'barrier' | 'swapped' | 'note';
  before: unknown;
  after: unknown;
  note: string;
  decidedBy?: string;
  status: 'proposed' | 'accepted' | 'rejected';
}

export interface ProjectPlan {
  project: Omit<InferCreationAttributes<Project>, 'id' | 'version' | 'createdAt' | 'updatedAt'>;
  members: Array<{ email: string; role: ProjectRole }>;
  recipes: RecipePlan[];
  cabinets: CabinetPlan[];
  markups: MarkupPlan[];
}

// ------------------------------------------------------------------ guard recipes

export const RECIPE = {
  diPreset: '24 V DC sinking digital input',
  aiPreset: '4–20 mA input with 250 Ω burden',
  tcPreset: 'Thermocouple / mV input',
  diFused: '24 V DC sinking digital input behind a fused terminal',
  aiVaristor: '4–20 mA input with 250 Ω burden behind a varistor surge terminal',
  robust: 'Field-hardened 4–20 mA, multi-stage',
  bareAi: 'Card input, burden only',
  chipDi: 'Economy DI, 0805 chip resistor',
  rtd: 'Pt100 input, 3-wire',
  unrated: 'Flow computer pulse input (ratings not yet entered)',
} as const;

function presetLibrary(): RecipePlan[] {
  return presetRecipes().map((p) => ({
    name: p.name,
    description: p.description,
    guard: p.guard,
    isPreset: true,
  }));
}

/** Our own designs for the evaporator project (figures typical, from memory). */
const CUSTOM_RECIPES: RecipePlan[] = [
  {
    name: RECIPE.robust,
    description:
      'Stage 1: 600 V PTC and 5 kW bidirectional TVS; stage 2: 200 Ω 2 W pulse-rated resistor and a 250 Ω 5 W burden; stage 3: 10 kΩ and steering diodes to the converter.',
    isPreset: false,
    guard: {
      stages: [
        {
          series: {
            kind: 'ptc',
            id: 'F1',
            resistance: 10,
            holdCurrent: 0.15,
            tripCurrent: 0.3,
            maxVoltage: 600,
            maxCurrent: 3,
          },
          shunts: [
            {
              kind: 'tvs',
              id: 'D1',
              bidirectional: true,
              standoffVoltage: 33,
              breakdownVoltage: 36.7,
              clampVoltage: 53.3,
              peakPulseCurrent: 94,
              peakPulsePower: 5000,
            },
          ],
        },
        {
          series: {
            kind: 'resistor',
            id: 'R1',
            resistance: 200,
            ratedPower: 2,
            limitingVoltage: 500,
            overloadVoltage: 1000,
            pulseEnergy: 10,
          },
          shunts: [
            {
              kind: 'shuntResistor',
              id: 'RB',
              resistance: 250,
              ratedPower: 5,
              limitingVoltage: 500,
            },
          ],
        },
        {
          series: {
            kind: 'resistor',
            id: 'R2',
            resistance: 10e3,
            ratedPower: 0.25,
            limitingVoltage: 200,
          },
          shunts: [
            {
              kind: 'railDiodes',
              id: 'D2',
              forwardVoltage: 1.0,
              forwardCurrent: 0.05,
              averageCurrent: 0.2,
              surgeCurrent: 4,
              surgeDuration: 1e-6,
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
        positiveRailMinLoad: 0.005,
      },
    },
  },
  {
    name: RECIPE.bareAi,
    description:
      'Only the card: wiring straight to a 250 Ω 0.25 W burden and the converter’s own clamps.',
    isPreset: false,
    guard: {
      stages: [
        {
          series: { kind: 'wire', id: 'W1', resistance: 0.2 },
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
      input: {
        positiveRail: 10,
        negativeRail: 0,
        absMaxBeyondRail: 0.3,
        absMaxCurrent: 0.01,
        internalClamps: true,
      },
    },
  },
  {
    name: RECIPE.chipDi,
    description:
      '4k7 0805 chip resistor (0.125 W, 150 V limiting element voltage) into the optocoupler branch; no clamp.',
    isPreset: false,
    guard: {
      stages: [
        {
          series: {
            kind: 'resistor',
            id: 'R1',
            resistance: 4700,
            ratedPower: 0.125,
            limitingVoltage: 150,
            overloadVoltage: 300,
          },
          shunts: [],
        },
      ],
      input: {
        positiveRail: 30,
        negativeRail: 0,
        absMaxBeyondRail: 5,
        absMaxCurrent: 0.05,
        inputResistance: 2200,
        internalClamps: false,
      },
    },
  },
  {
    // Entered from the drawing before the datasheet arrived: values without ratings, so the
    // audit has to say "incomplete" rather than pass it.
    name: RECIPE.unrated,
    description:
      '1 kΩ series resistor and a 27 V zener to 0 V inside the flow computer; ratings not yet known.',
    isPreset: false,
    guard: {
      stages: [
        {
          series: { kind: 'resistor', id: 'R1', resistance: 1000 },
          shunts: [
            {
              kind: 'zener',
              id: 'D1',
              bidirectional: false,
              zenerVoltage: 27,
              dynamicImpedance: 35,
            },
          ],
        },
      ],
      input: { positiveRail: 30, negativeRail: 0, absMaxBeyondRail: 0.5, inputResistance: 10e3 },
    },
  },
  {
    name: RECIPE.rtd,
    description:
      '470 Ω 0.25 W series resistor, 10 nF and steering diodes to ±5 V at the converter.',
    isPreset: false,
    guard: {
      stages: [
        {
          series: {
            kind: 'resistor',
            id: 'R1',
            resistance: 470,
            ratedPower: 0.25,
            limitingVoltage: 200,
          },
          shunts: [
            {
              kind: 'railDiodes',
              id: 'D1',
              forwardVoltage: 1.0,
              forwardCurrent: 0.05,
              averageCurrent: 0.2,
              surgeCurrent: 4,
              surgeDuration: 1e-6,
            },
            { kind: 'capacitor', id: 'C1', capacitance: 10e-9, voltageRating: 50 },
          ],
        },
      ],
      input: {
        positiveRail: 5,
        negativeRail: -5,
        absMaxBeyondRail: 0.3,
        absMaxCurrent: 0.01,
        internalClamps: true,
        positiveRailMinLoad: 0.002,
        negativeRailMinLoad: 0.002,
      },
    },
  },
];

// ------------------------------------------------------------------ Vessmoor evaporator line

const MAINS_230: Supply = { voltage: 230, frequency: 50 };

/** Planted on purpose: '1169' reads as '6911' upside down; '1041' is '1014' with two digits swapped. */
const PLANTED_WIRES = new Set(['1014', '1041', '1169', '6911']);

type AiSpec = [tag: string, name: string, recipe: string | null];

function aiPairs(
  specs: AiSpec[],
  firstNumber: number,
  channels: ChannelPlan[],
  extra: (i: number) => { sig?: Partial<TerminalEntry>; ret?: Partial<TerminalEntry> } = () => ({}),
): StripEntry[] {
  const entries: StripEntry[] = [];
  specs.forEach(([tag, name, recipe], i) => {
    const n = firstNumber + 2 * i;
    const e = extra(i);
    entries.push(signal(String(n), tag, e.sig), channelReturn(String(n + 1), tag, e.ret));
    channels.push({ tag, name, signalType: 'current-4-20', recipe });
  });
  return entries;
}

function evaporatorPanel(): CabinetPlan {
  const wires = new WireNumbers(1000, PLANTED_WIRES);
  const channels: ChannelPlan[] = [];
  const di = (tag: string, name: string, recipe: string | null, extra: Partial<ChannelPlan> = {}) =>
    channels.push({ tag, name, signalType: 'digital-24', recipe, ...extra });

  // X1: incoming 230 V distribution, and cabinet-monitoring inputs right beside it (no barrier).
  di('ZS-2101', 'Cabinet door closed', RECIPE.diPreset);
  di('TSH-2101', 'Cabinet thermostat high', RECIPE.chipDi);
  di('XA-2101', 'Surge arrester status', RECIPE.diPreset);
  di('XA-2102', 'Cabinet fan fault', null, {
    notes: 'Input card from the old panel; no protection fitted.',
  });
  const x1 = strip(
    'X1',
    '230 V AC distribution and cabinet monitoring',
    [
      mainsLine('1', MAINS_230, { bridgeGroup: 'X1-L' }),
      mainsLine('2', MAINS_230, { bridgeGroup: 'X1-L' }),
      mainsLine('3', MAINS_230, { bridgeGroup: 'X1-L' }),
      mainsNeutral('4', MAINS_230, { bridgeGroup: 'X1-N' }),
      mainsNeutral('5', MAINS_230, { bridgeGroup: 'X1-N' }),
      mainsNeutral('6', MAINS_230, { bridgeGroup: 'X1-N' }),
      signal('7', 'ZS-2101'),
      signal('8', 'TSH-2101'),
      signal('9', 'XA-2101'),
      signal('10', 'XA-2102'),
      earth('11'),
      earth('12', { wireColour: 'BK', notes: 'Protective conductor in black: colour wrong.' }),
      spare('13'),
      spare('14'),
    ],
    wires,
  );

  // X2: 24 V DC distribution with jumper combs; two pulse counters wedged between +24 V and 0 V.
  channels.push(
    {
      tag: 'FQ-2111',
      name: 'Feed brine totaliser pulses',
      signalType: 'counter',
      recipe: RECIPE.unrated,
    },
    {
      tag: 'FQ-2112',
      name: 'Condensate totaliser pulses',
      signalType: 'counter',
      recipe: RECIPE.diFused,
    },
  );
  const x2Returns = ['ZS-2101', 'TSH-2101', 'XA-2101', 'XA-2102', 'FQ-2111', 'FQ-2112'];
  const x2 = strip(
    'X2',
    '24 V DC distribution',
    [
      dcSupply('1', { bridgeGroup: 'X2-24V' }),
      dcSupply('2', { bridgeGroup: 'X2-24V' }),
      dcSupply('3', { bridgeGroup: 'X2-24V' }),
      dcSupply('4', { bridgeGroup: 'X2-24V' }),
      dcSupply('5', { bridgeGroup: 'X2-24V' }),
      signal('6', 'FQ-2111'),
      signal('7', 'FQ-2112'),
      zeroVolt('8', { bridgeGroup: 'X2-0V', commonReturnOf: x2Returns }),
      zeroVolt('9', { bridgeGroup: 'X2-0V' }),
      zeroVolt('10', { bridgeGroup: 'X2-0V' }),
      zeroVolt('11', { bridgeGroup: 'X2-0V' }),
      zeroVolt('12', { bridgeGroup: 'X2-0V' }),
      earth('13'),
      earth('14'),
    ],
    wires,
  );

  // X3: analog inputs, an enclosure heater feed at the head of the strip, no barrier before AI-01.
  const x3Specs: AiSpec[] = [
    ['LT-2101', 'Evaporator 1 brine level', RECIPE.robust],
    ['PT-2102', 'Evaporator 1 vapour pressure', RECIPE.aiPreset],
    ['FT-2103', 'Feed brine flow', RECIPE.aiPreset],
    ['DT-2104', 'Brine density', RECIPE.aiVaristor],
    ['AT-2105', 'Condensate conductivity', RECIPE.bareAi],
    ['LT-2106', 'Evaporator 2 brine level', null],
    ['PT-2107', 'Evaporator 2 vapour pressure', RECIPE.aiPreset],
    ['FT-2108', 'Steam flow', RECIPE.robust],
    ['PT-2109', 'Steam header pressure', RECIPE.robust],
    ['LT-2110', 'Salt slurry tank level', RECIPE.robust],
    ['WT-2111', 'Salt hopper weight', RECIPE.bareAi],
    ['PDT-2112', 'Filter differential pressure', RECIPE.aiPreset],
  ];
  const x3 = strip(
    'X3',
    'Analog inputs AI-01 … AI-12 (4–20 mA)',
    [
      mainsLine('1', MAINS_230, {
        notes: 'Enclosure anti-condensation heater feed.',
        wireNumber: '1014',
      }),
      mainsNeutral('2', MAINS_230),
      earth('3'),
      ...aiPairs(x3Specs, 4, channels, (i) => {
        if (i === 4) return { ret: { wireColour: 'RD' } }; // AT-2105 return in red: colour wrong for DC
        if (i === 5) return { sig: { wireNumber: '1169' } }; // LT-2106: reads as 6911 upside down
        return {};
      }),
      'barrier',
      earth('29', { notes: 'Shield bar' }),
    ],
    wires,
  );
  // FT-2108 as built: a 1 W part fitted for R1 where the recipe asks for 2 W.
  channels.find((c) => c.tag === 'FT-2108')!.guardOverrides = {
    elements: { R1: { ratedPower: 1 } },
  };
  // PDT-2112 as built: 47 Ω fitted in place of the 100 Ω of the recipe.
  channels.find((c) => c.tag === 'PDT-2112')!.guardOverrides = {
    elements: { R1: { resistance: 47 } },
  };

  // X4: digital inputs, a barrier, then 230 V valve outputs. X4:14 is a 230 V valve feed; X3:14 is an AI.
  const x4Di: Array<[string, string, string | null]> = [
    ['LSH-2121', 'Evaporator 1 high level switch', RECIPE.diPreset],
    ['LSL-2122', 'Evaporator 1 low level switch', RECIPE.diPreset],
    ['ZSC-2123', 'Feed valve closed', RECIPE.diPreset],
    ['ZSO-2124', 'Feed valve open', RECIPE.chipDi],
    ['PSH-2125', 'Steam pressure switch high', RECIPE.diPreset],
    ['FS-2126', 'Cooling water flow switch', RECIPE.chipDi],
    ['HS-2127', 'Local stop pushbutton', RECIPE.diFused],
    ['YS-2128', 'Vacuum pump running', null],
    ['TSH-2129', 'Condenser high temperature switch', RECIPE.diPreset],
    ['LS-2130', 'Salt chute blocked', RECIPE.diPreset],
  ];
  x4Di.forEach(([tag, name, recipe]) => di(tag, name, recipe));
  channels.find((c) => c.tag === 'ZSC-2123')!.guardOverrides = {
    elements: { R1: { resistance: 1000, ratedPower: 0.25, limitingVoltage: 200 } },
  };
  const x4 = strip(
    'X4',
    'Digital inputs DI-01 … DI-10, 230 V valve outputs',
    [
      ...x4Di.map(([tag], i) => {
        if (i === 2) return signal('3', tag, { wireNumber: '1041' });
        if (i === 8) return signal('9', tag, { wireColour: 'GNYE' }); // green-yellow on a signal: reserved for PE
        return signal(String(i + 1), tag);
      }),
      zeroVolt('11', { commonReturnOf: x4Di.map(([tag]) => tag) }),
      'barrier',
      mainsLine('13', MAINS_230, { notes: 'Valve XV-2113 solenoid' }),
      mainsLine('14', MAINS_230, {
        notes: 'Valve XV-2114 solenoid',
        wireNumber: '6911',
        wireColour: 'BU',
      }),
      mainsLine('15', MAINS_230, { notes: 'Valve XV-2115 solenoid' }),
      mainsNeutral('16', MAINS_230, { bridgeGroup: 'X4-N' }),
      mainsNeutral('17', MAINS_230, { bridgeGroup: 'X4-N' }),
      earth('18'),
    ],
    wires,
  );

  // X5: two-level blocks, 24 V loop supply (level 2) stacked over each transmitter input (level 1).
  const x5Loops: AiSpec[] = [
    ['TT-2141', 'Evaporator 1 brine temperature', RECIPE.aiPreset],
    ['TT-2142', 'Evaporator 2 brine temperature', RECIPE.robust],
    ['PT-2143', 'Vacuum line pressure', RECIPE.aiPreset],
    ['LT-2144', 'Condensate tank level', RECIPE.bareAi],
    ['FT-2145', 'Cooling water flow', RECIPE.aiPreset],
    ['AT-2146', 'Brine pH', RECIPE.aiPreset],
    ['TT-2147', 'Steam condensate temperature', null],
    ['PT-2148', 'Instrument air pressure', RECIPE.aiVaristor],
  ];
  x5Loops.forEach(([tag, name, recipe]) =>
    channels.push({ tag, name, signalType: 'current-4-20', recipe }),
  );
  const rtds: Array<[string, string, string | null]> = [
    ['TE-2151', 'Evaporator 1 shell temperature', RECIPE.rtd],
    ['TE-2152', 'Evaporator 2 shell temperature', RECIPE.rtd],
    ['TE-2153', 'Condenser outlet temperature', RECIPE.rtd],
    ['TE-2154', 'Brine preheater outlet temperature', null],
  ];
  rtds.forEach(([tag, name, recipe]) => channels.push({ tag, name, signalType: 'rtd', recipe }));
  const x5 = strip(
    'X5',
    'Transmitter inputs on two-level blocks (24 V over AI); RTD inputs',
    [
      ...x5Loops.map(([tag], i): TerminalEntry[] => [
        signal(String(i + 1), tag),
        dcSupply(`${i + 1}.2`, { bridgeGroup: 'X5-24V-comb' }),
      ]),
      zeroVolt('9', { commonReturnOf: x5Loops.map(([tag]) => tag) }),
      'barrier',
      ...rtds.flatMap(([tag], i) => [
        signal(String(11 + 2 * i), tag),
        channelReturn(String(12 + 2 * i), tag),
      ]),
      earth('19', { notes: 'Shield bar' }),
    ],
    wires,
  );

  return {
    tag: '+CP21',
    name: 'Evaporator control panel',
    location: 'Evaporator hall, column E4',
    strips: [x1, x2, x3, x4, x5],
    channels,
  };
}

function pumpHousePanel(): CabinetPlan {
  const wires = new WireNumbers(2000);
  const channels: ChannelPlan[] = [];
  const control: Supply = MAINS_230;

  // X11: pump motor outputs, control transformer secondary, pump feedback inputs, and the
  // mains cores of the mixed multicore W-2210 to junction box JB-22.
  const feedback: Array<[string, string, string | null]> = [
    ['YS-2201', 'Pump P-2201 running', RECIPE.diPreset],
    ['YA-2201', 'Pump P-2201 tripped', RECIPE.diPreset],
    ['HS-2201', 'Pump P-2201 in remote', RECIPE.chipDi],
    ['YS-2202', 'Pump P-2202 running', RECIPE.diPreset],
    ['YA-2202', 'Pump P-2202 tripped', RECIPE.diFused],
    ['HS-2202', 'Pump P-2202 in remote', RECIPE.diPreset],
  ];
  feedback.forEach(([tag, name, recipe]) =>
    channels.push({ tag, name, signalType: 'digital-24', recipe }),
  );
  const mixed = (core: string) => ({ cableId: 'W-2210', cableCore: core });
  const x11 = strip(
    'X11',
    'Pump motor outputs, 230 V control, pump feedback',
    [
      motorOutput('1', MAINS_230, { notes: 'P-2201 U' }),
      motorOutput('2', MAINS_230, { notes: 'P-2201 V' }),
      motorOutput('3', MAINS_230, { notes: 'P-2201 W' }),
      earth('4'),
      motorOutput('5', MAINS_230, { notes: 'P-2202 U' }),
      motorOutput('6', MAINS_230, { notes: 'P-2202 V' }),
      motorOutput('7', MAINS_230, { notes: 'P-2202 W' }),
      earth('8'),
      {
        terminalNumber: '9',
        circuitClass: 'hazard',
        hazardKind: 'other',
        nominalVoltage: 230,
        currentKind: 'ac',
        frequency: 50,
        sourceImpedance: 1.5,
        wireColour: 'RD',
        notes: 'Control transformer T22 secondary, 230 V',
      },
      mainsNeutral('10', control, {
        notes: 'Control transformer T22 common',
        sourceImpedance: 1.5,
      }),
      ...feedback.map(([tag], i) => signal(String(11 + i), tag)),
      zeroVolt('17', { commonReturnOf: feedback.map(([tag]) => tag) }),
      mainsLine('18', MAINS_230, { ...mixed('1'), notes: 'Solenoid XV-2210 at JB-22' }),
      mainsNeutral('19', MAINS_230, mixed('2')),
      earth('20', mixed('GNYE')),
    ],
    wires,
  );

  // X12: inputs from JB-22; two of them ride in W-2210 with the solenoid's 230 V cores.
  const x12Specs: AiSpec[] = [
    ['FT-2211', 'Brine transfer flow', RECIPE.robust],
    ['PT-2212', 'Transfer pump discharge pressure', RECIPE.bareAi],
    ['LT-2213', 'Brine well level', RECIPE.aiPreset],
    ['TT-2214', 'Brine well temperature', RECIPE.aiPreset],
    ['DT-2215', 'Raw brine density', RECIPE.aiVaristor],
    ['AT-2216', 'Raw brine turbidity', null],
  ];
  const cableFor = (i: number): [string, number] =>
    i < 2 ? ['W-2210', 3 + 2 * i] : ['W-2211', 1 + 2 * (i - 2)];
  const x12 = strip(
    'X12',
    'Analog inputs from junction box JB-22',
    [
      dcSupply('1', { bridgeGroup: 'X12-24V' }),
      dcSupply('2', { bridgeGroup: 'X12-24V' }),
      'barrier',
      earth('4', { notes: 'Shield bar' }),
      ...aiPairs(x12Specs, 5, channels, (i) => {
        const [cableId, core] = cableFor(i);
        return {
          sig: { cableId, cableCore: String(core) },
          ret: { cableId, cableCore: String(core + 1) },
        };
      }),
      { ...spare('17'), cableId: 'W-2210', cableCore: '7' },
      earth('18'),
    ],
    wires,
  );

  // X13: trace heater outputs behind a barrier from the thermocouples — except a heater
  // added later at the far end, right beside TE-2234.
  const tcs: Array<[string, string, string | null]> = [
    ['TE-2231', 'Brine line trace temperature, section 1', RECIPE.tcPreset],
    ['TE-2232', 'Brine line trace temperature, section 2', RECIPE.tcPreset],
    ['TE-2233', 'Brine line trace temperature, section 3', RECIPE.tcPreset],
    ['TE-2234', 'Brine line trace temperature, section 4', null],
  ];
  tcs.forEach(([tag, name, recipe]) =>
    channels.push({ tag, name, signalType: 'thermocouple', recipe }),
  );
  const x13 = strip(
    'X13',
    'Trace heater outputs and thermocouples',
    [
      heaterOutput('1', MAINS_230, { notes: 'Trace heater EHT-2221' }),
      heaterOutput('2', MAINS_230, { notes: 'Trace heater EHT-2222' }),
      heaterOutput('3', MAINS_230, { notes: 'Trace heater EHT-2223' }),
      mainsNeutral('4', MAINS_230, { bridgeGroup: 'X13-N' }),
      'barrier',
      ...tcs.flatMap(([tag], i) => [
        // Type K extension cable colours, IEC 60584-3 (from memory): + green, − white.
        signal(String(6 + 2 * i), tag, { wireColour: 'GN' }),
        channelReturn(String(7 + 2 * i), tag, { wireColour: 'WH' }),
      ]),
      heaterOutput('14', MAINS_230, { notes: 'Trace heater EHT-2224 (added during construction)' }),
      mainsNeutral('15', MAINS_230, { bridgeGroup: 'X13-N' }),
      earth('16'),
    ],
    wires,
  );

  return {
    tag: '+CP22',
    name: 'Brine pump house I/O panel',
    location: 'Pump house, north wall',
    strips: [x11, x12, x13],
    channels,
  };
}

export const EVAPORATOR_PROJECT_CODE = 'VBW-EV2';
export const CREAMERY_PROJECT_CODE = 'TCW-WS1';

function evaporatorProject(): ProjectPlan {
  return {
    project: {
      name: 'Evaporator line 2 controls upgrade',
      code: EVAPORATOR_PROJECT_CODE,
      client: 'Vessmoor Brine Works',
      site: 'Vessmoor salt works, evaporator hall and pump house',
      mainsSystem: '230/400V 50Hz',
      nominalVoltage: 230,
      frequency: 50,
      supplyTolerance: 0.1,
      dcSupplyMax: 28.8,
      ambientC: 45,
      overvoltageCategory: 'III',
      surgeLevelKv: 1,
      // IEC 61000-4-5: unshielded signal/I/O ports are surged through 40 Ω + the generator's 2 Ω.
      surgeCoupling: 'signal',
      esdLevelKv: 4,
      powerDerating: 0.5,
      voltageDerating: 0.8,
      wireColourConvention: 'iec60204-1',
      faultMode: 'line-earth',
      likelihoodWeights: null,
    },
    members: [
      { email: 'orla.engineer@vessmoor.example', role: 'engineer' },
      { email: 'bram.technician@vessmoor.example', role: 'technician' },
      { email: 'nadia.reviewer@vessmoor.example', role: 'reviewer' },
      { email: 'felix.viewer@vessmoor.example', role: 'viewer' },
    ],
    recipes: [...presetLibrary(), ...CUSTOM_RECIPES],
    cabinets: [evaporatorPanel(), pumpHousePanel()],
    markups: [
      {
        terminalLabel: 'X4:3',
        author: 'bram.technician@vessmoor.example',
        kind: 'component',
        before: { channel: 'ZSC-2123', elements: { R1: { resistance: 2200, ratedPower: 0.5 } } },
        after: { channel: 'ZSC-2123', elements: { R1: { resistance: 1000, ratedPower: 0.25 } } },
        note: 'Input card fitted with 1k 0.25 W, not the 2k2 0.5 W on the drawing.',
        status: 'proposed',
      },
      {
        terminalLabel: 'X3:14',
        author: 'bram.technician@vessmoor.example',
        kind: 'relanded',
        before: { wireNumber: '1169', label: 'X3:14' },
        after: { wireNumber: '1169', label: 'X3:15' },
        note: 'Wire 1169 found on X3:15; moved back to X3:14. Sleeve marker reads 6911 upside down.',
        status: 'proposed',
      },
      {
        terminalLabel: 'X1:12',
        author: 'bram.technician@vessmoor.example',
        kind: 'wiring',
        before: { wireColour: 'BK' },
        after: { wireColour: 'GNYE' },
        note: 'Replaced the black protective conductor with green-yellow.',
        status: 'accepted',
        decidedBy: 'orla.engineer@vessmoor.example',
      },
    ],
  };
}

function creameryProject(): ProjectPlan {
  const mains120: Supply = { voltage: 120, frequency: 60 };
  const wires = new WireNumbers(100);
  const channels: ChannelPlan[] = [
    {
      tag: 'LSH-101',
      name: 'Whey tank high level',
      signalType: 'digital-24',
      recipe: RECIPE.diPreset,
    },
    {
      tag: 'PSL-102',
      name: 'Pump suction pressure low',
      signalType: 'digital-24',
      recipe: RECIPE.diPreset,
    },
    { tag: 'ZS-103', name: 'Cleaning valve closed', signalType: 'digital-24', recipe: null },
    {
      tag: 'TT-104',
      name: 'Whey temperature',
      signalType: 'current-4-20',
      recipe: RECIPE.aiPreset,
    },
    {
      tag: 'FT-105',
      name: 'Whey transfer flow',
      signalType: 'current-4-20',
      recipe: RECIPE.aiVaristor,
    },
  ];
  const nfpaReturn = { wireColour: 'WH/BU' };
  const tb1 = strip(
    'TB1',
    '120 V AC control and digital inputs',
    [
      mainsLine('1', mains120, { bridgeGroup: 'TB1-L1' }),
      mainsLine('2', mains120, { bridgeGroup: 'TB1-L1' }),
      mainsNeutral('3', mains120, { wireColour: 'WH' }),
      mainsNeutral('4', mains120, { wireColour: 'WH' }),
      earth('5', { wireColour: 'GN' }),
      signal('6', 'LSH-101'),
      signal('7', 'PSL-102'),
      signal('8', 'ZS-103'),
      zeroVolt('9', { ...nfpaReturn, commonReturnOf: ['LSH-101', 'PSL-102', 'ZS-103'] }),
      dcSupply('10'),
    ],
    wires,
  );
  const tb2 = strip(
    'TB2',
    'Analog inputs',
    [
      signal('1', 'TT-104'),
      channelReturn('2', 'TT-104', nfpaReturn),
      signal('3', 'FT-105'),
      channelReturn('4', 'FT-105', { wireColour: 'BK' }), // black on a DC return: wrong under NFPA 79
      earth('5', { wireColour: 'GN' }),
    ],
    wires,
  );
  return {
    project: {
      name: 'Whey transfer skid',
      code: CREAMERY_PROJECT_CODE,
      client: 'Tarrow Creamery',
      site: 'Tarrow, whey room',
      mainsSystem: '120/208V 60Hz',
      nominalVoltage: 120,
      frequency: 60,
      supplyTolerance: 0.1,
      dcSupplyMax: 28.8,
      ambientC: 35,
      overvoltageCategory: 'II',
      surgeLevelKv: 0.5,
      surgeCoupling: 'signal',
      esdLevelKv: 4,
      powerDerating: 0.5,
      voltageDerating: 0.8,
      wireColourConvention: 'nfpa79',
      faultMode: 'line-earth',
      likelihoodWeights: { likely: 1, plausible: 0.5, remote: 0.1 },
    },
    members: [
      { email: 'nadia.reviewer@vessmoor.example', role: 'engineer' },
      { email: 'orla.engineer@vessmoor.example', role: 'viewer' },
      { email: 'bram.technician@vessmoor.example', role: 'technician' },
    ],
    recipes: presetLibrary(),
    cabinets: [
      {
        tag: '+SK1',
        name: 'Whey skid control box',
        location: 'Whey room, skid frame',
        strips: [tb1, tb2],
        channels,
      },
    ],
    markups: [],
  };
}

export function demoScenario(): ProjectPlan[] {
  return [evaporatorProject(), creameryProject()];
}
