// Runs once when the server starts: refuse to serve with a bad configuration.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { authSecret, env } = await import('./lib/env');
  env();
  authSecret();
}
