// Search speed and memory: 50,000 invented recipes loaded into the search fake running in a
// child process, then a few hundred reader-like queries through the real client on loopback;
// then the same 50,000 recipes seeded into a scratch PostgreSQL database and the index rebuilt
// from it, as the app does when the engine starts empty.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Meilisearch, type EnqueuedTask } from 'meilisearch';
import {
  FACET_ATTRIBUTES,
  RECIPE_INDEX_SETTINGS,
  RECIPES_INDEX,
  type RecipeSearchDocument,
} from '../lib/search/document';
import { buildRecipeFilter } from '../lib/search/filters';
import { recipeSearchQuerySchema, SEARCH_PAGE_SIZE, type RecipeSearchQueryInput } from '../lib/search/schemas';
import type { BenchRow } from './types';
import { scratchDatabase } from '../tests/load/processes';

const DOCUMENTS = 50_000;
const LOAD_BATCH = 1_000;
const WARMUP_QUERIES = 50;
const MEASURED_QUERIES = 500;
const SEED = 0x6b66;
const ROOT = fileURLToPath(new URL('..', import.meta.url));

/** mulberry32: a small seeded PRNG, so every run indexes and queries the same data. */
function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Random = () => number;
const pick = <T>(random: Random, items: readonly T[]): T => items[Math.floor(random() * items.length)];
const pickSome = <T>(random: Random, items: readonly T[], min: number, max: number): T[] => {
  const count = min + Math.floor(random() * (max - min + 1));
  return [...new Set(Array.from({ length: count }, () => pick(random, items)))];
};
const between = (random: Random, low: number, high: number, digits: number) =>
  Number((low + random() * (high - low)).toFixed(digits));

const TITLE_WORDS = [
  'Harbour',
  'Lantern',
  'Orchard',
  'Copper',
  'Meadow',
  'Ridge',
  'Cellar',
  'Hollow',
  'Ember',
  'Juniper',
  'Drift',
  'Quarry',
  'Thistle',
  'Fallow',
  'Signal',
  'Marsh',
  'Kestrel',
  'Bramble',
  'Tinker',
  'Foundry',
  'Saltmarsh',
  'Rook',
  'Gable',
  'Wicket',
  'Sunrise',
  'Night',
  'Porch',
  'Village',
  'Forest',
  'River',
  'Summit',
  'Granary',
  'Hearth',
  'Lighthouse',
  'Barley',
  'Haze',
];
const STYLES = [
  { code: '1A', name: 'Light Lager', category: 'Pale Lager' },
  { code: '4A', name: 'Pale Malty Lager', category: 'Pale Lager' },
  { code: '5D', name: 'Pilsner', category: 'Pale Bitter Lager' },
  { code: '8A', name: 'Amber Lager', category: 'Amber Lager' },
  { code: '10A', name: 'Wheat Beer', category: 'Wheat Beer' },
  { code: '11B', name: 'Best Bitter', category: 'British Bitter' },
  { code: '13C', name: 'Brown Ale', category: 'Brown Ale' },
  { code: '15B', name: 'Dry Stout', category: 'Dark Ale' },
  { code: '18B', name: 'American Pale Ale', category: 'Pale American Ale' },
  { code: '19A', name: 'American Amber Ale', category: 'Amber Ale' },
  { code: '20A', name: 'Porter', category: 'Dark Ale' },
  { code: '21A', name: 'India Pale Ale', category: 'IPA' },
  { code: '22A', name: 'Double IPA', category: 'Strong Ale' },
  { code: '25B', name: 'Farmhouse Ale', category: 'Farmhouse Ale' },
  { code: '27A', name: 'Historical Gruit', category: 'Historical Beer' },
];
const MALTS = [
  'Pale ale malt',
  'Pilsner malt',
  'Munich',
  'Vienna',
  'Wheat malt',
  'Crystal 40',
  'Crystal 120',
  'Chocolate malt',
  'Roasted barley',
  'Flaked oats',
  'Biscuit malt',
  'Aromatic malt',
  'Rye malt',
  'Smoked malt',
  'Table sugar',
  'floor-malted English pale malt',
];
const HOPS = [
  'Cascade',
  'Centennial',
  'Saaz',
  'Fuggle',
  'East Kent Golding',
  'Hallertau Mittelfrüh',
  'Chinook',
  'Willamette',
  'Northern Brewer',
  'Tettnang',
  'Spalt',
  'Cluster',
  'Galena',
  'Perle',
  'Styrian Golding',
  'Brewer’s Gold',
];
const YEASTS = [
  { name: 'Clean American ale yeast', kind: 'clean ale' },
  { name: 'English ale yeast', kind: 'english ale' },
  { name: 'Bottom-fermenting lager yeast', kind: 'lager' },
  { name: 'Farmhouse kveik blend', kind: 'kveik' },
  { name: 'Hefeweizen yeast', kind: 'wheat' },
  { name: 'Belgian abbey yeast', kind: 'belgian ale' },
  { name: 'Saison yeast', kind: 'saison' },
];
const NOTE_WORDS = [
  'citrus',
  'pine',
  'biscuit',
  'toffee',
  'roast',
  'crisp',
  'dry',
  'hazy',
  'bright',
  'resin',
  'floral',
  'spicy',
  'earthy',
  'malty',
  'bready',
  'caramel',
  'coffee',
  'stone',
  'fruit',
  'clean',
  'finish',
  'body',
  'bitterness',
  'aroma',
  'mash',
  'boil',
  'whirlpool',
  'dry-hop',
  'ferment',
  'cold',
  'crash',
  'lager',
  'weeks',
  'water',
  'soft',
  'chloride',
  'sulfate',
  'balance',
];
const AUTHORS = ['Ada', 'Bram', 'Cleo', 'Dov', 'Esme', 'Finn', 'Greta', 'Hal', 'Ines', 'Jory', 'Kit', 'Lior'];

function benchDocument(random: Random, n: number): RecipeSearchDocument {
  const style = pick(random, STYLES);
  const yeast = pick(random, YEASTS);
  const author = pick(random, AUTHORS);
  const og = between(random, 1.03, 1.095, 3);
  const fg = between(random, 1.004, Math.min(og - 0.01, 1.025), 3);
  const visibility = random() < 0.9 ? 'public' : random() < 0.5 ? 'unlisted' : 'private';
  return {
    id: `00000000-0000-4000-8000-${n.toString(16).padStart(12, '0')}`,
    slug: `bench-recipe-${n}`,
    title: `${pick(random, TITLE_WORDS)} ${pick(random, TITLE_WORDS)} ${style.name}`,
    ownerId: `user-${Math.floor(random() * 2_000)}`,
    authorName: `${author} ${pick(random, TITLE_WORDS)}`,
    authorHandle: `${author.toLowerCase()}${Math.floor(random() * 500)}`,
    styleCode: style.code,
    styleName: style.name,
    styleCategory: style.category,
    fermentables: pickSome(random, MALTS, 2, 5),
    hops: pickSome(random, HOPS, 1, 4),
    yeasts: [yeast.name],
    yeastKinds: [yeast.kind],
    notes: Array.from({ length: 12 + Math.floor(random() * 20) }, () => pick(random, NOTE_WORDS)).join(' '),
    og,
    fg,
    abv: Number(((og - fg) * 131.25).toFixed(1)),
    ibu: Math.round(between(random, 8, 110, 0)),
    srm: between(random, 2, 40, 1),
    stars: Math.floor(random() ** 3 * 200),
    forks: Math.floor(random() ** 4 * 40),
    createdAt: 1_650_000_000_000 + n * 60_000,
    updatedAt: 1_650_000_000_000 + n * 60_000,
    visibility,
    hidden: random() < 0.01,
    headVersion: 1 + Math.floor(random() * 6),
  };
}

/** One or two words a reader might type, and two filters from the search form. */
function benchQuery(random: Random): RecipeSearchQueryInput {
  const vocabulary = [
    ...TITLE_WORDS,
    ...HOPS.map((hop) => hop.split(' ')[0]),
    ...STYLES.map((style) => style.name.split(' ')[0]),
  ];
  const words = Array.from({ length: random() < 0.5 ? 1 : 2 }, () => pick(random, vocabulary).toLowerCase());
  const abvMin = between(random, 3, 6, 1);
  const filters: Array<() => RecipeSearchQueryInput> = [
    () => ({ style: [pick(random, STYLES).code] }),
    () => ({ hop: [pick(random, HOPS)] }),
    () => ({ malt: [pick(random, MALTS)] }),
    () => ({ yeast: [pick(random, YEASTS).kind] }),
    () => ({ abvMin, abvMax: abvMin + 2 }),
    () => ({ ibuMax: Math.round(between(random, 20, 80, 0)) }),
  ];
  const first = Math.floor(random() * filters.length);
  const second = (first + 1 + Math.floor(random() * (filters.length - 1))) % filters.length;
  return { q: words.join(' '), ...filters[first](), ...filters[second]() };
}

interface FakeChild {
  url: string;
  child: ChildProcess;
}

function startFakeChild(): Promise<FakeChild> {
  const child = spawn(process.execPath, ['--expose-gc', '--import', 'tsx', 'scripts/search-fake.ts'], {
    cwd: ROOT,
    env: { ...process.env, MEILI_FAKE_PORT: '0', MEILI_FAKE_KEY: '' },
    stdio: ['ignore', 'pipe', 'inherit', 'ipc'],
  });
  return new Promise((resolve, reject) => {
    let output = '';
    child.stdout?.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      const match = /search fake listening on (http:\/\/\S+)/.exec(output);
      if (match) resolve({ url: match[1], child });
    });
    child.once('exit', (code) => reject(new Error(`search fake exited early with code ${code}`)));
  });
}

function childMemory(child: ChildProcess): Promise<NodeJS.MemoryUsage> {
  return new Promise((resolve) => {
    child.once('message', (message) => resolve((message as { memory: NodeJS.MemoryUsage }).memory));
    child.send('memory');
  });
}

function stopChild(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

const round = (value: number, digits = 1) => Number(value.toFixed(digits));
const megabytes = (bytes: number) => round(bytes / 1024 / 1024);

async function loadDocuments(client: Meilisearch, docs: RecipeSearchDocument[]): Promise<number> {
  const index = client.index<RecipeSearchDocument>(RECIPES_INDEX);
  const started = performance.now();
  await client.createIndex(RECIPES_INDEX, { primaryKey: 'id' }).waitTask();
  await index.updateSettings(RECIPE_INDEX_SETTINGS).waitTask();
  const enqueued: EnqueuedTask[] = [];
  for (let start = 0; start < docs.length; start += LOAD_BATCH)
    enqueued.push(await index.addDocuments(docs.slice(start, start + LOAD_BATCH)));
  const tasks = await client.tasks.waitForTasks(enqueued, { timeout: 120_000, interval: 20 });
  const failed = tasks.find((task) => task.status !== 'succeeded');
  if (failed) throw new Error(`loading failed: ${failed.error?.message}`);
  return performance.now() - started;
}

async function timeQueries(
  client: Meilisearch,
  count: number,
  random: Random,
): Promise<{ latencies: number[]; hits: number }> {
  const index = client.index(RECIPES_INDEX);
  const latencies: number[] = [];
  let hits = 0;
  for (let i = 0; i < count; i++) {
    const query = recipeSearchQuerySchema.parse(benchQuery(random));
    const started = performance.now();
    const result = await index.search(query.q, {
      filter: buildRecipeFilter(query, null),
      facets: [...FACET_ATTRIBUTES],
      page: 1,
      hitsPerPage: SEARCH_PAGE_SIZE,
    });
    latencies.push(performance.now() - started);
    hits += result.totalHits;
  }
  return { latencies, hits };
}

const SCRATCH_DATABASE = 'kettlefork_bench_search';
const SEED_BATCH = 2_000;
const BENCH_USERS = 2_000;

/** The recipe document whose index document `doc` is (the index reads only these parts). */
function recipeDocumentFor(doc: RecipeSearchDocument) {
  return {
    title: doc.title,
    batch: { volumeL: 20, boilTimeMin: 60, efficiencyPct: 72 },
    style: { code: doc.styleCode, name: doc.styleName },
    fermentables: doc.fermentables.map((name, i) => ({
      name,
      amountKg: i === 0 ? 4 : 0.3,
      potentialPpg: 36,
      colorLovibond: 3 + i * 10,
      kind: 'grain',
    })),
    hops: doc.hops.map((name, i) => ({
      name,
      amountG: 25,
      alphaPct: 6,
      use: 'boil',
      timeMin: 60 - i * 15,
      form: 'pellet',
    })),
    yeasts: doc.yeasts.map((name, i) => ({ name, kind: i === 0 ? 'ale' : 'lager', attenuationPct: 76 })),
    mash: { steps: [{ tempC: 66, timeMin: 60 }] },
    fermentation: { steps: [{ tempC: 18, days: 14 }] },
    notes: doc.notes,
  };
}

/**
 * Runs in a child process (so the app's database and search clients, configured from the
 * environment at first use, point at the scratch database and a fresh fake): bulk-loads the
 * recipes with plain SQL, then times the rebuild the app performs.
 */
async function rebuildChild(): Promise<void> {
  const { default: pg } = await import('pg');
  const docs = JSON.parse(readFileSync(process.env.KF_BENCH_DOCS_FILE ?? '', 'utf8')) as RecipeSearchDocument[];
  const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
  const { drizzle } = await import('drizzle-orm/node-postgres');
  const { migrate } = await import('drizzle-orm/node-postgres/migrator');
  await migrate(drizzle(pool), { migrationsFolder: `${ROOT}drizzle` });
  const seedStarted = performance.now();
  await pool.query(
    `insert into users (id, email, handle, name)
     select 'bench-user-' || g, 'bench-' || g || '@kettlefork.test', 'bench' || g, 'Bench Brewer ' || g from generate_series(0, ${BENCH_USERS - 1}) g`,
  );
  for (let start = 0; start < docs.length; start += SEED_BATCH) {
    const rows = docs.slice(start, start + SEED_BATCH).map((doc, i) => ({
      id: doc.id,
      slug: doc.slug,
      owner: `bench-user-${(start + i) % BENCH_USERS}`,
      title: doc.title,
      visibility: doc.visibility,
      hidden: doc.hidden,
      stars: doc.stars,
      forks: doc.forks,
      created: doc.createdAt,
      document: recipeDocumentFor(doc),
      og: doc.og,
      fg: doc.fg,
      abv: doc.abv,
      ibu: doc.ibu,
      srm: doc.srm,
      style: doc.styleCode,
    }));
    await pool.query(
      `with input as (
         select * from jsonb_to_recordset($1::jsonb) as x(id uuid, slug text, owner text, title text, visibility recipe_visibility, hidden boolean,
           stars int, forks int, created bigint, document jsonb, og real, fg real, abv real, ibu real, srm real, style text)
       ), inserted as (
         insert into recipes (id, slug, owner_id, title, visibility, hidden_at, star_count, fork_count, head_number, created_at, updated_at)
         select id, slug, owner, title, visibility, case when hidden then now() end, stars, forks, 1, to_timestamp(created / 1000.0), to_timestamp(created / 1000.0)
         from input returning id
       )
       insert into recipe_versions (recipe_id, number, author_id, message, document, stats, og, fg, abv, ibu, srm, style_code, engine_version)
       select id, 1, owner, 'First version', document, '{}'::jsonb, og, fg, abv, ibu, srm, style, 'bench' from input`,
      [JSON.stringify(rows)],
    );
  }
  await pool.query('update recipes r set head_version_id = v.id from recipe_versions v where v.recipe_id = r.id');
  // What autovacuum would have done by now on a live database: give the planner real row counts.
  await pool.query('analyze');
  const seedMs = performance.now() - seedStarted;
  await pool.end();

  const { ensureRecipeIndex } = await import('../lib/search/client');
  const { rebuildSearchIndex } = await import('../lib/search/sync');
  const { getPool } = await import('../db');
  await ensureRecipeIndex();
  const { count, ms } = await rebuildSearchIndex();
  await getPool().end();
  process.send?.({ count, ms, seedMs });
}

/** Seeds a scratch database with `docs` as recipes and times a full rebuild into a fresh fake. */
async function benchRebuild(docs: RecipeSearchDocument[]): Promise<{ count: number; ms: number; seedMs: number }> {
  const databaseUrl = scratchDatabase(SCRATCH_DATABASE);
  const { url, child: fake } = await startFakeChild();
  const dir = mkdtempSync(`${tmpdir()}/kf-bench-`);
  const docsFile = `${dir}/docs.json`;
  writeFileSync(docsFile, JSON.stringify(docs));
  try {
    const child = spawn(
      process.execPath,
      ['--conditions=react-server', '--import', 'tsx', fileURLToPath(import.meta.url), 'rebuild'],
      {
        cwd: ROOT,
        env: {
          ...process.env,
          DATABASE_URL: databaseUrl,
          MEILI_HOST: url,
          MEILI_KEY: '',
          KF_BENCH_DOCS_FILE: docsFile,
          NODE_ENV: 'production',
        },
        stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
      },
    );
    return await new Promise((resolve, reject) => {
      child.once('message', (message) => resolve(message as { count: number; ms: number; seedMs: number }));
      child.once('exit', (code) => reject(new Error(`rebuild child exited with code ${code} before reporting`)));
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
    await stopChild(fake);
  }
}

export async function benchSearch(): Promise<BenchRow[]> {
  const random = seededRandom(SEED);
  const docs = Array.from({ length: DOCUMENTS }, (_, n) => benchDocument(random, n));
  const { url, child } = await startFakeChild();
  try {
    const client = new Meilisearch({ host: url });
    const loadMs = await loadDocuments(client, docs);
    const memory = await childMemory(child);
    await timeQueries(client, WARMUP_QUERIES, random);
    const { latencies, hits } = await timeQueries(client, MEASURED_QUERIES, random);
    const sorted = [...latencies].sort((a, b) => a - b);
    const note = `${MEASURED_QUERIES} queries of 1–2 words + 2 filters + ${FACET_ATTRIBUTES.length} facets, viewer rule applied, mean ${round(hits / MEASURED_QUERIES, 0)} hits`;
    const rebuild = await benchRebuild(docs);
    return [
      {
        area: 'search',
        metric: `index ${DOCUMENTS.toLocaleString('en')} recipes`,
        value: round(loadMs, 0),
        unit: 'ms',
        note: `batches of ${LOAD_BATCH} through the client`,
      },
      {
        area: 'search',
        metric: 'fake RSS after load',
        value: megabytes(memory.rss),
        unit: 'MB',
        target: { op: '<', value: 400 },
      },
      { area: 'search', metric: 'fake heap used after load', value: megabytes(memory.heapUsed), unit: 'MB' },
      { area: 'search', metric: 'query p50', value: round(percentile(sorted, 50), 2), unit: 'ms', note },
      {
        area: 'search',
        metric: 'query p95',
        value: round(percentile(sorted, 95), 2),
        unit: 'ms',
        target: { op: '<', value: 25 },
        note,
      },
      {
        area: 'search',
        metric: `rebuild index from PostgreSQL, ${rebuild.count.toLocaleString('en')} recipes`,
        value: rebuild.ms,
        unit: 'ms',
        target: { op: '<', value: 20_000 },
        note: `rebuildSearchIndex: keyset pages of 1,000 joined to head versions and owners; scratch database seeded in ${round(rebuild.seedMs / 1000, 1)} s`,
      },
    ];
  } finally {
    await stopChild(child);
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  if (process.argv[2] === 'rebuild') {
    rebuildChild().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  } else {
    benchSearch().then(
      (rows) =>
        console.table(
          rows.map(({ area, metric, value, unit, target }) => ({
            area,
            metric,
            value,
            unit,
            target: target ? `${target.op} ${target.value}` : '',
          })),
        ),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  }
}
