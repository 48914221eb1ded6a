import { AppError } from '@/lib/errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** An id from a URL: anything that is not a uuid cannot name a row, so it is simply not found. */
export function idParam(value: string, subject: string): string {
  if (!UUID.test(value)) throw new AppError('not_found', subject);
  return value;
}
