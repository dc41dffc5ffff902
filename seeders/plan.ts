/**
 * A small vocabulary for writing terminal schedules as data: a strip is a list of entries,
 * each one terminal, a stacked block (several levels at one position) or a barrier.
 * Positions, levels, labels and block ids follow from the order; nothing is repeated by hand.
 */
import type { InferCreationAttributes } from 'sequelize';
import type { GuardOverrides } from '@/lib/presets/overrides';
import type { SignalType } from '@/models/enums';
import type { Terminal } from '@/models/Terminal';

type TerminalFields = Omit<
  InferCreationAttributes<Terminal>,
  | 'id'
  | 'stripId'
  | 'position'
  | 'level'
  | 'label'
  | 'blockId'
  | 'channelId'
  | 'version'
  | 'createdAt'
  | 'updatedAt'
>;

/** One terminal as written in the scenario; `channel` ties it to a channel by tag. */
export interface TerminalEntry extends Partial<TerminalFields> {
  circuitClass: TerminalFields['circuitClass'];
  terminalNumber?: string | null;
  channel?: { tag: string; as: 'signal' | 'return' };
  /** Tags of channels that use this terminal as their (shared) return. */
  commonReturnOf?: string[];
}

export type StripEntry = TerminalEntry | TerminalEntry[] | 'barrier';

/** A terminal with its place on the strip worked out. */
export interface PlacedTerminal extends TerminalEntry {
  position: number;
  level: number;
  label: string;
  blockId: string | null;
}

export interface StripPlan {
  tag: string;
  name: string;
  terminals: PlacedTerminal[];
}

export interface ChannelPlan {
  tag: string;
  name: string;
  signalType: SignalType;
  /** Recipe name in the project's library; null = no guard at all. */
  recipe: string | null;
  guardOverrides?: GuardOverrides;
  notes?: string;
}

export interface CabinetPlan {
  tag: string;
  name: string;
  location: string;
  strips: StripPlan[];
  channels: ChannelPlan[];
}

/** Places the entries along the strip: one position each; stacked levels share one. */
export function strip(
  tag: string,
  name: string,
  entries: StripEntry[],
  wires: WireNumbers,
): StripPlan {
  const terminals: PlacedTerminal[] = [];
  let barriers = 0;
  entries.forEach((entry, index) => {
    const position = index + 1;
    if (entry === 'barrier') {
      barriers += 1;
      terminals.push({
        circuitClass: 'barrier',
        terminalNumber: null,
        position,
        level: 1,
        label: `${tag}:BP${barriers}`,
        blockId: null,
        notes: 'Partition plate',
      });
      return;
    }
    const levels = Array.isArray(entry) ? entry : [entry];
    const blockId = levels.length > 1 ? `${tag}-B${position}` : null;
    levels.forEach((t, i) => {
      const level = i + 1;
      const number = t.terminalNumber ?? null;
      const label = number === null ? `${tag}:${position}` : `${tag}:${number}`;
      const wireNumber = t.wireNumber !== undefined ? t.wireNumber : wires.numberFor(t);
      terminals.push({ ...t, position, level, label, blockId, wireNumber });
    });
  });
  return { tag, name, terminals };
}

/** Prefix of a potential's wire numbers (L1, N1, M1 …); signal wires are plain numbers. */
const POTENTIAL_PREFIX: Record<string, string> = {
  'mains-line': 'L',
  'mains-neutral': 'N',
  'motor-output': 'M',
  'heater-output': 'H',
  'dc-supply': '+24-',
  other: 'C',
};

/**
 * Wire numbers for one cabinet: signal and return wires numbered in sequence, power and
 * supply wires by potential; terminals of one jumper group are one node, so one number.
 * Numbers planted on purpose elsewhere are skipped.
 */
export class WireNumbers {
  private n: number;
  private readonly byPrefix = new Map<string, number>();
  private readonly byBridge = new Map<string, string>();
  constructor(
    start: number,
    private readonly reserved: ReadonlySet<string> = new Set(),
  ) {
    this.n = start;
  }
  next(): string {
    while (this.reserved.has(String(this.n))) this.n += 1;
    return String(this.n++);
  }
  numberFor(t: TerminalEntry): string | null {
    if (t.circuitClass === 'spare' || t.circuitClass === 'barrier') return null;
    if (t.circuitClass === 'earth') return 'PE';
    const bridged = t.bridgeGroup ? this.byBridge.get(t.bridgeGroup) : undefined;
    if (bridged) return bridged;
    let wire: string;
    if (t.circuitClass === 'hazard') {
      const prefix = POTENTIAL_PREFIX[t.hazardKind ?? 'other'] ?? 'C';
      const k = (this.byPrefix.get(prefix) ?? 0) + 1;
      this.byPrefix.set(prefix, k);
      wire = `${prefix}${k}`;
    } else if (t.circuitClass === 'return' && !t.channel) {
      const k = (this.byPrefix.get('0V-') ?? 0) + 1;
      this.byPrefix.set('0V-', k);
      wire = `0V-${k}`;
    } else {
      wire = this.next();
    }
    if (t.bridgeGroup) this.byBridge.set(t.bridgeGroup, wire);
    return wire;
  }
}

// ------------------------------------------------------------------ terminal kinds

export interface Supply {
  voltage: number;
  frequency: number;
}

export const mainsLine = (
  n: string,
  supply: Supply,
  extra: Partial<TerminalEntry> = {},
): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'hazard',
  hazardKind: 'mains-line',
  nominalVoltage: supply.voltage,
  currentKind: 'ac',
  frequency: supply.frequency,
  wireColour: 'BK',
  ...extra,
});

/** Worst case of a neutral: lifted upstream with the load connected, it carries line voltage. */
export const mainsNeutral = (
  n: string,
  supply: Supply,
  extra: Partial<TerminalEntry> = {},
): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'hazard',
  hazardKind: 'mains-neutral',
  nominalVoltage: supply.voltage,
  currentKind: 'ac',
  frequency: supply.frequency,
  wireColour: 'LBU',
  ...extra,
});

export const motorOutput = (
  n: string,
  supply: Supply,
  extra: Partial<TerminalEntry> = {},
): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'hazard',
  hazardKind: 'motor-output',
  nominalVoltage: supply.voltage,
  currentKind: 'ac',
  frequency: supply.frequency,
  wireColour: 'BK',
  ...extra,
});

export const heaterOutput = (
  n: string,
  supply: Supply,
  extra: Partial<TerminalEntry> = {},
): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'hazard',
  hazardKind: 'heater-output',
  nominalVoltage: supply.voltage,
  currentKind: 'ac',
  frequency: supply.frequency,
  wireColour: 'BK',
  ...extra,
});

export const dcSupply = (n: string, extra: Partial<TerminalEntry> = {}): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'hazard',
  hazardKind: 'dc-supply',
  nominalVoltage: 24,
  currentKind: 'dc',
  wireColour: 'BU',
  ...extra,
});

export const zeroVolt = (n: string, extra: Partial<TerminalEntry> = {}): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'return',
  currentKind: 'dc',
  wireColour: 'BU',
  ...extra,
});

export const earth = (n: string, extra: Partial<TerminalEntry> = {}): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'earth',
  wireColour: 'GNYE',
  ...extra,
});

export const spare = (n: string): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'spare',
  wireColour: null,
});

export const signal = (
  n: string,
  tag: string,
  extra: Partial<TerminalEntry> = {},
): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'sensitive',
  currentKind: 'dc',
  wireColour: 'BU',
  channel: { tag, as: 'signal' },
  ...extra,
});

export const channelReturn = (
  n: string,
  tag: string,
  extra: Partial<TerminalEntry> = {},
): TerminalEntry => ({
  terminalNumber: n,
  circuitClass: 'return',
  currentKind: 'dc',
  wireColour: 'BU',
  channel: { tag, as: 'return' },
  ...extra,
});
