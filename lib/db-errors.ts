// Errors that mean "the database cannot be reached right now" rather than a bug.
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  '57P01',
  '57P02',
  '57P03',
  '08000',
  '08001',
  '08003',
  '08004',
  '08006',
]);

export function isDatabaseUnavailable(err: unknown): boolean {
  let e: unknown = err;
  for (let depth = 0; e && depth < 4; depth++) {
    const code = (e as { code?: string }).code;
    const message = (e as { message?: string }).message ?? '';
    if (code && UNAVAILABLE_CODES.has(code)) return true;
    if (
      /Connection terminated|timeout exceeded when trying to connect|Query read timeout|the database system is (starting up|shutting down)/i.test(
        message,
      )
    ) {
      return true;
    }
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

/**
 * The constraint a unique violation (SQLSTATE 23505) broke, or null when the error is something else.
 * Drizzle wraps the driver's error (DrizzleQueryError), so the code is looked for along the cause chain.
 */
export function uniqueViolation(err: unknown): { constraint: string | null } | null {
  let e: unknown = err;
  for (let depth = 0; e && depth < 4; depth++) {
    const { code, constraint } = e as { code?: string; constraint?: string };
    if (code === '23505') return { constraint: constraint ?? null };
    e = (e as { cause?: unknown }).cause;
  }
  return null;
}

/**
 * What may go into the server log about an error. A failed Drizzle query's own message and stack
 * carry the query's parameters (a password hash, an e-mail address), so for those only the
 * driver's error is described (its message, SQLSTATE, constraint and stack) and the query's text
 * without its values.
 */
export function loggableError(err: unknown): string {
  const wrapper = err as { query?: unknown; params?: unknown; cause?: unknown };
  if (err instanceof Error && typeof wrapper.query === 'string' && 'params' in wrapper) {
    const cause = wrapper.cause as (Error & { code?: string; constraint?: string; detail?: string }) | undefined;
    const facts = [cause?.code && `code ${cause.code}`, cause?.constraint && `constraint ${cause.constraint}`]
      .filter(Boolean)
      .join(', ');
    return [
      `database query failed: ${cause?.message ?? 'no driver error'}${facts ? ` (${facts})` : ''}`,
      `query: ${wrapper.query}`,
      cause?.stack?.split('\n').slice(1).join('\n') ?? '',
    ]
      .filter(Boolean)
      .join('\n');
  }
  return err instanceof Error ? (err.stack ?? err.message) : String(err);
}
