import { slugify } from '@/lib/slug';

/** A readable, URL-safe slug from a title, with a short random tail so titles may repeat. */
export function slugFor(title: string): string {
  const base = slugify(title, 60) || 'recipe';
  const tail = Array.from(crypto.getRandomValues(new Uint8Array(4)), (b) => (b % 36).toString(36)).join('');
  return `${base}-${tail}`;
}
