/**
 * The command-line entry point on good and bad input.
 */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const fixture = fileURLToPath(new URL('./fixtures/trade-120v.json', import.meta.url));

function run(args: string[], input?: string) {
  return spawnSync('npx', ['tsx', 'scripts/stress.ts', ...args], {
    cwd: root,
    input,
    encoding: 'utf8',
    timeout: 60_000,
  });
}

describe('npm run stress', () => {
  it('solves a file and prints the full result as JSON', () => {
    const out = run([fixture]);
    expect(out.status).toBe(0);
    const json = JSON.parse(out.stdout);
    expect(json.verdict).toBe('fails');
    expect(json.results).toHaveLength(3);
    expect(json.results[0].case.kind).toBe('ac');
    expect(json.results[0].elements[0].elementId).toBe('R1');
    expect(json.results[0].sourcePeakCurrent).toBeCloseTo(0.01568, 4);
  });

  it('reads standard input, and returns waveforms on request', () => {
    const request = JSON.parse(readFileSync(fixture, 'utf8'));
    delete request.cases;
    request.case = { kind: 'dc', voltage: '28.8V', sourceResistance: 0 };
    request.waveform = true;
    const out = run([], JSON.stringify(request));
    expect(out.status).toBe(0);
    const json = JSON.parse(out.stdout);
    expect(json.results).toHaveLength(1);
    expect(json.results[0].waveform.traces.map((t: { name: string }) => t.name)).toContain('I(R1)');
  });

  it('bad input: names the field on stderr, exits 2, prints nothing on stdout', () => {
    const out = run(
      [],
      JSON.stringify({
        guard: { stages: [], input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3 } },
        case: { kind: 'ac', rmsVoltage: '230V', frequency: 'fifty', sourceResistance: 0 },
      }),
    );
    expect(out.status).toBe(2);
    expect(out.stdout).toBe('');
    expect(out.stderr).toMatch(/case\.frequency: "fifty" does not start with a number/);
  });

  it('not JSON at all: exit 2 with the parser message', () => {
    const out = run([], '{ nope');
    expect(out.status).toBe(2);
    expect(out.stderr).toMatch(/not valid JSON/);
  });
});
