/**
 * Client-side check of a terminal change with the same rules the server applies
 * (lib/validation/terminal): field rules on the change, then the hazard facts on the record
 * as it would stand after it. Returns field → first message; empty when it would be accepted.
 */
import { terminalChangesSchema, terminalFactsProblems } from '@/lib/validation/terminal';
import type { TerminalFields, TerminalRow } from './types';

export function validateTerminalChanges(
  row: TerminalRow,
  changes: Partial<TerminalFields>,
): Record<string, string> {
  const out: Record<string, string> = {};
  const parsed = terminalChangesSchema.safeParse(changes);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0] ?? '_');
      out[field] ??= issue.message;
    }
    return out;
  }
  const merged = { ...row, ...parsed.data };
  for (const [field, messages] of Object.entries(terminalFactsProblems(merged))) {
    // Blame the field the user touched when the rule spans several.
    const blamed = field in changes ? field : (Object.keys(changes)[0] ?? field);
    out[blamed] ??= messages[0];
  }
  return out;
}
