import type { CurrentKind, TerminalSnapshot } from './types';

/**
 * Whether a hazard terminal carries AC or DC. Mains conductors are AC whatever the schedule
 * says; otherwise the schedule's currentKind, and AC when it is missing (the worse guess:
 * an AC fault reaches √2 × rms and both polarities).
 */
export function hazardCurrentKind(t: TerminalSnapshot): CurrentKind {
  if (t.hazardKind === 'mains-line' || t.hazardKind === 'mains-neutral') return 'ac';
  if (t.currentKind) return t.currentKind;
  if (t.hazardKind === 'dc-supply') return 'dc';
  return 'ac';
}

/** Peak of the hazard at its nominal value (V), for ranking only; 0 when unknown. */
export function nominalPeakVoltage(t: TerminalSnapshot): number {
  const v = t.nominalVoltage;
  if (v === null || v === undefined || !Number.isFinite(v)) return 0;
  return hazardCurrentKind(t) === 'ac' ? Math.abs(v) * Math.SQRT2 : Math.abs(v);
}

/** Terminals the mapping protects: sensitive inputs and returns. */
export function isTargetClass(t: TerminalSnapshot): boolean {
  return t.circuitClass === 'sensitive' || t.circuitClass === 'return';
}

export function isHazard(t: TerminalSnapshot): boolean {
  return t.circuitClass === 'hazard';
}

/** The number printed on the terminal: terminalNumber, else the label after its last ":". */
export function terminalNumberOf(t: TerminalSnapshot): string | null {
  if (t.terminalNumber !== null && t.terminalNumber !== undefined && t.terminalNumber !== '') {
    return t.terminalNumber.trim();
  }
  const colon = t.label.lastIndexOf(':');
  if (colon < 0 || colon === t.label.length - 1) return null;
  return t.label.slice(colon + 1).trim();
}
