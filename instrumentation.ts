// Runs once when the server starts: refuse to serve with a bad configuration.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { authSecret, env } = await import('./lib/env');
  env();
  authSecret();
  // scripts/request-guard.mjs answers kept recipe pages before Next.js routes them (lib/page-cache.ts).
  const { offerKeptPagesToGuard } = await import('./lib/page-cache');
  offerKeptPagesToGuard();
  // Keeps the search index in step with PostgreSQL, also after a search outage.
  if (process.env.KF_SEARCH_SYNC !== 'off') {
    const { startSearchSyncLoop } = await import('./lib/search/sync');
    startSearchSyncLoop();
  }
  // Sends queued notification e-mails as digests; they wait in the database while SMTP is down.
  if (process.env.KF_EMAIL_SENDER !== 'off') {
    const { startEmailNotificationLoop } = await import('./lib/notifications/email');
    startEmailNotificationLoop();
  }
}
