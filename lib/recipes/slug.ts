import { randomInt } from 'node:crypto';
import { slugify } from '@/lib/slug';

const TAIL_ALPHABET = 'abcdefghijklmnopqrstuvwxyz0123456789';
const TAIL_LENGTH = 6;

/**
 * A readable, URL-safe slug from a title, with a short random tail so titles may repeat.
 * Six characters of 36 give about 2.2 billion tails; the caller still retries on the rare clash.
 */
export function slugFor(title: string): string {
  const base = slugify(title, 60) || 'recipe';
  const tail = Array.from({ length: TAIL_LENGTH }, () => TAIL_ALPHABET[randomInt(TAIL_ALPHABET.length)]).join('');
  return `${base}-${tail}`;
}
