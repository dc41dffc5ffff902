/** Runs once when the server starts: refuse to serve with an unsafe configuration. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { readEnv } = await import('./lib/env');
  try {
    readEnv();
  } catch (error) {
    // Next only logs a failing hook and keeps serving; a server that cannot sign sessions
    // safely must not answer at all.
    console.error(`Crossfault: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  }
}
