import { createHash } from 'node:crypto';

/** A recipe's visibility and moderation state: all that decides whether its versions may sit in shared caches. */
export interface CacheableRecipe {
  visibility: 'public' | 'unlisted' | 'private';
  hiddenAt: Date | null;
}

/** Public and unlisted versions that no moderator hid may be kept by any cache; private ones never. */
function sharedCacheable(recipe: CacheableRecipe): boolean {
  return recipe.visibility !== 'private' && !recipe.hiddenAt;
}

const IMMUTABLE = 'public, max-age=31536000, immutable';
const PRIVATE = 'private, no-store';

/** A strong validator from the exact bytes, so a changed byte (an owner's new display name) is a new tag. */
function etagOf(body: string): string {
  return `"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"`;
}

function matches(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  return ifNoneMatch
    .split(',')
    .map((t) => t.trim().replace(/^W\//, ''))
    .some((t) => t === '*' || t === etag);
}

/**
 * A version's JSON or file: immutable with an ETag (and a bodiless 304 when the client already
 * holds it) when shared caches may keep it, `private, no-store` otherwise.
 */
export function versionResponse(
  req: Request,
  recipe: CacheableRecipe,
  body: string,
  headers: Record<string, string>,
): Response {
  if (!sharedCacheable(recipe)) return new Response(body, { headers: { ...headers, 'cache-control': PRIVATE } });
  const etag = etagOf(body);
  const common = { etag, 'cache-control': IMMUTABLE, vary: 'Accept-Encoding' };
  if (matches(req.headers.get('if-none-match'), etag)) return new Response(null, { status: 304, headers: common });
  return new Response(body, { headers: { ...headers, ...common } });
}
