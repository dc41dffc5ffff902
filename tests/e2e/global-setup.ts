import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';

/**
 * Builds the app, gives it a fresh seeded SQLite file, and serves it on E2E_PORT (default 3100)
 * in its own process group, so teardown can stop next start's child server too (STACK.md
 * pitfall 8). Set E2E_BASE_URL to test an already running server instead.
 */
const PORT = process.env.E2E_PORT ?? '3100';
let server: ChildProcess | undefined;

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', env });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed with exit ${r.status}`);
}

async function waitFor(url: string, timeoutMs: number) {
  const start = Date.now();
  while (Date.now() - start < timeoutMs) {
    try {
      const res = await fetch(url, { redirect: 'manual' });
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`The app did not answer at ${url} within ${timeoutMs / 1000} s`);
}

export async function setup() {
  if (process.env.E2E_BASE_URL) return;
  if (!existsSync('/usr/bin/chromium')) {
    throw new Error(
      'Browser tests need Debian Chromium: apt-get install -y chromium (.ci/run does this).',
    );
  }
  const dataDir = path.resolve('data/e2e');
  rmSync(dataDir, { recursive: true, force: true });
  mkdirSync(dataDir, { recursive: true });
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'production',
    SQLITE_PATH: path.join(dataDir, 'crossfault-e2e.sqlite'),
    STORAGE_DIR: path.join(dataDir, 'uploads'),
    NEXTAUTH_SECRET: randomBytes(32).toString('base64'),
    NEXTAUTH_URL: `http://localhost:${PORT}`,
  };
  run('npx', ['tsx', 'scripts/migrate.ts', 'up'], env);
  run('npx', ['tsx', 'scripts/seed.ts', '--reset'], env);
  if (process.env.E2E_SKIP_BUILD !== '1' || !existsSync('.next/BUILD_ID'))
    run('npx', ['next', 'build'], env);
  server = spawn('npx', ['next', 'start', '-p', PORT], { env, stdio: 'inherit', detached: true });
  process.env.E2E_BASE_URL = `http://localhost:${PORT}`;
  await waitFor(`${process.env.E2E_BASE_URL}/sign-in`, 120_000);
}

export async function teardown() {
  if (server?.pid) {
    try {
      process.kill(-server.pid, 'SIGTERM');
    } catch {
      // already gone
    }
  }
}
