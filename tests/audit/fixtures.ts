import type { ProjectSettings, ProjectSnapshot } from '@/lib/audit';
import type { Guard } from '@/lib/stress/types';

/** Project defaults as stored on a new Project (models/Project.ts PROJECT_SETTING_DEFAULTS). */
export const settings230: ProjectSettings = {
  mainsSystem: '230/400V 50Hz',
  nominalVoltage: 230,
  frequency: 50,
  supplyTolerance: 0.1, // IEC 60038 ±10 %
  dcSupplyMax: 28.8, // IEC 61131-2
  ambientC: 40,
  surgeLevelKv: 1,
  surgeCoupling: 'signal',
  esdLevelKv: 4,
  powerDerating: 0.5,
  voltageDerating: 0.8,
  wireColourConvention: 'iec60204-1',
  faultMode: 'line-earth',
};

/**
 * A 4–20 mA input guard of our own: 100 Ω series (0.25 W, 200 V limiting), a bidirectional
 * 600 W TVS and a 250 Ω burden to 0 V; figures typical of the classes REFERENCE.md lists
 * (typical — not a specific part).
 */
export const loopGuard: Guard = {
  stages: [
    {
      series: {
        kind: 'resistor',
        id: 'R1',
        resistance: 100,
        ratedPower: 0.25,
        limitingVoltage: 200,
        overloadVoltage: 400,
      },
      shunts: [
        {
          kind: 'tvs',
          id: 'TVS1',
          bidirectional: true,
          standoffVoltage: 28,
          breakdownVoltage: 31.1,
          clampVoltage: 45.4,
          peakPulseCurrent: 13.2,
        },
      ],
    },
  ],
  input: {
    positiveRail: 24,
    negativeRail: 0,
    absMaxBeyondRail: 0.3,
    absMaxCurrent: 0.01,
    inputResistance: 250,
  },
};

/**
 * Invented plant: "Kestrel Ridge water works", cabinet RIO-3 with strip X2. AI-101 is a
 * 4–20 mA input at X2:5 with its return at X2:6; a 230 V line sits at X2:4, a 24 V supply at
 * X2:8 (two positions from the return, three from the input).
 */
export function kestrelSnapshot(): ProjectSnapshot {
  return {
    cabinets: [{ id: 'c1', tag: 'RIO-3' }],
    strips: [{ id: 's1', cabinetId: 'c1', tag: 'X2' }],
    terminals: [
      {
        id: 't4',
        stripId: 's1',
        position: 4,
        label: 'X2:4',
        circuitClass: 'hazard',
        hazardKind: 'mains-line',
        nominalVoltage: 230,
        currentKind: 'ac',
        frequency: 50,
        wireColour: 'BK',
      },
      {
        id: 't5',
        stripId: 's1',
        position: 5,
        label: 'X2:5',
        circuitClass: 'sensitive',
        currentKind: 'dc',
        wireColour: 'BU',
        channelId: 'ch1',
      },
      {
        id: 't6',
        stripId: 's1',
        position: 6,
        label: 'X2:6',
        circuitClass: 'return',
        currentKind: 'dc',
        wireColour: 'BU',
        channelId: 'ch1',
      },
      {
        id: 't8',
        stripId: 's1',
        position: 8,
        label: 'X2:8',
        circuitClass: 'hazard',
        hazardKind: 'dc-supply',
        nominalVoltage: 24,
        currentKind: 'dc',
        wireColour: 'BU',
      },
      {
        id: 't9',
        stripId: 's1',
        position: 9,
        label: 'X2:9',
        circuitClass: 'sensitive',
        currentKind: 'dc',
        channelId: 'ch2',
      },
    ],
    channels: [
      {
        id: 'ch1',
        tag: 'AI-101',
        signalType: 'current-4-20',
        signalTerminalId: 't5',
        returnTerminalId: 't6',
        guardRecipeId: 'g1',
      },
      {
        id: 'ch2',
        tag: 'DI-102',
        signalType: 'digital-24',
        signalTerminalId: 't9',
        guardRecipeId: null,
      },
    ],
    guards: [{ id: 'g1', name: '4–20 mA loop input', guard: loopGuard }],
    settings: { ...settings230 },
  };
}
