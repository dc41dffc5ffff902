// One command from a fresh clone to a running product with demo data on SQLite:
// install (if needed) → migrate → seed (fresh) → build → serve on http://localhost:3000.
// Uses only Node built-ins so it runs before node_modules exists.
import { spawnSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';

function run(cmd, args, env = process.env) {
  console.log(`\n▶ ${cmd} ${args.join(' ')}`);
  const r = spawnSync(cmd, args, { stdio: 'inherit', env });
  if (r.status !== 0) {
    console.error(`✖ ${cmd} ${args.join(' ')} failed (exit ${r.status}).`);
    process.exit(r.status ?? 1);
  }
}

if (!existsSync('node_modules/.package-lock.json')) run('npm', ['ci']);

// A local, random session secret kept under data/ (git-ignored): production mode refuses a weak one.
mkdirSync('data', { recursive: true });
const secretFile = 'data/.nextauth-secret';
if (!existsSync(secretFile))
  writeFileSync(secretFile, randomBytes(32).toString('base64'), { mode: 0o600 });
const port = process.env.PORT ?? '3000';
const env = {
  ...process.env,
  NEXT_TELEMETRY_DISABLED: '1',
  NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? readFileSync(secretFile, 'utf8').trim(),
  NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? `http://localhost:${port}`,
};

run('npm', ['run', 'db:migrate'], env);
run('npm', ['run', 'db:seed', '--', '--reset'], env);
run('npm', ['run', 'build'], env);
console.log(`\n✔ Crossfault with demo data: http://localhost:${port}  (accounts in README.md)\n`);
const server = spawn('npx', ['next', 'start', '-p', port], { stdio: 'inherit', env });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => server.kill(sig));
server.on('exit', (code) => process.exit(code ?? 0));
