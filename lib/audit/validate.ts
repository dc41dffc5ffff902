import { LIKELIHOOD_CLASSES } from '../exposure/types';
import { applyGuardOverrides } from '../presets/overrides';
import { guardShapeProblems } from '../presets/guard-shape';
import type { Guard } from '../stress/types';
import type { ProjectSnapshot } from './types';

/**
 * Bad audit input: every problem, keyed by the path of the field (e.g.
 * `channels[FT-101].guardOverrides`), in the `fieldErrors` shape the route layer maps to 422.
 * Nothing is computed when it is thrown.
 */
export class AuditInputError extends Error {
  constructor(readonly fieldErrors: Record<string, string[]>) {
    const first = Object.entries(fieldErrors)[0];
    super(
      `audit input is not valid: ${first ? `${first[0]}: ${first[1][0]}` : 'unknown problem'}${Object.keys(fieldErrors).length > 1 ? ` (and ${Object.keys(fieldErrors).length - 1} more)` : ''}`,
    );
    this.name = 'AuditInputError';
  }
}

const CIRCUIT_CLASSES = new Set(['hazard', 'sensitive', 'return', 'earth', 'spare', 'barrier']);
const HAZARD_KINDS = new Set([
  'mains-line',
  'mains-neutral',
  'dc-supply',
  'motor-output',
  'heater-output',
  'other',
]);

/** Problems of a snapshot, by field path; empty when it can be audited. */
export function snapshotProblems(s: ProjectSnapshot): Record<string, string[]> {
  const problems: Record<string, string[]> = {};
  const add = (path: string, message: string) => (problems[path] ??= []).push(message);
  const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

  const st = s.settings;
  if (!st || typeof st !== 'object') {
    add('settings', 'settings are required');
  } else {
    if (!finite(st.supplyTolerance) || st.supplyTolerance < 0 || st.supplyTolerance > 0.5)
      add('settings.supplyTolerance', 'must be a fraction from 0 to 0.5');
    if (!finite(st.dcSupplyMax) || st.dcSupplyMax <= 0)
      add('settings.dcSupplyMax', 'must be a voltage above 0 V');
    if (!finite(st.ambientC)) add('settings.ambientC', 'must be a temperature in °C');
    if (!finite(st.surgeLevelKv) || st.surgeLevelKv < 0)
      add('settings.surgeLevelKv', 'must be 0 kV or more');
    if (!finite(st.esdLevelKv) || st.esdLevelKv < 0)
      add('settings.esdLevelKv', 'must be 0 kV or more');
    for (const f of ['powerDerating', 'voltageDerating'] as const) {
      if (!finite(st[f]) || st[f] <= 0 || st[f] > 1)
        add(`settings.${f}`, 'must be a fraction above 0 and at most 1');
    }
    if (!['line-earth', 'line-line', 'signal'].includes(st.surgeCoupling))
      add('settings.surgeCoupling', 'must be line-earth, line-line or signal');
    if (!['line-earth', 'line-line'].includes(st.faultMode))
      add('settings.faultMode', 'must be line-earth or line-line');
    if (!['iec60204-1', 'nfpa79', 'none'].includes(st.wireColourConvention))
      add('settings.wireColourConvention', 'must be iec60204-1, nfpa79 or none');
    if (st.transientPolarity != null && !['both', 'positive'].includes(st.transientPolarity))
      add('settings.transientPolarity', 'must be both or positive');
    if (st.nominalVoltage != null && (!finite(st.nominalVoltage) || st.nominalVoltage <= 0))
      add('settings.nominalVoltage', 'must be a voltage above 0 V');
    if (st.frequency != null && (!finite(st.frequency) || st.frequency <= 0))
      add('settings.frequency', 'must be a frequency above 0 Hz');
    for (const [k, w] of Object.entries(st.likelihoodWeights ?? {})) {
      if (!(LIKELIHOOD_CLASSES as readonly string[]).includes(k))
        add(
          `settings.likelihoodWeights.${k}`,
          `is not a likelihood class (${LIKELIHOOD_CLASSES.join(', ')})`,
        );
      else if (!finite(w) || w < 0) add(`settings.likelihoodWeights.${k}`, 'must be a number ≥ 0');
    }
  }

  const unique = (list: { id: string }[], what: string) => {
    const seen = new Set<string>();
    for (const x of list) {
      if (typeof x.id !== 'string' || x.id === '')
        add(`${what}`, 'every id must be a non-empty string');
      else if (seen.has(x.id)) add(`${what}[${x.id}]`, 'id is used twice');
      seen.add(x.id);
    }
    return seen;
  };
  const cabinetIds = unique(s.cabinets, 'cabinets');
  const stripIds = unique(s.strips, 'strips');
  const terminalIds = unique(s.terminals, 'terminals');
  unique(s.channels, 'channels');
  const guardIds = unique(s.guards, 'guards');

  for (const strip of s.strips) {
    if (!cabinetIds.has(strip.cabinetId))
      add(`strips[${strip.id}].cabinetId`, `no cabinet "${strip.cabinetId}"`);
  }
  for (const t of s.terminals) {
    const at = `terminals[${t.id}]`;
    if (!stripIds.has(t.stripId)) add(`${at}.stripId`, `no strip "${t.stripId}"`);
    if (!Number.isInteger(t.position)) add(`${at}.position`, 'must be a whole number');
    if (t.level != null && !Number.isInteger(t.level)) add(`${at}.level`, 'must be a whole number');
    if (!CIRCUIT_CLASSES.has(t.circuitClass))
      add(`${at}.circuitClass`, `must be one of ${[...CIRCUIT_CLASSES].join(', ')}`);
    if (t.hazardKind != null && !HAZARD_KINDS.has(t.hazardKind))
      add(`${at}.hazardKind`, `must be one of ${[...HAZARD_KINDS].join(', ')}`);
    for (const f of ['nominalVoltage', 'frequency', 'sourceImpedance'] as const) {
      const v = t[f];
      if (v != null && (!finite(v) || v < 0)) add(`${at}.${f}`, 'must be a number ≥ 0');
    }
    if (typeof t.label !== 'string' || t.label === '') add(`${at}.label`, 'is required');
  }

  const tags = new Set<string>();
  const recipes = new Map(s.guards.map((g) => [g.id, g.guard] as [string, Guard]));
  for (const g of s.guards) {
    for (const p of guardShapeProblems(g.guard)) add(`guards[${g.id}]`, p);
  }
  for (const c of s.channels) {
    const at = `channels[${c.tag || c.id}]`;
    if (typeof c.tag !== 'string' || c.tag === '') add(`channels[${c.id}].tag`, 'is required');
    else if (tags.has(c.tag)) add(`${at}.tag`, 'tag is used by another channel');
    tags.add(c.tag);
    if (!terminalIds.has(c.signalTerminalId))
      add(`${at}.signalTerminalId`, `no terminal "${c.signalTerminalId}"`);
    if (c.returnTerminalId != null) {
      if (!terminalIds.has(c.returnTerminalId))
        add(`${at}.returnTerminalId`, `no terminal "${c.returnTerminalId}"`);
      if (c.returnTerminalId === c.signalTerminalId)
        add(`${at}.returnTerminalId`, 'must differ from the signal terminal');
    }
    if (c.guardRecipeId != null) {
      const recipe = recipes.get(c.guardRecipeId);
      if (!guardIds.has(c.guardRecipeId) || !recipe)
        add(`${at}.guardRecipeId`, `no guard recipe "${c.guardRecipeId}"`);
      else if (c.guardOverrides && guardShapeProblems(recipe).length === 0) {
        for (const p of applyGuardOverrides(recipe, c.guardOverrides).problems)
          add(`${at}.guardOverrides`, p);
      }
    } else if (c.guardOverrides && Object.keys(c.guardOverrides).length > 0) {
      add(`${at}.guardOverrides`, 'overrides need a guard recipe to apply to');
    }
  }
  return problems;
}

export function assertAuditable(s: ProjectSnapshot): void {
  const problems = snapshotProblems(s);
  if (Object.keys(problems).length > 0) throw new AuditInputError(problems);
}
