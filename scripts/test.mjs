// The whole test suite, as the README's second command runs it (and .ci/run after installing):
// type check → lint → format check → unit and engine tests (vitest, incl. ngspice) →
// browser tests (vitest driving Debian Chromium through playwright-core against a built app).
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';

const RESULTS = 'data/test-results';
const vitestReport = (name) => [
  '--reporter=default',
  '--reporter=json',
  `--outputFile.json=${RESULTS}/${name}.json`,
];

const steps = [
  ['Type check', 'npx', ['tsc', '--noEmit', '-p', '.']],
  ['Lint', 'npx', ['eslint', '.', '--max-warnings', '0']],
  ['Format', 'npx', ['prettier', '--check', '.']],
  ['Unit, engine and data tests', 'npx', ['vitest', 'run', ...vitestReport('unit')]],
  [
    'Browser tests',
    'npx',
    ['vitest', 'run', '--config', 'vitest.e2e.config.ts', ...vitestReport('browser')],
  ],
];

rmSync(RESULTS, { recursive: true, force: true });
mkdirSync(RESULTS, { recursive: true });

/** Adds up the vitest JSON reports written so far, for one closing line. */
function totals() {
  const sum = { passed: 0, failed: 0, skipped: 0 };
  for (const name of ['unit', 'browser']) {
    const file = `${RESULTS}/${name}.json`;
    if (!existsSync(file)) continue;
    const r = JSON.parse(readFileSync(file, 'utf8'));
    sum.passed += r.numPassedTests ?? 0;
    sum.failed += r.numFailedTests ?? 0;
    sum.skipped += (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
  }
  return `tests: ${sum.passed} passed, ${sum.failed} failed, ${sum.skipped} skipped`;
}

const only = process.argv[2];
for (const [name, cmd, args] of steps) {
  if (only && !name.toLowerCase().includes(only.toLowerCase())) continue;
  console.log(`\n━━ ${name}: ${cmd} ${args.join(' ')}`);
  const r = spawnSync(cmd, args, {
    stdio: 'inherit',
    env: { ...process.env, FORCE_COLOR: '0', NEXT_TELEMETRY_DISABLED: '1' },
  });
  if (r.status !== 0) {
    console.error(`\n✖ ${name} failed (exit ${r.status}).`);
    console.log(totals());
    process.exit(r.status ?? 1);
  }
}
console.log('\n✔ All test steps passed.');
console.log(totals());
