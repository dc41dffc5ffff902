/**
 * The audit run's NDJSON progress stream (RULES-audit-api): parsing lines as they arrive and
 * turning a phase's count into one fraction for a single progress bar. Pure.
 */

export type RunLine =
  | { type: 'progress'; phase: string; done: number; total: number }
  | { type: 'done'; runId: number; hash: string; summary: unknown; delta: RunDeltaCounts | null }
  | { type: 'error'; error: string };

export interface RunDeltaCounts {
  previousRunId: number | null;
  inputsChanged: boolean;
  newFindings: number;
  resolvedFindings: number;
  changedFindings: number;
  newChecks: number;
  resolvedChecks: number;
}

/** Share of the bar each phase fills, in run order (solving dominates the time). */
const PHASES: [string, number][] = [
  ['loading', 0.05],
  ['exposures', 0.1],
  ['stress', 0.7],
  ['checks', 0.05],
  ['saving', 0.1],
];

export const PHASE_LABEL: Record<string, string> = {
  loading: 'Reading the schedule',
  exposures: 'Mapping exposures',
  stress: 'Solving the stress cases',
  checks: 'Checking segregation and wire colours',
  saving: 'Saving the findings',
  done: 'Done',
};

export function overallFraction(phase: string, done: number, total: number): number {
  if (phase === 'done') return 1;
  let start = 0;
  for (const [name, share] of PHASES) {
    if (name === phase) {
      const within = total > 0 ? Math.min(1, Math.max(0, done / total)) : 0;
      return start + share * within;
    }
    start += share;
  }
  return 0;
}

/**
 * Splits a growing buffer into complete lines: returns the parsed lines and the unfinished
 * rest. A line that is not JSON becomes an error line naming it (never silently dropped).
 */
export function takeLines(buffer: string): { lines: RunLine[]; rest: string } {
  const parts = buffer.split('\n');
  const rest = parts.pop() ?? '';
  const lines: RunLine[] = [];
  for (const part of parts) {
    const text = part.trim();
    if (!text) continue;
    try {
      lines.push(JSON.parse(text) as RunLine);
    } catch {
      lines.push({
        type: 'error',
        error: `The server sent a line that is not JSON: ${text.slice(0, 80)}`,
      });
    }
  }
  return { lines, rest };
}
