import { createHash, createHmac } from 'node:crypto';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';
import Negotiator from 'negotiator';
import { decode } from 'next-auth/jwt';
import { Pool } from 'pg';
import { databaseReachable } from '@/lib/db-health';
import { authSecret } from '@/lib/env';
import { pagePolicy } from '@/lib/http/page-policy';
import { SECURITY_HEADERS } from '@/lib/http/security-headers';
import { searchRecipesWithHints } from '@/lib/search/client';
import { parseSearchParamsLeniently } from '@/lib/search/schemas';

/**
 * Pages rendered once and kept. A public or unlisted recipe's head page and its version pages look
 * the same to everyone in the server's HTML (who is signed in, their stars and follows, the owner's
 * actions and the forms are client islands that ask /api/me and friends), so each worker renders one
 * copy per state of the recipe, signed out, and answers every later reader from memory: signed-out
 * readers, and signed-in ones for whom the state query finds nothing only they may see. A member's
 * page is kept the same way for signed-out readers, and so is a search page: its server HTML is the
 * address a reader asked for and the search engine's answer to it, so it is kept per address and
 * answer. The home page, /about and the guides show nothing but the build's own text, so one copy
 * serves everyone until the next build.
 *
 * A recipe page's cache key is its path plus a fingerprint of every row the page shows (the recipe, its
 * owner, comments, stars, brew days, photos and their moderation, proposals with both their recipes
 * and their proposer, versions and the names of everyone who wrote one, the listed forks' count,
 * the fork source), read in one query per request; a member page's is the member, their recipes and
 * the forks of them, the sources of their own forks, their follower counts, and their brew days with
 * each one's recipe, tastings and photos; a search page's is the engine's whole answer to a
 * signed-out reader's search (hits, totals, facet counts, hints; not its timing), asked on every
 * request, so a recipe hidden or made private leaves the kept search pages as soon as it leaves the
 * index. Any change (a new version, comment, star, fork, brew day, proposal, a moderator hiding
 * something, the owner making the recipe private, a suspension) gives a new fingerprint, so the
 * next request renders afresh: moderation and privacy win at once, on every worker, with no message
 * between them. Private and hidden recipes are never kept, and nothing
 * only the owner, a moderator or one member may see is ever in a kept page.
 *
 * Kept pages carry no nonce: their policy lists the SHA-256 hash of each inline script the framework
 * wrote into that exact HTML, so no other inline script can run. Each is kept gzipped (and
 * brotli-compressed once a reader asks for that), so a reader's answer is a copy of bytes.
 *
 * `keptAnswer` is the whole answer; proxy.ts gives it, and so does scripts/request-guard.mjs
 * (through `KEPT_PAGE_HOOK`, set in instrumentation.ts) before Next.js routes the request at all.
 */

const RECIPE_PAGE = /^\/recipes\/([a-z0-9-]{1,120})(?:\/v\/[1-9][0-9]{0,6})?$/;
const MEMBER_PAGE = /^\/members\/([a-z0-9_-]{1,40})$/;
const SEARCH_PAGE = '/search';
/** Longer addresses than this are rendered for their reader and not kept: no real search needs one. */
const MAX_SEARCH_CHARS = 1_000;
/** Pages whose server HTML is the build's own text, the same for every reader: home, about and the guides. */
const BUILD_PAGE = /^\/(?:about|guides(?:\/[a-z0-9-]{1,80})?)?$/;
/** Paths that answered 404 to a render of ours (an unknown guide), so build pages among them are not asked for again. */
const MAX_MISSING = 200;
const MAX_ENTRIES = 400;
/** How long a shared cache (a CDN) may keep a page before asking again: short, so hiding reaches it soon. */
const PAGE_CACHE_CONTROL = 'public, max-age=0, s-maxage=10, must-revalidate';

interface Entry {
  /** The page as UTF-8, and the same bytes gzipped. */
  body: Buffer;
  gzip: Buffer;
  /** Brotli-compressed, made when a reader first asks for it (the benchmarks and many clients ask only gzip). */
  br?: Promise<Buffer>;
  hashes: string[];
  etag: string;
}

const globalForPages = globalThis as unknown as {
  kfPagePool?: Pool;
  kfPages?: Map<string, Entry>;
  kfPageRenders?: Map<string, Promise<Entry | null>>;
  kfRenderToken?: string;
  kfMissingPages?: Set<string>;
  kfSessionIds?: Map<string, { sid: string; until: number }>;
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
function renderToken(): string {
  return (globalForPages.kfRenderToken ??= createHmac('sha256', authSecret())
    .update('kettlefork page render')
    .digest('hex'));
}

/** The next-auth session cookie, under either of the names next-auth gives it. */
const SESSION_COOKIE = /(?:^|;\s*)(?:__Secure-)?next-auth\.session-token=([^;]+)/;

type PageKind = 'recipe' | 'member' | 'build' | 'search';

interface PageRequest {
  kind: PageKind;
  /** The address the page is kept under and rendered from: the path, and for a search page its query string. */
  path: string;
  /** The recipe's slug or the member's handle; '' for a build page. */
  name: string;
  /** The reader's session cookie (an encrypted token naming their server-side session), if any. */
  sessionCookie: string | null;
}

/** What the cache reads of a request, from a Fetch API request (proxy.ts) or Node's (scripts/request-guard.mjs). */
export interface PlainRequest {
  method: string;
  pathname: string;
  /** The query string with its '?', or '' when there is none. */
  search: string;
  header: (name: string) => string | null;
}

/** A plain GET of a page that may be kept (not a client navigation, prefetch, form action or render of ours), or null. */
function cacheablePage(request: PlainRequest): PageRequest | null {
  if (request.method !== 'GET') return null;
  const isSearch = request.pathname === SEARCH_PAGE;
  if (isSearch ? request.search.length > MAX_SEARCH_CHARS : request.search) return null;
  const h = request.header;
  if (h('rsc') || h('next-router-prefetch') || h('next-router-state-tree') || h('next-action')) return null;
  if (h('x-kf-page-render') === renderToken()) return null;
  const recipe = isSearch ? null : RECIPE_PAGE.exec(request.pathname);
  const member = recipe || isSearch ? null : MEMBER_PAGE.exec(request.pathname);
  const kind: PageKind | null = isSearch
    ? 'search'
    : recipe
      ? 'recipe'
      : member
        ? 'member'
        : BUILD_PAGE.test(request.pathname)
          ? 'build'
          : null;
  if (!kind) return null;
  const cookies = h('cookie') ?? '';
  const session = SESSION_COOKIE.exec(cookies);
  // A session cookie in a shape we do not read (split in chunks, say) is one we cannot vouch for: ''.
  const sessionCookie = session
    ? decodeURIComponent(session[1])
    : cookies.includes('next-auth.session-token')
      ? ''
      : null;
  const path = isSearch ? `${request.pathname}${request.search}` : request.pathname;
  return { kind, path, name: (recipe ?? member)?.[1] ?? '', sessionCookie };
}

const MAX_SESSION_IDS = 2_000;

/**
 * The server-side session id a session cookie names, null when there is no cookie, or undefined
 * when the cookie cannot be read (so the reader gets a render of their own, as before). Decrypting
 * the cookie costs more than the rest of a kept answer, so each worker remembers what a cookie
 * named until the token's own expiry; whether that session still counts (ended, expired,
 * suspended) is asked of the database on every request all the same.
 */
async function sessionIdOf(cookie: string | null): Promise<string | null | undefined> {
  if (cookie === null) return null;
  const known = (globalForPages.kfSessionIds ??= new Map());
  const hit = known.get(cookie);
  if (hit && hit.until > Date.now()) return hit.sid;
  const token = await decode({ token: cookie, secret: authSecret() }).catch(() => null);
  if (typeof token?.sid !== 'string') return undefined;
  const until = typeof token.exp === 'number' ? token.exp * 1000 : Date.now() + 60_000;
  known.delete(cookie);
  known.set(cookie, { sid: token.sid, until });
  while (known.size > MAX_SESSION_IDS) known.delete(known.keys().next().value!);
  return token.sid;
}

/** The columns of a member a recipe page shows (their name and handle); never e-mail, password hash or settings. */
const shownUser = (alias: string) => `json_build_array(${alias}.name, ${alias}.handle)::text`;

/**
 * The recipe's state, and whether the signed-in reader named by `$2` (a session id, or null) sees
 * exactly what a signed-out reader sees apart from the client islands (header, star and follow,
 * owner actions, comment and fork forms). Anything only they or the moderators would see in the
 * server's part of the page sends them to a render of their own: moderators and admins; readers who
 * show US units; their own held or hidden comments, hidden photos, unlisted, private or hidden forks
 * (which their fork count includes), a private or hidden fork source of theirs, proposals they see
 * because they offered or own one side; and the owner of a fork (who gets the proposal form with
 * the recipes it may go to). An unknown, ended or suspended session is a signed-out reader.
 */
const STATE_SQL = `
with r as (select * from recipes where slug = $1),
reader as (
  select u.id, u.role, u.units from sessions s join users u on u.id = s.user_id
  where $2::text is not null and s.session_token = $2::text and s.expires > now() and u.suspended_at is null
)
select r.visibility, r.hidden_at is not null as hidden,
  (not exists (select 1 from reader) or exists (select 1 from reader v where v.role = 'member' and v.units = 'metric'
    and not (r.owner_id = v.id and r.forked_from_version_id is not null)
    and not exists (select 1 from comments c where c.recipe_id = r.id and c.author_id = v.id
      and c.deleted_at is null and (c.status <> 'published' or c.hidden_at is not null))
    and not exists (select 1 from photos p join brew_days b on b.id = p.brew_day_id
      join hidden_photos hp on hp.photo_id = p.id where b.recipe_id = r.id and p.uploader_id = v.id)
    and not exists (select 1 from recipes fk join recipe_versions fv on fv.id = fk.forked_from_version_id
      where fv.recipe_id = r.id and fk.owner_id = v.id and (fk.visibility <> 'public' or fk.hidden_at is not null))
    and not exists (select 1 from recipe_versions sv join recipes sr on sr.id = sv.recipe_id
      where sv.id = r.forked_from_version_id and sr.owner_id = v.id and (sr.visibility = 'private' or sr.hidden_at is not null))
    and not exists (select 1 from proposals pr join recipes ps on ps.id = pr.source_recipe_id
      join recipes pf on pf.id = pr.fork_recipe_id
      where (pr.source_recipe_id = r.id or pr.fork_recipe_id = r.id)
        and v.id in (pr.proposer_id, ps.owner_id, pf.owner_id)
        and (pr.hidden_at is not null or ps.visibility = 'private' or ps.hidden_at is not null
          or pf.visibility = 'private' or pf.hidden_at is not null))
  )) as shared,
  md5(concat_ws('|',
  (select row_to_json(r)::text),
  (select ${shownUser('u')} from users u where u.id = r.owner_id),
  (select count(*)::text from recipe_versions v where v.recipe_id = r.id),
  (select string_agg(${shownUser('vu')}, ',' order by vu.id) from users vu where vu.id in (
     select v.author_id from recipe_versions v where v.recipe_id = r.id
     union select v.co_author_id from recipe_versions v where v.recipe_id = r.id)),
  (select count(*)::text from recipes fk join recipe_versions fv on fv.id = fk.forked_from_version_id
     where fv.recipe_id = r.id and fk.visibility = 'public' and fk.hidden_at is null),
  (select count(*)::text from stars s where s.recipe_id = r.id),
  (select row_to_json(fr)::text || ${shownUser('fu')} from recipe_versions fv
     join recipes fr on fr.id = fv.recipe_id join users fu on fu.id = fr.owner_id
     where fv.id = r.forked_from_version_id),
  (select string_agg(row_to_json(c)::text || coalesce(${shownUser('cu')}, ''), ',' order by c.id)
     from comments c left join users cu on cu.id = c.author_id where c.recipe_id = r.id),
  (select string_agg(row_to_json(b)::text || ${shownUser('bu')}, ',' order by b.id)
     from brew_days b join users bu on bu.id = b.brewer_id where b.recipe_id = r.id),
  (select string_agg(row_to_json(p)::text || coalesce(hp.hidden_at::text, ''), ',' order by p.id)
     from photos p join brew_days b on b.id = p.brew_day_id left join hidden_photos hp on hp.photo_id = p.id
     where b.recipe_id = r.id),
  (select string_agg(row_to_json(pr)::text || json_build_array(ps.slug, ps.title, ps.owner_id, ps.visibility,
       ps.hidden_at, pf.slug, pf.title, pf.owner_id, pf.visibility, pf.hidden_at)::text || ${shownUser('pu')},
       ',' order by pr.id)
     from proposals pr join recipes ps on ps.id = pr.source_recipe_id join recipes pf on pf.id = pr.fork_recipe_id
     join users pu on pu.id = pr.proposer_id
     where pr.source_recipe_id = r.id or pr.fork_recipe_id = r.id)
)) as stamp from r`;

interface RecipeState {
  visibility: string;
  hidden: boolean;
  /** The reader sees the page everyone shares (always so for a signed-out one). */
  shared: boolean;
  stamp: string;
}

/** The recipe's visibility, whether this reader sees the shared page, and the fingerprint of everything its pages show. */
async function recipeState(slug: string, sessionId: string | null): Promise<RecipeState | null> {
  // A named statement: each connection plans this many-part query once (planning it cost several
  // times its 0.5 ms run on every request) and then only runs it.
  const { rows } = await pool().query({ name: 'kf-recipe-page-state', text: STATE_SQL, values: [slug, sessionId] });
  return rows[0] ?? null;
}

/** How many recipe cards a member page lists (lib/recipes/listing.ts), one more telling whether there are more. */
const MEMBER_PAGE_RECIPES = 24;

/**
 * A member page's fingerprint, for signed-out readers: the member as shown (a suspended one is a
 * 404 and never kept); the listed recipes the page shows (title, moderation, stars, head) and the
 * forks of them (the listed-fork counts); the stars all their listed recipes received; their 50
 * newest listed forks and the recipes those came from; follower and following counts; their brew
 * days with each one's recipe, tastings and photos and those photos' moderation.
 */
const MEMBER_STATE_SQL = `
with m as (select * from users where handle = $1),
listed as (select r.* from recipes r, m where r.owner_id = m.id and r.visibility = 'public' and r.hidden_at is null),
shown as (select * from listed order by updated_at desc limit ${MEMBER_PAGE_RECIPES + 1}),
own_forks as (select * from listed where forked_from_version_id is not null order by created_at desc limit 50)
select m.suspended_at is not null as hidden,
  md5(concat_ws('|',
  json_build_array(m.id, m.name, m.handle, m.bio, m.created_at)::text,
  (select string_agg(row_to_json(r)::text, ',' order by r.updated_at, r.id) from shown r),
  (select coalesce(sum(star_count), 0)::text from listed),
  (select string_agg(json_build_array(fk.id, fk.visibility, fk.hidden_at)::text, ',' order by fk.id)
     from shown src join recipe_versions fv on fv.recipe_id = src.id
     join recipes fk on fk.forked_from_version_id = fv.id),
  (select string_agg(row_to_json(fk)::text || row_to_json(src)::text, ',' order by fk.id)
     from own_forks fk join recipe_versions fv on fv.id = fk.forked_from_version_id
     join recipes src on src.id = fv.recipe_id),
  (select count(*)::text from member_follows f where f.followee_id = m.id),
  (select count(*)::text from member_follows f where f.follower_id = m.id),
  (select string_agg(row_to_json(b)::text || row_to_json(br)::text, ',' order by b.id)
     from brew_days b join recipes br on br.id = b.recipe_id where b.brewer_id = m.id),
  (select string_agg(row_to_json(t)::text, ',' order by t.id)
     from tastings t join brew_days b on b.id = t.brew_day_id where b.brewer_id = m.id),
  (select string_agg(p.id || ':' || coalesce(hp.hidden_at::text, ''), ',' order by p.id)
     from photos p join brew_days b on b.id = p.brew_day_id left join hidden_photos hp on hp.photo_id = p.id
     where b.brewer_id = m.id)
)) as stamp from m`;

/**
 * A search page's fingerprint: the engine's answer to the page's own search for a signed-out reader,
 * read the way the page reads it. Everything the page shows of it counts; the engine's timing does
 * not. An engine that cannot answer throws, and the reader gets a render of their own (which says so).
 */
async function searchStamp(path: string): Promise<string> {
  const params = new URLSearchParams(path.slice(SEARCH_PAGE.length));
  const { processingTimeMs: _timing, ...shown } = await searchRecipesWithHints(
    parseSearchParamsLeniently(params).query,
    null,
  );
  return createHash('sha256').update(JSON.stringify(shown)).digest('base64url');
}

/** The fingerprint a kept copy of this page is filed under, or null when this reader gets a render of their own. */
async function stampOf(page: PageRequest): Promise<string | null> {
  if (page.kind === 'build') return globalForPages.kfMissingPages?.has(page.path) ? null : 'build';
  // Signed-in readers also find their own unlisted and private recipes: they get their own render.
  if (page.kind === 'search') return page.sessionCookie === null ? searchStamp(page.path) : null;
  if (page.kind === 'member') {
    // Signed-in readers may see more of a member (their own page, moderators): they get their own render.
    if (page.sessionCookie !== null) return null;
    const { rows } = await pool().query<{ hidden: boolean; stamp: string }>({
      name: 'kf-member-page-state',
      text: MEMBER_STATE_SQL,
      values: [page.name],
    });
    return rows[0] && !rows[0].hidden ? rows[0].stamp : null;
  }
  const sessionId = await sessionIdOf(page.sessionCookie);
  if (sessionId === undefined) return null;
  const state = await recipeState(page.name, sessionId);
  if (!state || state.visibility === 'private' || state.hidden || !state.shared) return null;
  return state.stamp;
}

const gzipAsync = promisify(gzip);
const brotliAsync = promisify(brotliCompress);

/**
 * Drops the nonce a normal render put in (the attributes, and its copies in the framework's inline
 * payload, so every worker keeps the very same bytes for one state), hashes every inline script
 * that is left, and gzips the page once for all its readers (off the event loop, in zlib's threads).
 */
async function prepare(html: string, nonce: string | undefined): Promise<Entry> {
  const stripped = html.replace(/(<(?:script|link)\b[^>]*?)\s+nonce="[^"]*"/g, '$1');
  const clean = nonce ? stripped.split(nonce).join('') : stripped;
  const hashes = new Set<string>();
  for (const m of clean.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)) {
    if (/\bsrc=/.test(m[1])) continue;
    hashes.add(`'sha256-${createHash('sha256').update(m[2]).digest('base64')}'`);
  }
  const body = Buffer.from(clean, 'utf8');
  return {
    body,
    gzip: await gzipAsync(body),
    hashes: [...hashes],
    etag: `"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"`,
  };
}

/**
 * The kept page brotli-compressed, made once per entry. Quality 6: within a tenth of the best
 * size at a fiftieth of its time (measured on the busiest demo page).
 */
function brotliOf(entry: Entry): Promise<Buffer> {
  entry.br ??= brotliAsync(entry.body, {
    params: { [constants.BROTLI_PARAM_QUALITY]: 6, [constants.BROTLI_PARAM_SIZE_HINT]: entry.body.length },
  }).catch((err: unknown) => {
    entry.br = undefined;
    throw err;
  });
  return entry.br;
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
  if (res.status === 404 && BUILD_PAGE.test(path)) rememberMissing(path);
  if (res.status !== 200 || !(res.headers.get('content-type') ?? '').includes('text/html')) return null;
  const nonce = /'nonce-([^']+)'/.exec(res.headers.get('content-security-policy') ?? '')?.[1];
  return prepare(await res.text(), nonce);
}

/**
 * The kept copy of a page (rendering it first if this state is new), or null when the page must be
 * rendered for this request: a private or hidden recipe, a missing one, a suspended member, a failed
 * render, or a signed-in reader who would see more than the shared page shows.
 */
async function keptPage(page: PageRequest): Promise<Entry | null> {
  const stamp = await stampOf(page);
  if (stamp === null) return null;
  const key = `${page.path}|${stamp}`;
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

function rememberMissing(path: string) {
  const missing = (globalForPages.kfMissingPages ??= new Set());
  missing.add(path);
  if (missing.size > MAX_MISSING) missing.delete(missing.values().next().value!);
}

export interface KeptAnswer {
  status: 200 | 304;
  headers: Record<string, string>;
  /** Null for a 304. */
  body: Buffer | null;
}

/** The encodings a kept page is stored in, best first; the reader's Accept-Encoding picks (RFC 9110, section 12.5.3). */
const ENCODINGS = ['br', 'gzip', 'identity'];

function pickEncoding(acceptEncoding: string | null): 'br' | 'gzip' | 'identity' {
  const negotiator = new Negotiator({ headers: { 'accept-encoding': acceptEncoding ?? undefined } });
  // negotiator 1.0 breaks ties of equal quality by our order ("gzip, deflate, br" gets br); its types predate that.
  const choose = negotiator.encoding.bind(negotiator) as (
    available: string[],
    options: { preferred: string[] },
  ) => string | undefined;
  const chosen = choose(ENCODINGS, { preferred: ENCODINGS });
  return chosen === 'br' || chosen === 'gzip' ? chosen : 'identity';
}

/**
 * The whole answer to a request for a kept recipe page (a 304 when the reader's copy is current),
 * or null when the request is not one for a kept page and must go on to the app: not a plain GET of
 * a recipe page, the database unreachable (the app answers its 503), or anything `keptPage` refuses.
 * `encoded`: send the stored gzip or brotli copy the reader accepts. Not from proxy.ts: Next.js drops
 * a proxy answer's Content-Encoding and compresses the body itself.
 */
export async function keptAnswer(request: PlainRequest, { encoded }: { encoded: boolean }): Promise<KeptAnswer | null> {
  const page = cacheablePage(request);
  if (!page || !(await databaseReachable())) return null;
  const kept = await keptPage(page).catch(() => null);
  if (!kept) return null;
  const headers: Record<string, string> = Object.fromEntries(SECURITY_HEADERS.map((h) => [h.key, h.value]));
  headers['cache-control'] = PAGE_CACHE_CONTROL;
  headers.etag = kept.etag;
  headers.vary = 'Cookie, Accept-Encoding';
  headers['content-security-policy'] = pagePolicy(kept.hashes.join(' '));
  if (request.header('if-none-match') === kept.etag) return { status: 304, headers, body: null };
  const encoding = encoded ? pickEncoding(request.header('accept-encoding')) : 'identity';
  const body = encoding === 'br' ? await brotliOf(kept) : encoding === 'gzip' ? kept.gzip : kept.body;
  headers['content-type'] = 'text/html; charset=utf-8';
  if (encoding !== 'identity') headers['content-encoding'] = encoding;
  headers['content-length'] = String(body.length);
  return { status: 200, headers, body };
}

/**
 * The global scripts/request-guard.mjs looks for: a function taking Node's request and giving its
 * KeptAnswer or null. instrumentation.ts sets it when the server starts.
 */
const KEPT_PAGE_HOOK = '__kettleforkKeptPage';

/** Lets scripts/request-guard.mjs answer kept pages before Next.js routes the request. */
export function offerKeptPagesToGuard(): void {
  (globalThis as Record<string, unknown>)[KEPT_PAGE_HOOK] = (req: {
    method?: string;
    url?: string;
    headers: Record<string, string | string[] | undefined>;
  }) => {
    const url = req.url ?? '/';
    const q = url.indexOf('?');
    return keptAnswer(
      {
        method: req.method ?? 'GET',
        pathname: q === -1 ? url : url.slice(0, q),
        search: q === -1 || q === url.length - 1 ? '' : url.slice(q),
        header: (name) => {
          const value = req.headers[name];
          return Array.isArray(value) ? value.join(', ') : (value ?? null);
        },
      },
      { encoded: true },
    );
  };
}
