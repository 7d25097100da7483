// Runs once when the server starts: a missing or placeholder setting stops it there, with the
// list of what is wrong, instead of on the first request.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { getEnv } = await import('./lib/env');
  getEnv();
}
