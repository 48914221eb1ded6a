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
