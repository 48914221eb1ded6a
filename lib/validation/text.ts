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

function unstorableTextMessage(label: string): string {
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

/** Deeper than any of our documents goes (a recipe is about five levels); deeper is refused. */
const MAX_DEPTH = 32;

/**
 * The path (`fermentables.0.name`) of the first string or key in a parsed value that cannot be
 * stored, or null. route() runs it on every JSON body and query string before the schema, so
 * every field of every route is covered by the same rule. Walks without recursion, and reports
 * a value nested deeper than MAX_DEPTH as `tooDeep`.
 */
export function findUnstorableText(value: unknown): string | { tooDeep: true } | null {
  const stack: { value: unknown; path: string[] }[] = [{ value, path: [] }];
  while (stack.length) {
    const { value: item, path } = stack.pop()!;
    if (typeof item === 'string') {
      if (!isStorableText(item)) return path.join('.') || '(root)';
      continue;
    }
    if (item === null || typeof item !== 'object') continue;
    if (path.length >= MAX_DEPTH) return { tooDeep: true };
    const entries = Object.entries(item);
    for (const [key] of entries) if (!isStorableText(key)) return [...path, key].join('.');
    for (let k = entries.length - 1; k >= 0; k--) stack.push({ value: entries[k][1], path: [...path, entries[k][0]] });
  }
  return null;
}

/** Refuses a parsed value holding unstorable text (a 400 naming the field) or nested too deeply. */
export function assertStorableText(value: unknown, subject = 'request'): void {
  const found = findUnstorableText(value);
  if (!found) return;
  if (typeof found === 'object') {
    throw new AppError('bad_request', subject, `The ${subject} is nested more than ${MAX_DEPTH} levels deep.`);
  }
  const message = unstorableTextMessage('This field');
  throw new AppError('bad_request', subject, `${found}: ${message}`, [{ path: found, message }]);
}
