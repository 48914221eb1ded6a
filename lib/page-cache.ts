import { createHash, createHmac } from 'node:crypto';
import { Pool } from 'pg';

/**
 * Recipe pages for signed-out readers, rendered once and kept: a recipe's head page and its version
 * pages look the same to everyone who is not signed in, so each worker renders one copy per state of
 * the recipe and answers every later reader from memory.
 *
 * The cache key is the page's path plus a fingerprint of every row the page shows (the recipe, its
 * owner, comments, stars, brew days, photos and their moderation, proposals, versions, the fork
 * source), read in one query per request. Any change (a new version, comment, star, fork, brew day,
 * proposal, a moderator hiding something, the owner making the recipe private) gives a new
 * fingerprint, so the next request renders afresh: moderation and privacy win at once, on every
 * worker, with no message between them. Private and hidden recipes are never kept.
 *
 * Kept pages carry no nonce: their policy lists the SHA-256 hash of each inline script the framework
 * wrote into that exact HTML, so no other inline script can run.
 */

const PAGE = /^\/recipes\/([a-z0-9-]{1,120})(?:\/v\/([1-9][0-9]{0,6}))?$/;
const MAX_ENTRIES = 400;
/** How long a shared cache (a CDN) may keep a page before asking again: short, so hiding reaches it soon. */
export const PAGE_CACHE_CONTROL = 'public, max-age=0, s-maxage=10, must-revalidate';

interface Entry {
  html: string;
  hashes: string[];
  etag: string;
}

const globalForPages = globalThis as unknown as {
  kfPagePool?: Pool;
  kfPages?: Map<string, Entry>;
  kfPageRenders?: Map<string, Promise<Entry | null>>;
};

function pool(): Pool {
  if (!globalForPages.kfPagePool) {
    globalForPages.kfPagePool = new Pool({
      connectionString: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/kettlefork',
      max: 4,
      connectionTimeoutMillis: 2_000,
      query_timeout: 2_000,
      idleTimeoutMillis: 10_000,
    });
    globalForPages.kfPagePool.on('error', () => undefined);
  }
  return globalForPages.kfPagePool;
}

/** The header that marks the cache's own render request; the same in every worker, unguessable outside. */
export function renderToken(): string {
  return createHmac('sha256', process.env.NEXTAUTH_SECRET ?? 'dev')
    .update('kettlefork page render')
    .digest('hex');
}

/** A signed-out, plain GET of a recipe page (not a client navigation or prefetch), or null. */
export function cacheablePage(request: Request & { nextUrl: URL }): { path: string; slug: string } | null {
  if (request.method !== 'GET' || request.nextUrl.search) return null;
  const h = request.headers;
  if (h.get('rsc') || h.get('next-router-prefetch') || h.get('next-router-state-tree') || h.get('next-action'))
    return null;
  if ((h.get('cookie') ?? '').includes('next-auth.session-token')) return null;
  const match = PAGE.exec(request.nextUrl.pathname);
  return match ? { path: request.nextUrl.pathname, slug: match[1] } : null;
}

const STATE_SQL = `
with r as (select * from recipes where slug = $1)
select r.visibility, r.hidden_at is not null as hidden, md5(concat_ws('|',
  (select row_to_json(r)::text),
  (select row_to_json(u)::text from users u where u.id = r.owner_id),
  (select count(*)::text from recipe_versions v where v.recipe_id = r.id),
  (select count(*)::text from stars s where s.recipe_id = r.id),
  (select row_to_json(fr)::text from recipe_versions fv join recipes fr on fr.id = fv.recipe_id
     where fv.id = r.forked_from_version_id),
  (select string_agg(row_to_json(c)::text || coalesce(row_to_json(cu)::text, ''), ',' order by c.id)
     from comments c left join users cu on cu.id = c.author_id where c.recipe_id = r.id),
  (select string_agg(row_to_json(b)::text || row_to_json(bu)::text, ',' order by b.id)
     from brew_days b join users bu on bu.id = b.brewer_id where b.recipe_id = r.id),
  (select string_agg(row_to_json(p)::text || coalesce(hp.hidden_at::text, ''), ',' order by p.id)
     from photos p join brew_days b on b.id = p.brew_day_id left join hidden_photos hp on hp.photo_id = p.id
     where b.recipe_id = r.id),
  (select string_agg(row_to_json(pr)::text, ',' order by pr.id)
     from proposals pr where pr.source_recipe_id = r.id or pr.fork_recipe_id = r.id)
)) as stamp from r`;

/** The recipe's visibility and the fingerprint of everything its pages show. */
async function recipeState(slug: string): Promise<{ visibility: string; hidden: boolean; stamp: string } | null> {
  const { rows } = await pool().query(STATE_SQL, [slug]);
  return rows[0] ?? null;
}

/** Drops the nonce attributes a normal render put in, and hashes every inline script that is left. */
function prepare(html: string): Entry {
  const clean = html.replace(/(<(?:script|link)\b[^>]*?)\s+nonce="[^"]*"/g, '$1');
  const hashes = new Set<string>();
  for (const m of clean.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)) {
    if (/\bsrc=/.test(m[1])) continue;
    hashes.add(`'sha256-${createHash('sha256').update(m[2]).digest('base64')}'`);
  }
  return {
    html: clean,
    hashes: [...hashes],
    etag: `"${createHash('sha256').update(clean).digest('base64url').slice(0, 27)}"`,
  };
}

function remember(key: string, entry: Entry) {
  const pages = (globalForPages.kfPages ??= new Map());
  pages.delete(key);
  pages.set(key, entry);
  while (pages.size > MAX_ENTRIES) pages.delete(pages.keys().next().value!);
}

async function render(path: string): Promise<Entry | null> {
  const port = process.env.PORT ?? '3000';
  const res = await fetch(`http://127.0.0.1:${port}${path}`, {
    headers: { 'x-kf-page-render': renderToken(), 'accept-encoding': 'identity' },
    redirect: 'manual',
  });
  if (res.status !== 200 || !(res.headers.get('content-type') ?? '').includes('text/html')) return null;
  return prepare(await res.text());
}

/**
 * The kept copy of a signed-out recipe page (rendering it first if this state is new), or null when
 * the page must be rendered per request: a private or hidden recipe, a missing one, a failed render.
 */
export async function keptPage(page: { path: string; slug: string }): Promise<Entry | null> {
  const state = await recipeState(page.slug);
  if (!state || state.visibility === 'private' || state.hidden) return null;
  const key = `${page.path}|${state.stamp}`;
  const hit = globalForPages.kfPages?.get(key);
  if (hit) return hit;
  const renders = (globalForPages.kfPageRenders ??= new Map());
  let pending = renders.get(key);
  if (!pending) {
    pending = render(page.path)
      .then((entry) => {
        if (entry) remember(key, entry);
        return entry;
      })
      .catch(() => null)
      .finally(() => renders.delete(key));
    renders.set(key, pending);
  }
  return pending;
}
