import { z } from 'zod';
import { AppError } from '@/lib/errors';

/**
 * Text from people, for every schema's string fields (bodies, query strings and the recipe
 * document alike). PostgreSQL cannot store a NUL character in text or JSONB, and a lone UTF-16
 * surrogate is not a character at all (it turns into U+FFFD or breaks a JSONB document), so both
 * are refused here with a message naming the field, before anything reaches a query.
 */

// A high surrogate not followed by a low one, or a low one not preceded by a high one.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** True when the string can be stored and shown as sent: no NUL, no lone surrogate. */
export function isStorableText(value: string): boolean {
  return !value.includes('\u0000') && !LONE_SURROGATE.test(value);
}

export function unstorableTextMessage(label: string): string {
  return `${label} contains a character we cannot store (a NUL byte or a broken character); please remove it.`;
}

/**
 * A string field labelled for its messages. `params` are zod's own string parameters (a message
 * for a missing or non-text value); the storable-text check comes first and stops the others.
 */
export function textSchema(label: string, params?: Parameters<typeof z.string>[0]) {
  return z
    .string(params ?? { error: `${label} must be text.` })
    .refine(isStorableText, { error: unstorableTextMessage(label), abort: true });
}

/**
 * The path (`fermentables.0.name`) of the first string or key in a parsed value that cannot be
 * stored, or null. route() runs it on every JSON body and query string before the schema, so
 * every field of every route is covered by the same rule.
 */
export function findUnstorableText(value: unknown, path: string[] = []): string | null {
  if (typeof value === 'string') return isStorableText(value) ? null : path.join('.') || '(root)';
  if (value === null || typeof value !== 'object') return null;
  for (const [key, item] of Object.entries(value)) {
    if (!isStorableText(key)) return [...path, key].join('.');
    const found = findUnstorableText(item, [...path, key]);
    if (found) return found;
  }
  return null;
}

/** Refuses a parsed value holding unstorable text with a 400 naming the field. */
export function assertStorableText(value: unknown, subject = 'request'): void {
  const path = findUnstorableText(value);
  if (!path) return;
  const message = unstorableTextMessage(`This field`);
  throw new AppError('bad_request', subject, `${path}: ${message}`, [{ path, message }]);
}
