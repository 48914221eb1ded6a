import { z } from 'zod';
import { AppError } from '@/lib/errors';

/**
 * The one shape of a row id, in bodies, query strings and paths: a UUID as our tables hand them
 * out. Anything else (all dashes, the wrong length, braces) names no row and never reaches a query.
 */
const idSchema = z.uuid({ error: 'That is not an id.' });

/** A row id with a message naming what it should point at. */
export function idOf(message: string) {
  return z.uuid({ error: message });
}

/** True for a well-formed id: for code that takes an id outside a schema (a page's path, a stored link). */
function isId(value: unknown): value is string {
  return idSchema.safeParse(value).success;
}

/** The path parameters of a route about one row: `route({ params: idParams('recipe') }, …)`. */
export function idParams(subject: string) {
  return z.object({ id: idOf(`No such ${subject}.`) });
}

/** An id taken outside a schema (a page's path, a stored link): anything else names no row, so it is not found. */
export function requireId(value: string, subject: string): string {
  if (!isId(value)) throw new AppError('not_found', subject);
  return value;
}
