/**
 * Stress engine from the command line:
 *   npm run --silent stress -- request.json      (or the JSON on standard input)
 * Prints the full result as JSON. Invalid input: the fields at fault on stderr, exit 2.
 * Input and output are documented in README.md, "Stress engine JSON".
 */
import { readFileSync } from 'node:fs';
import { parseStressRequest, solveStress, StressInputError } from '../lib/stress';

function fail(message: string): never {
  process.stderr.write(`stress: ${message}\n`);
  process.exit(2);
}

function readInput(): string {
  const file = process.argv.slice(2).find((a) => a !== '--');
  if (file && file !== '-') {
    try {
      return readFileSync(file, 'utf8');
    } catch (error) {
      fail(`cannot read ${file}: ${(error as Error).message}`);
    }
  }
  if (process.stdin.isTTY) fail('give a JSON file, or pipe the JSON on standard input');
  return readFileSync(0, 'utf8');
}

const text = readInput();
let json: unknown;
try {
  json = JSON.parse(text);
} catch (error) {
  fail(`input is not valid JSON: ${(error as Error).message}`);
}
try {
  const request = parseStressRequest(json);
  const results = request.cases.map((c) =>
    solveStress(request.guard, c, request.conditions, {
      waveform: request.waveform,
      maxWaveformPoints: request.maxWaveformPoints,
    }),
  );
  const output = {
    verdict: results.reduce(
      (worst, r) => (rank(r.verdict) > rank(worst) ? r.verdict : worst),
      'holds' as (typeof results)[number]['verdict'],
    ),
    conditions: request.conditions,
    results,
  };
  process.stdout.write(`${JSON.stringify(output, null, 2)}\n`);
} catch (error) {
  if (error instanceof StressInputError) fail(`invalid input\n${error.message}`);
  throw error;
}

function rank(v: string): number {
  return ['holds', 'marginal', 'incomplete', 'fails', 'unprotected'].indexOf(v);
}
