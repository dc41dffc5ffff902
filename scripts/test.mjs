// The whole test suite, as the README's second command runs it (and .ci/run after installing):
// type check → lint → format check → unit and engine tests (vitest, incl. ngspice) →
// browser tests (vitest driving Debian Chromium through playwright-core against a built app).
import { spawnSync } from 'node:child_process';

const steps = [
  ['Type check', 'npx', ['tsc', '--noEmit', '-p', '.']],
  ['Lint', 'npx', ['eslint', '.', '--max-warnings', '0']],
  ['Format', 'npx', ['prettier', '--check', '.']],
  ['Unit, engine and data tests', 'npx', ['vitest', 'run']],
  ['Browser tests', 'npx', ['vitest', 'run', '--config', 'vitest.e2e.config.ts']],
];

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
    process.exit(r.status ?? 1);
  }
}
console.log('\n✔ All test steps passed.');
