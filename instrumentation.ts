/** Runs once when the server starts: refuse to serve with an unsafe configuration. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { readEnv } = await import('./lib/env');
  readEnv();
}
