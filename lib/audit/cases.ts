import { hazardCurrentKind } from '../exposure/hazard';
import type { TerminalSnapshot } from '../exposure/types';
import type { HazardTerminal } from '../stress/types';
import type { AuditCase, ProjectSettings, SurgeCoupling } from './types';

/**
 * Source resistance assumed for a hazard whose schedule gives none: a stiff supply. Our own
 * default (common practice, no source); lower is worse, so the user should enter the real one.
 */
export const DEFAULT_SOURCE_RESISTANCE = 0.1;

/** Extra coupling resistance beyond the 2 Ω generator (IEC 61000-4-5; line–earth 10 Ω: memory). */
export const SURGE_COUPLING_RESISTANCE: Readonly<Record<SurgeCoupling, number>> = {
  'line-line': 0,
  'line-earth': 10,
  signal: 40,
};

/** Nominal voltages IEC 60038 lists for 50 and 60 Hz systems (REFERENCE.md). */
const IEC_60038_NOMINALS = new Set([120, 208, 230, 240, 277, 347, 400, 480, 600]);

/** Rounds away float noise (230 × 1.1 = 253.00000000000003) at the microvolt. */
function tidy(v: number): number {
  return Math.round(v * 1e6) / 1e6;
}

function percent(fraction: number): string {
  return `${tidy(fraction * 100)} %`;
}

/** Where a mains maximum comes from: the standard the tolerance matches, else the project. */
export function mainsBasis(nominal: number, tolerance: number, max: number): string {
  if (Math.abs(tolerance - 0.1) < 1e-9 && IEC_60038_NOMINALS.has(nominal)) {
    return `IEC 60038: ${nominal} V +10 % → ${max} V rms`;
  }
  if (Math.abs(tolerance - 0.05) < 1e-9 && nominal === 120) {
    return `ANSI C84.1 Range A: ${nominal} V +5 % → ${max} V rms`;
  }
  if (Math.abs(tolerance - 0.05) < 1e-9 && nominal === 480) {
    return `ANSI C84.1 Range A: ${nominal} V +5 % → ${max} V rms (memory ⚠)`;
  }
  return `project supply tolerance: ${nominal} V +${percent(tolerance)} → ${max} V rms`;
}

/** Line-to-line over line-to-earth: from "230/400V…" when the mains system names both, else √3. */
export function lineToLineRatio(settings: ProjectSettings): { ratio: number; basis: string } {
  const m = /^\s*(\d+(?:\.\d+)?)\s*\/\s*(\d+(?:\.\d+)?)/.exec(settings.mainsSystem ?? '');
  if (m) {
    const le = Number(m[1]);
    const ll = Number(m[2]);
    if (le > 0 && ll > le)
      return {
        ratio: ll / le,
        basis: `line-to-line ${ll}/${le} of the ${settings.mainsSystem} system`,
      };
  }
  return { ratio: Math.sqrt(3), basis: 'line-to-line √3 × line-to-earth (three-phase)' };
}

export type HazardCaseResult = { ok: true; case: AuditCase } | { ok: false; reason: string };

const HAZARD_NAMES: Readonly<Record<string, string>> = {
  'mains-line': 'Mains line',
  'mains-neutral': 'Mains neutral',
  'motor-output': 'Motor output',
  'heater-output': 'Heater output',
  'dc-supply': 'DC supply',
  other: 'Hazard',
};

/**
 * The worst case a hazard terminal puts on the channel terminal it reaches (REFERENCE.md):
 *  - AC (mains, motor, heater, other AC): nominal × (1 + supply tolerance), line-to-earth, or
 *    line-to-line when the project's fault mode says so (two wrong landings or an unearthed
 *    system). A neutral is taken at line potential: a reversed feed or an open neutral puts the
 *    line on it (common practice, no source), always line-to-earth.
 *  - DC supply: the project's DC maximum for a 24 V supply (IEC 61131-2: 28.8 V), scaled in
 *    proportion for other nominal voltages. Other DC hazards: nominal × (1 + supply tolerance).
 */
export function hazardCase(
  h: TerminalSnapshot,
  settings: ProjectSettings,
  appliedTo: HazardTerminal,
): HazardCaseResult {
  const kind = h.hazardKind ?? 'other';
  const isMains = kind === 'mains-line' || kind === 'mains-neutral';
  const nominal = h.nominalVoltage ?? (isMains ? settings.nominalVoltage : null);
  if (nominal === null || nominal === undefined || !Number.isFinite(nominal) || nominal <= 0) {
    return {
      ok: false,
      reason: `hazard ${h.label} has no nominal voltage, so its stress case cannot be built`,
    };
  }
  const sourceResistance = h.sourceImpedance ?? DEFAULT_SOURCE_RESISTANCE;
  const sourceNote =
    h.sourceImpedance == null
      ? `; source ${DEFAULT_SOURCE_RESISTANCE} Ω assumed (stiff supply, no source)`
      : '';
  const name = HAZARD_NAMES[kind] ?? 'Hazard';
  const tolerance = settings.supplyTolerance;

  if (hazardCurrentKind(h) === 'dc') {
    const scaled = kind === 'dc-supply';
    const voltage = tidy(
      scaled ? nominal * (settings.dcSupplyMax / 24) : nominal * (1 + tolerance),
    );
    const basis = scaled
      ? nominal === 24 && Math.abs(settings.dcSupplyMax - 28.8) < 1e-9
        ? `IEC 61131-2: 24 V DC +20 % → 28.8 V`
        : `project DC supply maximum ${settings.dcSupplyMax} V for 24 V, scaled to ${nominal} V → ${voltage} V`
      : `project supply tolerance: ${nominal} V DC +${percent(tolerance)} → ${voltage} V`;
    return {
      ok: true,
      case: {
        id: `${kind}:dc`,
        label: `${name} ${voltage} V DC`,
        basis: basis + sourceNote,
        stress: { kind: 'dc', voltage, sourceResistance },
        appliedTo,
        peakVoltage: voltage,
      },
    };
  }

  const lineLine = settings.faultMode === 'line-line' && kind !== 'mains-neutral';
  const frequency = h.frequency ?? settings.frequency ?? 50;
  const frequencyNote = h.frequency == null && settings.frequency == null ? '; 50 Hz assumed' : '';
  const maxLe = tidy(nominal * (1 + tolerance));
  let rms = maxLe;
  let basis = mainsBasis(nominal, tolerance, maxLe);
  if (lineLine) {
    const { ratio, basis: llBasis } = lineToLineRatio(settings);
    rms = tidy(nominal * ratio * (1 + tolerance));
    basis += `; ${llBasis} → ${rms} V rms`;
  }
  if (kind === 'mains-neutral')
    basis +=
      '; neutral taken at line potential (reversed feed or open neutral; common practice, no source)';
  const mode = lineLine ? 'line-line' : 'line-earth';
  return {
    ok: true,
    case: {
      id: `${kind}:${mode}`,
      label: `${name} ${rms} V rms ${frequency} Hz ${lineLine ? 'line-to-line' : 'line-to-earth'}`,
      basis: basis + frequencyNote + sourceNote,
      stress: { kind: 'ac', rmsVoltage: rms, frequency, sourceResistance },
      appliedTo,
      peakVoltage: rms * Math.SQRT2,
    },
  };
}

/**
 * The project-wide transients every channel gets, on its signal terminal, exposed or not:
 * IEC 61000-4-5 combination wave at the project's level and coupling, and IEC 61000-4-2
 * contact discharge at the project's level (150 pF / 330 Ω: memory); both polarities unless
 * the project asks for positive only. A level of 0 leaves that case out.
 */
export function transientCases(settings: ProjectSettings): AuditCase[] {
  const polarities = settings.transientPolarity === 'positive' ? [1] : [1, -1];
  const out: AuditCase[] = [];
  const coupling = SURGE_COUPLING_RESISTANCE[settings.surgeCoupling];
  const couplingTag = settings.surgeCoupling === 'line-earth' ? ' (memory)' : '';
  for (const sign of polarities) {
    if (settings.surgeLevelKv > 0) {
      const v = sign * settings.surgeLevelKv * 1000;
      out.push({
        id: sign > 0 ? 'surge+' : 'surge-',
        label: `Surge ${sign > 0 ? '+' : '−'}${settings.surgeLevelKv} kV, ${settings.surgeCoupling} coupling`,
        basis: `IEC 61000-4-5 combination wave 1.2/50 µs – 8/20 µs, ${settings.surgeLevelKv} kV, 2 Ω + ${coupling} Ω ${settings.surgeCoupling} coupling${couplingTag}`,
        stress: { kind: 'surge', peakVoltage: v, couplingResistance: coupling },
        appliedTo: 'signal',
        peakVoltage: Math.abs(v),
      });
    }
  }
  for (const sign of polarities) {
    if (settings.esdLevelKv > 0) {
      const v = sign * settings.esdLevelKv * 1000;
      out.push({
        id: sign > 0 ? 'esd+' : 'esd-',
        label: `ESD ${sign > 0 ? '+' : '−'}${settings.esdLevelKv} kV contact`,
        basis: `IEC 61000-4-2 contact discharge ${settings.esdLevelKv} kV, 150 pF / 330 Ω (memory)`,
        stress: { kind: 'esd', voltage: v },
        appliedTo: 'signal',
        peakVoltage: Math.abs(v),
      });
    }
  }
  return out;
}
