/**
 * Memoised solveStress for the audit: many channels share a guard recipe and a hazard, so
 * identical (guard, case, conditions) triples are solved once. Keys are canonical JSON
 * (sorted keys), so two equal guards built separately still hit. Cached results are shared:
 * treat them as read-only.
 */
import { compileGuard, type CompiledNetwork } from './network';
import { solveWithNetwork, type SolveOptions } from './solve';
import type { Guard, StressCase, StressConditions, StressResult } from './types';

const MAX_ENTRIES = 20000;
const results = new Map<string, StressResult>();
const networks = new Map<string, CompiledNetwork>();
const guardKeys = new WeakMap<object, string>();
let hits = 0;
let misses = 0;

/** JSON with object keys sorted, so equal values give equal strings. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const record = value as Record<string, unknown>;
  const keys = Object.keys(record)
    .filter((k) => record[k] !== undefined)
    .sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(record[k])}`).join(',')}}`;
}

function keyOf(value: object): string {
  let key = guardKeys.get(value);
  if (key === undefined) {
    key = canonicalJson(value);
    guardKeys.set(value, key);
  }
  return key;
}

export function solveStressCached(
  guard: Guard,
  stressCase: StressCase,
  conditions: StressConditions,
  options: Pick<SolveOptions, 'waveform' | 'maxWaveformPoints'> = {},
): StressResult {
  const guardKey = keyOf(guard);
  const key = `${guardKey}|${keyOf(stressCase)}|${keyOf(conditions)}|${options.waveform ? `w${options.maxWaveformPoints ?? ''}` : ''}`;
  const cached = results.get(key);
  if (cached) {
    hits++;
    return cached;
  }
  misses++;
  let net = networks.get(guardKey);
  if (!net) {
    net = compileGuard(guard);
    if (networks.size >= MAX_ENTRIES) networks.clear();
    networks.set(guardKey, net);
  }
  const result = solveWithNetwork(guard, net, stressCase, conditions, options);
  if (results.size >= MAX_ENTRIES) results.clear();
  results.set(key, result);
  return result;
}

export function clearStressCache(): void {
  results.clear();
  networks.clear();
  hits = 0;
  misses = 0;
}

export function stressCacheStats(): { hits: number; misses: number; entries: number } {
  return { hits, misses, entries: results.size };
}
