/**
 * What the guard builder knows about each element kind: its name, its figures with their SI
 * unit and a hint, which figures are required (as lib/presets/guard-shape.ts requires them),
 * and the id prefix new elements get. Pure.
 */
import type { UnitSymbol } from '@/lib/units';
import type { GuardElement, ProtectedInput, SeriesElement, ShuntElement } from '@/lib/stress/types';

export interface FigureSpec {
  key: string;
  label: string;
  unit: UnitSymbol;
  required: boolean;
  hint: string;
}

export interface KindSpec {
  kind: GuardElement['kind'];
  role: 'series' | 'shunt';
  name: string;
  prefix: string;
  figures: FigureSpec[];
  /** A true/false figure (both-polarity parts). */
  bidirectional?: boolean;
}

const f = (
  key: string,
  label: string,
  unit: UnitSymbol,
  required: boolean,
  hint: string,
): FigureSpec => ({
  key,
  label,
  unit,
  required,
  hint,
});

export const KIND_SPECS: KindSpec[] = [
  {
    kind: 'resistor',
    role: 'series',
    name: 'Resistor',
    prefix: 'R',
    figures: [
      f('resistance', 'Resistance', 'Ω', true, 'e.g. 4k99, 100R, 1k'),
      f('ratedPower', 'Rated power at 70 °C', 'W', false, 'e.g. 0.25W, 125m'),
      f('limitingVoltage', 'Limiting element voltage', 'V', false, 'e.g. 200V'),
      f('overloadVoltage', 'Overload voltage (pulses)', 'V', false, 'e.g. 400V'),
      f('pulseEnergy', 'Single-pulse energy', 'J', false, 'e.g. 0.5J'),
    ],
  },
  {
    kind: 'ptc',
    role: 'series',
    name: 'PTC resettable fuse',
    prefix: 'PTC',
    figures: [
      f('resistance', 'Resistance', 'Ω', true, 'e.g. 7R5'),
      f('holdCurrent', 'Hold current', 'A', true, 'e.g. 50m'),
      f('tripCurrent', 'Trip current', 'A', true, 'e.g. 100m'),
      f('maxVoltage', 'Maximum voltage', 'V', false, 'e.g. 60V'),
      f('maxCurrent', 'Maximum interrupt current', 'A', false, 'e.g. 10A'),
    ],
  },
  {
    kind: 'fuse',
    role: 'series',
    name: 'Fuse',
    prefix: 'F',
    figures: [
      f('ratedCurrent', 'Rated current', 'A', true, 'e.g. 50m, 0.1A'),
      f('voltageRating', 'Voltage rating', 'V', false, 'e.g. 250V'),
      f('meltingI2t', 'Melting I²t', 'A²s', false, 'e.g. 0.01'),
      f('resistance', 'Cold resistance', 'Ω', false, 'e.g. 3R6'),
    ],
  },
  {
    kind: 'wire',
    role: 'series',
    name: 'Wiring resistance',
    prefix: 'W',
    figures: [f('resistance', 'Resistance', 'Ω', true, 'e.g. 0R2')],
  },
  {
    kind: 'railDiodes',
    role: 'shunt',
    name: 'Diode pair to the rails',
    prefix: 'D',
    figures: [
      f('forwardVoltage', 'Forward voltage', 'V', true, 'e.g. 1V'),
      f('forwardCurrent', '… at current', 'A', true, 'e.g. 50m'),
      f('averageCurrent', 'Average current rating', 'A', false, 'e.g. 200m'),
      f('surgeCurrent', 'Surge current rating', 'A', false, 'e.g. 4A'),
      f('surgeDuration', 'Surge duration', 's', false, 'e.g. 1u, 8.3m'),
    ],
  },
  {
    kind: 'zener',
    role: 'shunt',
    name: 'Zener',
    prefix: 'Z',
    bidirectional: true,
    figures: [
      f('zenerVoltage', 'Zener voltage', 'V', true, 'e.g. 5V6'),
      f('dynamicImpedance', 'Dynamic impedance', 'Ω', true, 'e.g. 10R'),
      f('testCurrent', 'Test current', 'A', false, 'e.g. 5m'),
      f('powerRating', 'Power rating', 'W', false, 'e.g. 0.5W'),
    ],
  },
  {
    kind: 'tvs',
    role: 'shunt',
    name: 'TVS diode',
    prefix: 'TVS',
    bidirectional: true,
    figures: [
      f('standoffVoltage', 'Stand-off voltage VRWM', 'V', true, 'e.g. 33V'),
      f('breakdownVoltage', 'Breakdown voltage VBR', 'V', true, 'e.g. 36.7V'),
      f('clampVoltage', 'Clamping voltage VC', 'V', true, 'e.g. 53.3V'),
      f('peakPulseCurrent', '… at IPP (10/1000 µs)', 'A', true, 'e.g. 11.3A'),
      f('peakPulsePower', 'PPPM (10/1000 µs)', 'W', false, 'e.g. 600W'),
    ],
  },
  {
    kind: 'varistor',
    role: 'shunt',
    name: 'Metal-oxide varistor',
    prefix: 'MOV',
    figures: [
      f('maxContinuousVoltage', 'Max continuous voltage', 'V', true, 'e.g. 30V'),
      f('varistorVoltage', 'Varistor voltage at 1 mA', 'V', true, 'e.g. 47V'),
      f('clampVoltage', 'Clamping voltage', 'V', true, 'e.g. 93V'),
      f('clampCurrent', '… at current', 'A', true, 'e.g. 5A'),
      f('surgeCurrent', 'Surge current 8/20 µs', 'A', false, 'e.g. 500A'),
      f('surgeEnergy', 'Energy rating', 'J', false, 'e.g. 2J'),
    ],
  },
  {
    kind: 'capacitor',
    role: 'shunt',
    name: 'Capacitor to ground',
    prefix: 'C',
    figures: [
      f('capacitance', 'Capacitance', 'F', true, 'e.g. 100n, 10n'),
      f('voltageRating', 'Voltage rating', 'V', false, 'e.g. 50V'),
    ],
  },
  {
    kind: 'shuntResistor',
    role: 'shunt',
    name: 'Resistor to ground',
    prefix: 'RS',
    figures: [
      f('resistance', 'Resistance', 'Ω', true, 'e.g. 250R, 100k'),
      f('ratedPower', 'Rated power at 70 °C', 'W', false, 'e.g. 0.25W'),
      f('limitingVoltage', 'Limiting element voltage', 'V', false, 'e.g. 200V'),
      f('overloadVoltage', 'Overload voltage (pulses)', 'V', false, 'e.g. 400V'),
    ],
  },
];

export const KIND_BY_NAME = new Map(KIND_SPECS.map((k) => [k.kind, k]));
export const SERIES_KINDS = KIND_SPECS.filter((k) => k.role === 'series');
export const SHUNT_KINDS = KIND_SPECS.filter((k) => k.role === 'shunt');

export const INPUT_FIGURES: FigureSpec[] = [
  f('positiveRail', 'Positive rail', 'V', true, 'e.g. 24V, 5V'),
  f('negativeRail', 'Negative rail', 'V', true, 'e.g. 0'),
  f('absMaxBeyondRail', 'Abs. max beyond each rail', 'V', true, 'e.g. 0.3V'),
  f('absMaxCurrent', 'Abs. max input current', 'A', false, 'e.g. 10m'),
  f('inputResistance', 'Input resistance', 'Ω', false, 'burden or pull-down, e.g. 250R'),
  f('positiveRailMinLoad', 'Min load on + rail', 'A', false, 'e.g. 5m'),
  f('negativeRailMinLoad', 'Min load on − rail', 'A', false, 'e.g. 5m'),
];

/** The figure that best names an element in a drawing (its main value). */
export function mainFigure(
  element: SeriesElement | ShuntElement,
): { key: string; unit: UnitSymbol } | null {
  const spec = KIND_BY_NAME.get(element.kind);
  const first = spec?.figures[0];
  if (element.kind === 'tvs') return { key: 'standoffVoltage', unit: 'V' };
  if (element.kind === 'varistor') return { key: 'maxContinuousVoltage', unit: 'V' };
  return first ? { key: first.key, unit: first.unit } : null;
}

export type InputFigureKey = keyof ProtectedInput;
