// npm run load — mixed traffic against the production build served on every core (scripts/serve.mjs):
// page readers, API readers and members saving versions, all at once, closed loop, loopback only.
// A scratch database holds the demo world plus 10,000 generated recipes. Every request's latency
// (send to last byte of the body) and status is kept per route; the report gives exact p50/p95/p99
// against the targets and goes to bench/LOAD.md. Exits non-zero on a 5xx, a request left without an
// answer, a 2xx save missing from the database, or a broken setup; a missed latency target is
// reported, not a failure.
//
//   KF_LOAD_CLIENTS=10 KF_LOAD_SECONDS=10 npm run load   # a quick smoke run
//   KF_LOAD_BUILD=skip npm run load                      # reuse the build already in .next-load
import { execFileSync } from 'node:child_process';
import http from 'node:http';
import { readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { pathToFileURL } from 'node:url';
import { drizzle } from 'drizzle-orm/node-postgres';
import { Client, Pool } from 'pg';
import { bulkLoadRecipes } from '../../bench/generate';
import { measureSpeed, type SpeedResult } from '../../bench/page-speed';
import { quantile, round } from '../../bench/stats';
import * as schema from '../../db/schema';
import { runQuiet, scratchDatabase, sleep, startChild, stopChildren, waitFor } from './processes';

const APP_PORT = 3960;
const SEARCH_PORT = 7796;
const SMTP_PORT = 2597;
const OUTBOX_PORT = 2598;
const S3_PORT = 4597;
const DATABASE = 'kettlefork_load';
const DIST_DIR = '.next-load';
const BASE = `http://127.0.0.1:${APP_PORT}`;

const PAGE_P95_TARGET_MS = 200;
const API_READ_P95_TARGET_MS = 100;
const REQUEST_TIMEOUT_MS = 30_000;
const WARMUP_SECONDS = 5;
/** Demo members who own recipes; savers sign in as these, one each, and save to their own recipe. */
const SAVER_HANDLES = [
  'wren',
  'kofi',
  'ilse',
  'hollis',
  'marisol',
  'dov',
  'agnieszka',
  'bastian',
  'juniper',
  'tamsin',
  'rufus',
  'ottoline',
];
const DEMO_PASSWORD = 'mash-paddle-demo';

/** Searches as readers type them: words, ingredient and style filters, ranges, sorts and later pages. */
const SEARCHES = [
  'q=bench',
  'q=pale',
  'q=stout',
  'q=kveik',
  'q=saaz',
  'q=porter',
  'q=cascade&sort=newest',
  'hop=Cascade',
  'hop=Saaz&hop=Magnum',
  'style=18B',
  'malt=Munich+malt',
  'yeast=Clean+ale+yeast',
  'abvMin=4&abvMax=6',
  'ibuMin=30&ibuMax=60&sort=stars',
  'q=bench&srmMin=5&srmMax=15',
  'q=recipe&sort=newest&page=3',
  'ogMin=1.04&ogMax=1.06',
];

export type RouteKind = 'page' | 'api read' | 'write';

export interface LoadOptions {
  /** Concurrent clients; KF_LOAD_CLIENTS or 50. Split 60 % page readers, 30 % API readers, 10 % savers. */
  clients?: number;
  /** Length of the measured run; KF_LOAD_SECONDS or 60. */
  seconds?: number;
  /** Generated recipes added to the demo world (10,000). */
  recipes?: number;
  /** Versions per generated recipe (2). */
  versionsPerRecipe?: number;
  /** Build into .next-load first (default); false reuses the build already there. */
  build?: boolean;
  log?: (line: string) => void;
}

export interface LoadRow {
  route: string;
  kind: RouteKind | 'all';
  count: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  /** Answers with a 5xx status. */
  serverErrors: number;
  /** Other answers outside 2xx (3xx, 4xx). */
  otherNon2xx: number;
  /** Requests that got no answer (network error, or none within 30 s). */
  noAnswer: number;
  /** The p95 the route should stay under, if it has one. */
  targetP95Ms: number | null;
  /** Whether the route kept its promises: p95 under its target (if any), no 5xx, every request answered. */
  met: boolean;
}

export interface LoadResult {
  rows: LoadRow[];
  total: LoadRow;
  clients: { total: number; pages: number; api: number; savers: number };
  seconds: number;
  dataset: { recipes: number; versions: number; generated: number };
  /** Saves that answered 2xx during warm-up and the run, and how many of them the database holds. */
  saves: { answered2xx: number; found: number };
  /** CPU seconds each part used during the measured run, against the seconds times the cores there were. */
  cpu: { seconds: number; cores: number; byProcess: Record<string, number> };
  /** Broken promises: 5xx answers, requests left unanswered, lost saves. Empty when all were kept. */
  problems: string[];
  /** Throughput of single pages under 20 signed-out clients, one after another, before the mixed run. */
  speed: SpeedResult;
  markdown: string;
}

interface RecipeTarget {
  id: string;
  slug: string;
  ownerHandle: string;
  headNumber: number;
  headVersionId: string;
  firstVersionId: string;
}

type Recorder = (route: string, kind: RouteKind, ms: number | null, status: number) => void;

/** A small seeded generator, so a run's request sequence is the same every time. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const pick = <T>(list: T[], r: () => number): T => list[Math.floor(r() * list.length)];

function envNumber(name: string, fallback: number): number {
  const raw = process.env[name];
  if (!raw) return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1) throw new Error(`${name} must be a positive whole number, got "${raw}"`);
  return n;
}

function runNode(args: string[], env: NodeJS.ProcessEnv): void {
  execFileSync('node', ['--conditions=react-server', '--import', 'tsx', ...args], {
    env,
    stdio: ['ignore', 'pipe', 'inherit'],
  });
}

/**
 * CPU time used so far, in seconds, by each process group this run watches (read from /proc: a
 * child started detached leads its own group) and by PostgreSQL's processes; the generator is
 * this process. Taken before and after the measured run, it shows where the cores went.
 */
function cpuSeconds(groups: Record<string, number>): Record<string, number> {
  const hz = 100;
  const totals: Record<string, number> = Object.fromEntries([...Object.keys(groups), 'PostgreSQL'].map((k) => [k, 0]));
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    let stat: string;
    try {
      stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
    } catch {
      continue;
    }
    const comm = stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')'));
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const pgid = Number(fields[2]);
    const ticks = Number(fields[11]) + Number(fields[12]);
    const group =
      Object.entries(groups).find(([, id]) => id === pgid)?.[0] ?? (comm === 'postgres' ? 'PostgreSQL' : null);
    if (group) totals[group] += ticks / hz;
  }
  const own = process.cpuUsage();
  totals['load generator'] = (own.user + own.system) / 1e6;
  return totals;
}

/** A signed-out reader with one kept-alive connection and an address of its own (for per-address limits). */
class RawReader {
  private readonly agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  constructor(private readonly address: string) {}

  get(path: string): Promise<number> {
    return new Promise((resolve, reject) => {
      const req = http.get(
        `${BASE}${path}`,
        {
          agent: this.agent,
          headers: { 'accept-encoding': 'gzip', 'x-forwarded-for': this.address },
          timeout: REQUEST_TIMEOUT_MS,
        },
        (res) => {
          res.on('data', () => undefined);
          res.on('end', () => resolve(res.statusCode ?? 0));
          res.on('error', reject);
        },
      );
      req.on('timeout', () => req.destroy(new Error('timed out')));
      req.on('error', reject);
    });
  }
}

/** The whole run: scratch database, fakes, build, server, warm-up, measured traffic, checks, report. */
export async function runMixedLoad(opts: LoadOptions = {}): Promise<LoadResult> {
  const log = opts.log ?? ((line: string) => console.log(line));
  const clientCount = opts.clients ?? envNumber('KF_LOAD_CLIENTS', 50);
  const seconds = opts.seconds ?? envNumber('KF_LOAD_SECONDS', 60);
  const generated = opts.recipes ?? 10_000;
  const versionsPerRecipe = opts.versionsPerRecipe ?? 2;
  const savers = Math.min(SAVER_HANDLES.length, Math.max(1, Math.round(clientCount * 0.1)));
  const apiReaders = Math.max(clientCount > savers + 1 ? 1 : 0, Math.round(clientCount * 0.3));
  const pageReaders = clientCount - savers - apiReaders;
  if (pageReaders < 1) throw new Error(`need at least 3 clients, got ${clientCount}`);

  const databaseUrl = scratchDatabase(DATABASE);
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: databaseUrl,
    NEXTAUTH_URL: BASE,
    NEXTAUTH_SECRET: 'load-secret-0123456789abcdef0123456789ab',
    SMTP_URL: `smtp://127.0.0.1:${SMTP_PORT}`,
    MAIL_OUTBOX_URL: `http://127.0.0.1:${OUTBOX_PORT}`,
    MEILI_HOST: `http://127.0.0.1:${SEARCH_PORT}`,
    S3_ENDPOINT: `http://127.0.0.1:${S3_PORT}`,
    MEILI_FAKE_PORT: String(SEARCH_PORT),
    MAIL_FAKE_SMTP_PORT: String(SMTP_PORT),
    MAIL_FAKE_HTTP_PORT: String(OUTBOX_PORT),
    S3_FAKE_PORT: String(S3_PORT),
    S3_FAKE_DIR: '.data/s3-load',
    KF_DIST_DIR: DIST_DIR,
    TRUST_PROXY: '1',
    NEXT_TELEMETRY_DISABLED: '1',
  } as NodeJS.ProcessEnv;
  // KF_LOAD_PROFILE=<dir>: the app's workers and the search fake write V8 CPU profiles there on exit.
  const profileDir = process.env.KF_LOAD_PROFILE;
  const profiled = (args: string[]) => (profileDir ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`, ...args] : args);
  const { TestClient } = await import('../helpers/http');

  rmSync(env.S3_FAKE_DIR!, { recursive: true, force: true });
  const pool = new Pool({ connectionString: databaseUrl, max: 4 });
  const sql = new Client({ connectionString: databaseUrl });
  try {
    const groups: Record<string, number> = {};
    groups['search fake'] = startChild(profiled(['--import', 'tsx', 'scripts/search-fake.ts']), env).pid!;
    groups['mail and S3 fakes'] = startChild(['--import', 'tsx', 'scripts/mail-fake.ts'], env).pid!;
    startChild(['--import', 'tsx', 'scripts/s3-fake.ts'], env);
    await waitFor(`http://127.0.0.1:${SEARCH_PORT}/health`, 30);
    await waitFor(`http://127.0.0.1:${OUTBOX_PORT}/health`, 30);
    await waitFor(`http://127.0.0.1:${S3_PORT}/`, 30);
    log('load: migrating and seeding the demo world');
    runNode(['db/migrate.ts'], env);
    runNode(['db/seed.ts'], env);

    // Generated recipes go straight into the tables, each with its search outbox row, which the
    // app's sync loop sends on as it would any other change.
    log(`load: adding ${generated} generated recipes of ${versionsPerRecipe} versions`);
    const loadStart = performance.now();
    const drizzleDb = drizzle(pool, { schema });
    const [owner] = await drizzleDb
      .insert(schema.users)
      .values({ email: 'loadbrewer@kettlefork.test', handle: 'loadbrewer', name: 'Load Brewer' })
      .returning({ id: schema.users.id });
    await bulkLoadRecipes(drizzleDb, { ownerId: owner.id, recipes: generated, versionsPerRecipe, slugPrefix: 'load' });
    await pool.query(`insert into search_outbox (recipe_id) select r.id from recipes r where r.owner_id = $1`, [
      owner.id,
    ]);
    log(`load: generated recipes in ${((performance.now() - loadStart) / 1000).toFixed(1)} s`);

    await sql.connect();
    const dataset = (
      await sql.query(
        'select (select count(*)::int from recipes) as recipes, (select count(*)::int from recipe_versions) as versions',
      )
    ).rows[0] as {
      recipes: number;
      versions: number;
    };
    const targets = (
      await sql.query(`
        select r.id, r.slug, u.handle as "ownerHandle", r.head_number as "headNumber", r.head_version_id as "headVersionId",
               (select v.id from recipe_versions v where v.recipe_id = r.id and v.number = 1) as "firstVersionId"
        from recipes r join users u on u.id = r.owner_id
        where r.visibility = 'public' and r.hidden_at is null and r.head_version_id is not null and u.suspended_at is null
        order by r.slug`)
    ).rows as RecipeTarget[];
    const generatedRecipes = targets.filter((t) => t.ownerHandle === 'loadbrewer');
    const demoRecipes = targets.filter((t) => t.ownerHandle !== 'loadbrewer');
    const members = [...new Set(targets.map((t) => t.ownerHandle))];
    if (generatedRecipes.length !== generated || demoRecipes.length === 0) {
      throw new Error(
        `expected ${generated} generated and some demo recipes, found ${generatedRecipes.length} and ${demoRecipes.length}`,
      );
    }

    if (opts.build ?? process.env.KF_LOAD_BUILD !== 'skip') {
      log(`load: building into ${DIST_DIR}`);
      runQuiet('npx', ['next', 'build'], env);
    }
    groups['app (all workers)'] = startChild(
      profiled(['scripts/serve.mjs', '-H', '127.0.0.1', '-p', String(APP_PORT)]),
      env,
    ).pid!;
    await waitFor(`${BASE}/api/health`, 120);

    // The search index must hold the generated recipes before anything is measured.
    const probe = new TestClient('10.96.0.1', BASE);
    let indexed = 0;
    for (let i = 0; i < 240 && indexed < generated; i++) {
      const res = await probe.get<{ total?: number }>('/api/search?q=bench');
      indexed = res.status === 200 ? (res.body.total ?? 0) : 0;
      if (indexed < generated) await sleep(500);
    }
    if (indexed < generated)
      throw new Error(`search reports ${indexed} of ${generated} generated recipes after 2 minutes`);
    log(`load: search holds the ${generated} generated recipes`);

    const speed = await measureSpeed(BASE, sql, Number(process.env.KF_SPEED_SECONDS ?? 10));
    log(
      `load: version page ${speed.targets['busiest version 1 page'].rps} req/s against static ${speed.targets['static asset'].rps} (×${speed.versionToStatic}); head page ${speed.targets['busiest head page'].rps} against /about ${speed.targets['/about'].rps} (×${speed.headToAbout})`,
    );

    // Savers: each signs in as a demo member, from an address of its own, and saves to their own recipe.
    const saverHandles = SAVER_HANDLES.filter((h) => demoRecipes.some((r) => r.ownerHandle === h)).slice(0, savers);
    if (saverHandles.length < savers)
      throw new Error(`only ${saverHandles.length} demo members with recipes to save as, need ${savers}`);
    const saved: string[] = [];
    const saverStates = await Promise.all(
      saverHandles.map(async (handle, n) => {
        const client = new TestClient(`10.96.3.${n + 1}`, BASE);
        if (!(await client.signIn(`${handle}@kettlefork.test`, DEMO_PASSWORD)))
          throw new Error(`sign-in as ${handle} failed`);
        const recipe = demoRecipes.find((r) => r.ownerHandle === handle)!;
        const head = await client.get<{ recipe: { headVersionId: string } }>(`/api/recipes/${recipe.id}`);
        const version = await client.get<{ version: { document: Record<string, unknown> } }>(
          `/api/versions/${head.body.recipe.headVersionId}`,
        );
        if (head.status !== 200 || version.status !== 200)
          throw new Error(`could not load ${handle}'s recipe (${head.status}, ${version.status})`);
        return {
          client,
          handle,
          recipeId: recipe.id,
          head: head.body.recipe.headVersionId,
          document: version.body.version.document,
          n: 0,
        };
      }),
    );

    async function save(state: (typeof saverStates)[number], record: Recorder | null): Promise<void> {
      state.n += 1;
      const body = JSON.stringify({
        document: { ...state.document, notes: `Load run save ${state.n} by ${state.handle}.` },
        baseVersionId: state.head,
        message: `load run save ${state.n}`,
      });
      const t = performance.now();
      let status = 0;
      let text = '';
      try {
        const res = await state.client.fetch(`/api/recipes/${state.recipeId}/versions`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body,
          signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
        });
        status = res.status;
        text = await res.text();
      } catch {
        status = 0;
      }
      record?.('api POST /api/recipes/[id]/versions', 'write', status ? performance.now() - t : null, status);
      if (status === 201) {
        const id = (JSON.parse(text) as { version: { id: string } }).version.id;
        saved.push(id);
        state.head = id;
      } else if (status === 409) {
        const head = await state.client.get<{ recipe: { headVersionId: string } }>(`/api/recipes/${state.recipeId}`);
        if (head.status === 200) state.head = head.body.recipe.headVersionId;
      } else {
        await sleep(200);
      }
    }

    /**
     * One reader request: send, read the whole body, record. Readers are signed out and go through
     * node:http on a kept-alive socket of their own, asking for gzip as a browser does but leaving
     * the bytes compressed: the generator shares the cores with the app, so it spends as little as it can.
     */
    async function read(
      client: RawReader,
      route: string,
      kind: RouteKind,
      path: string,
      record: Recorder,
    ): Promise<void> {
      const t = performance.now();
      try {
        const status = await client.get(path);
        record(route, kind, performance.now() - t, status);
      } catch {
        record(route, kind, null, 0);
      }
    }

    const recipeFor = (r: () => number) => (r() < 0.6 ? pick(generatedRecipes, r) : pick(demoRecipes, r));

    /** Page readers: recipe pages most, then version pages and searches, then the home page and members. */
    const pageSchedule = [
      'recipe',
      'recipe',
      'recipe',
      'recipe',
      'version',
      'version',
      'search',
      'search',
      'home',
      'member',
    ] as const;
    async function pageReader(n: number, until: number, record: Recorder): Promise<void> {
      const client = new RawReader(`10.96.1.${n + 1}`);
      const r = rng(1000 + n);
      for (let i = n; Date.now() < until; i++) {
        const step = pageSchedule[i % pageSchedule.length];
        if (step === 'recipe')
          await read(client, 'page /recipes/[slug]', 'page', `/recipes/${recipeFor(r).slug}`, record);
        else if (step === 'version') {
          const recipe = recipeFor(r);
          await read(
            client,
            'page /recipes/[slug]/v/[number]',
            'page',
            `/recipes/${recipe.slug}/v/${1 + Math.floor(r() * recipe.headNumber)}`,
            record,
          );
        } else if (step === 'search')
          await read(client, 'page /search', 'page', `/search?${pick(SEARCHES, r)}`, record);
        else if (step === 'home') await read(client, 'page /', 'page', '/', record);
        else await read(client, 'page /members/[handle]', 'page', `/members/${pick(members, r)}`, record);
      }
    }

    /** API readers: searches most, then a recipe, a version and a comparison. */
    const apiSchedule = [
      'search',
      'search',
      'search',
      'search',
      'recipe',
      'recipe',
      'version',
      'version',
      'compare',
      'compare',
    ] as const;
    async function apiReader(n: number, until: number, record: Recorder): Promise<void> {
      const client = new RawReader(`10.96.2.${n + 1}`);
      const r = rng(2000 + n);
      for (let i = n; Date.now() < until; i++) {
        const step = apiSchedule[i % apiSchedule.length];
        if (step === 'search')
          await read(client, 'api GET /api/search', 'api read', `/api/search?${pick(SEARCHES, r)}`, record);
        else if (step === 'recipe')
          await read(client, 'api GET /api/recipes/[id]', 'api read', `/api/recipes/${recipeFor(r).id}`, record);
        else if (step === 'version') {
          const recipe = recipeFor(r);
          await read(
            client,
            'api GET /api/versions/[id]',
            'api read',
            `/api/versions/${r() < 0.5 ? recipe.firstVersionId : recipe.headVersionId}`,
            record,
          );
        } else {
          // Half compare a recipe's first version with its head, half two different recipes.
          const a = recipeFor(r);
          const b = r() < 0.5 ? a : recipeFor(r);
          await read(
            client,
            'api GET /api/compare',
            'api read',
            `/api/compare?a=${a.firstVersionId}&b=${b.headVersionId}`,
            record,
          );
        }
      }
    }

    async function saver(n: number, until: number, record: Recorder): Promise<void> {
      while (Date.now() < until) await save(saverStates[n], record);
    }

    // Warm-up: every route on both workers, and one save per saver; nothing recorded.
    log(`load: warming up for ${WARMUP_SECONDS} s`);
    const discard: Recorder = () => {};
    const warmUntil = Date.now() + WARMUP_SECONDS * 1000;
    await Promise.all([
      ...Array.from({ length: Math.min(pageReaders, 6) }, (_, n) => pageReader(n, warmUntil, discard)),
      ...Array.from({ length: Math.min(apiReaders, 4) }, (_, n) => apiReader(n, warmUntil, discard)),
      ...saverStates.map((state) => save(state, null)),
    ]);

    // The measured run.
    const latencies = new Map<string, { kind: RouteKind; ms: number[]; statuses: Map<number, number> }>();
    const record: Recorder = (route, kind, ms, status) => {
      let entry = latencies.get(route);
      if (!entry) latencies.set(route, (entry = { kind, ms: [], statuses: new Map() }));
      if (ms !== null) entry.ms.push(ms);
      entry.statuses.set(status, (entry.statuses.get(status) ?? 0) + 1);
    };
    log(
      `load: ${clientCount} clients (${pageReaders} page readers, ${apiReaders} API readers, ${savers} savers) for ${seconds} s`,
    );
    const cpuBefore = cpuSeconds(groups);
    const started = performance.now();
    const until = Date.now() + seconds * 1000;
    await Promise.all([
      ...Array.from({ length: pageReaders }, (_, n) => pageReader(n, until, record)),
      ...Array.from({ length: apiReaders }, (_, n) => apiReader(n, until, record)),
      ...saverStates.map((_, n) => saver(n, until, record)),
    ]);
    const elapsed = (performance.now() - started) / 1000;
    const cpuAfter = cpuSeconds(groups);
    const cpu = Object.fromEntries(Object.keys(cpuAfter).map((k) => [k, round(cpuAfter[k] - (cpuBefore[k] ?? 0), 1)]));

    const targetFor = (kind: RouteKind) =>
      kind === 'page' ? PAGE_P95_TARGET_MS : kind === 'api read' ? API_READ_P95_TARGET_MS : null;
    const rowOf = (
      route: string,
      kind: LoadRow['kind'],
      ms: number[],
      statuses: Map<number, number>,
      target: number | null,
    ): LoadRow => {
      let serverErrors = 0;
      let otherNon2xx = 0;
      let noAnswer = 0;
      let count = 0;
      for (const [status, n] of statuses) {
        count += n;
        if (status === 0) noAnswer += n;
        else if (status >= 500) serverErrors += n;
        else if (status < 200 || status >= 300) otherNon2xx += n;
      }
      const p95 = round(quantile(ms, 0.95));
      return {
        route,
        kind,
        count,
        perSecond: round(count / elapsed),
        p50: round(quantile(ms, 0.5)),
        p95,
        p99: round(quantile(ms, 0.99)),
        serverErrors,
        otherNon2xx,
        noAnswer,
        targetP95Ms: target,
        met: serverErrors === 0 && noAnswer === 0 && (target === null || p95 < target),
      };
    };
    const kindOrder: RouteKind[] = ['page', 'api read', 'write'];
    const rows = [...latencies]
      .map(([route, e]) => rowOf(route, e.kind, e.ms, e.statuses, targetFor(e.kind)))
      .sort(
        (a, b) =>
          kindOrder.indexOf(a.kind as RouteKind) - kindOrder.indexOf(b.kind as RouteKind) ||
          a.route.localeCompare(b.route),
      );
    const allStatuses = new Map<number, number>();
    for (const e of latencies.values())
      for (const [s, n] of e.statuses) allStatuses.set(s, (allStatuses.get(s) ?? 0) + n);
    const total = rowOf(
      'all requests',
      'all',
      [...latencies.values()].flatMap((e) => e.ms),
      allStatuses,
      null,
    );

    // Every save that answered 2xx must be in the database.
    const found = saved.length
      ? (await sql.query('select count(*)::int as n from recipe_versions where id = any($1::uuid[])', [saved])).rows[0]
          .n
      : 0;

    const problems: string[] = [];
    for (const row of rows) {
      if (row.serverErrors) problems.push(`${row.route}: ${row.serverErrors} answers with a 5xx status`);
      if (row.noAnswer) problems.push(`${row.route}: ${row.noAnswer} requests without an answer`);
    }
    if (saved.length === 0 || found !== saved.length)
      problems.push(`saves: ${found} of ${saved.length} that answered 2xx are in the database`);

    const result: Omit<LoadResult, 'markdown'> = {
      rows,
      total,
      clients: { total: clientCount, pages: pageReaders, api: apiReaders, savers },
      seconds,
      dataset: { recipes: dataset.recipes, versions: dataset.versions, generated },
      saves: { answered2xx: saved.length, found },
      cpu: { seconds: round(elapsed, 1), cores: os.cpus().length, byProcess: cpu },
      problems,
      speed,
    };
    return { ...result, markdown: renderLoadReport(result) };
  } finally {
    await stopChildren();
    await sql.end().catch(() => {});
    await pool.end().catch(() => {});
  }
}

const fmt = (n: number) => (Number.isNaN(n) ? '–' : n.toLocaleString('en-GB'));

/** The report as Markdown: conditions first, then one line per route against its target. */
export function renderLoadReport(result: Omit<LoadResult, 'markdown'>): string {
  const cpus = os.cpus();
  const { clients, dataset } = result;
  const targetText = (row: LoadRow) =>
    row.kind === 'all' ? '' : row.targetP95Ms === null ? 'no 5xx' : `p95 < ${row.targetP95Ms} ms, no 5xx`;
  const verdict = (row: LoadRow) => (row.kind === 'all' ? '' : row.met ? 'met' : '**missed**');
  const line = (row: LoadRow) =>
    `| ${row.kind === 'all' ? '**all requests**' : `\`${row.route}\``} | ${fmt(row.count)} | ${fmt(row.perSecond)} | ${fmt(row.p50)} | ${fmt(row.p95)} | ${fmt(row.p99)} | ${row.serverErrors} | ${row.otherNon2xx} | ${row.noAnswer} | ${targetText(row)} | ${verdict(row)} |`;
  return [
    '# Mixed-traffic load run',
    '',
    `- Date: ${new Date().toISOString().slice(0, 10)}`,
    `- Machine: ${cpus.length} cores (${cpus[0]?.model.trim() ?? 'unknown CPU'}), ${Math.round(os.totalmem() / 2 ** 30)} GiB; Node ${process.version}`,
    `- Server: the production build under \`scripts/serve.mjs\` (one \`next start\` worker per core), PostgreSQL and the local search, mail and S3 fakes, all on this machine, with the load generator beside them`,
    `- Clients: ${clients.total} on loopback, each a closed loop: ${clients.pages} page readers, ${clients.api} API readers, ${clients.savers} savers (signed-in members saving versions of their own recipes)`,
    `- Duration: ${result.seconds} s measured, after a ${WARMUP_SECONDS} s warm-up`,
    `- Dataset: ${fmt(dataset.recipes)} recipes and ${fmt(dataset.versions)} versions (${fmt(dataset.generated)} generated recipes plus the demo world)`,
    `- Saves: ${fmt(result.saves.answered2xx)} answered 2xx (warm-up included), ${fmt(result.saves.found)} of them found in the database`,
    '',
    'Latency is from sending a request to reading the last byte of its body, in milliseconds; percentiles are exact (nearest rank) over every request of the route. "No answer" counts requests that failed or got nothing within 30 s.',
    '',
    `Before the mixed run, each page alone under 20 signed-out clients with gzip for ${result.speed.seconds} s (busiest demo recipe: \`${result.speed.busiest.slug}\`, ${result.speed.busiest.activity} brew days, comments and proposals):`,
    '',
    '| target | req/s | p97.5 ms | non-2xx |',
    '|---|---:|---:|---:|',
    ...Object.entries(result.speed.targets).map(
      ([name, t]) => `| ${name} | ${fmt(t.rps)} | ${fmt(t.p975)} | ${t.non2xx} |`,
    ),
    '',
    `Version page against the static file: ×${result.speed.versionToStatic}; head page against /about: ×${result.speed.headToAbout}.`,
    '',
    '| route | requests | req/s | p50 ms | p95 ms | p99 ms | 5xx | other non-2xx | no answer | target | |',
    '|---|---:|---:|---:|---:|---:|---:|---:|---:|---|---|',
    ...result.rows.map(line),
    line(result.total),
    '',
    result.problems.length
      ? `Broken: ${result.problems.join('; ')}.`
      : 'No 5xx answers, every request answered, every 2xx save in the database.',
    '',
    `Where the cores went during the measured ${result.cpu.seconds} s (${result.cpu.cores} cores, so ${round(result.cpu.seconds * result.cpu.cores, 1)} CPU-seconds in all), from /proc:`,
    '',
    '| process | CPU seconds | share of the machine |',
    '|---|---:|---:|',
    ...Object.entries(result.cpu.byProcess)
      .sort((a, b) => b[1] - a[1])
      .map(
        ([name, sec]) =>
          `| ${name} | ${sec} | ${Math.round((100 * sec) / (result.cpu.seconds * result.cpu.cores))} % |`,
      ),
    '',
  ].join('\n');
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const interrupt = () => void stopChildren().then(() => process.exit(130));
  process.once('SIGINT', interrupt);
  process.once('SIGTERM', interrupt);
  try {
    const result = await runMixedLoad();
    writeFileSync(new URL('../../bench/LOAD.md', import.meta.url), result.markdown);
    console.log(`\n${result.markdown}`);
    console.log(result.problems.length ? `${result.problems.length} promise(s) broken` : 'all promises kept');
    process.exit(result.problems.length ? 1 : 0);
  } catch (err) {
    console.error('load run could not be completed:', err);
    await stopChildren();
    process.exit(2);
  }
}
