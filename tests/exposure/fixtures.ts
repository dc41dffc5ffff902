import type { TerminalSnapshot, WiringSnapshot } from '@/lib/exposure';

/** A terminal with the facts a test does not care about filled in. */
export function term(
  p: Partial<TerminalSnapshot> & Pick<TerminalSnapshot, 'id' | 'position'>,
): TerminalSnapshot {
  const stripId = p.stripId ?? 'X1';
  return {
    stripId,
    label: `${stripId}:${p.position}`,
    circuitClass: 'spare',
    ...p,
  };
}

export function mainsLine(
  id: string,
  position: number,
  extra: Partial<TerminalSnapshot> = {},
): TerminalSnapshot {
  return term({
    id,
    position,
    circuitClass: 'hazard',
    hazardKind: 'mains-line',
    nominalVoltage: 230,
    currentKind: 'ac',
    frequency: 50,
    ...extra,
  });
}

export function dcSupply(
  id: string,
  position: number,
  extra: Partial<TerminalSnapshot> = {},
): TerminalSnapshot {
  return term({
    id,
    position,
    circuitClass: 'hazard',
    hazardKind: 'dc-supply',
    nominalVoltage: 24,
    currentKind: 'dc',
    ...extra,
  });
}

export function input(
  id: string,
  position: number,
  extra: Partial<TerminalSnapshot> = {},
): TerminalSnapshot {
  return term({ id, position, circuitClass: 'sensitive', currentKind: 'dc', ...extra });
}

/** One cabinet "Pump house MCC-2" with strips X1…X5 unless the test adds others. */
export function wiring(
  terminals: TerminalSnapshot[],
  extra: Partial<WiringSnapshot> = {},
): WiringSnapshot {
  return {
    cabinets: [
      { id: 'C1', tag: 'MCC-2' },
      { id: 'C2', tag: 'RIO-7' },
    ],
    strips: [
      { id: 'X1', cabinetId: 'C1', tag: 'X1' },
      { id: 'X2', cabinetId: 'C1', tag: 'X2' },
      { id: 'X3', cabinetId: 'C1', tag: 'X3' },
      { id: 'X4', cabinetId: 'C1', tag: 'X4' },
      { id: 'X5', cabinetId: 'C2', tag: 'X5' },
    ],
    terminals,
    channels: [],
    ...extra,
  };
}
