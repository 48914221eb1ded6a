// npm run faults — the app under steady traffic while PostgreSQL, then the search service, stop and
// come back. Loopback only, bounded in time; exits non-zero when a promise below is broken:
// no request hangs past 10 s, outage answers are plain 503s, the app recovers without a restart,
// every save that answered 2xx is in the database, and the search index catches up.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { Client } from 'pg';

const APP_PORT = 3950;
const SEARCH_PORT = 7795;
const SMTP_PORT = 2595;
const OUTBOX_PORT = 2596;
const S3_PORT = 4595;
const BASE = `http://127.0.0.1:${APP_PORT}`;
const RUN_SECONDS = 45;

const db = (...args: string[]) => execFileSync('bash', ['scripts/db.sh', ...args]).toString().trim();
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

execFileSync('bash', ['scripts/db.sh', 'start'], { stdio: 'inherit' });
db('drop', 'kettlefork_faults');
db('create', 'kettlefork_faults');
const databaseUrl = db('url', 'kettlefork_faults');
const env = {
  ...process.env,
  NODE_ENV: 'production',
  DATABASE_URL: databaseUrl,
  NEXTAUTH_URL: BASE,
  NEXTAUTH_SECRET: 'faults-secret-0123456789abcdef0123456789',
  SMTP_URL: `smtp://127.0.0.1:${SMTP_PORT}`,
  MAIL_OUTBOX_URL: `http://127.0.0.1:${OUTBOX_PORT}`,
  MEILI_HOST: `http://127.0.0.1:${SEARCH_PORT}`,
  S3_ENDPOINT: `http://127.0.0.1:${S3_PORT}`,
  MEILI_FAKE_PORT: String(SEARCH_PORT),
  MAIL_FAKE_SMTP_PORT: String(SMTP_PORT),
  MAIL_FAKE_HTTP_PORT: String(OUTBOX_PORT),
  S3_FAKE_PORT: String(S3_PORT),
  S3_FAKE_DIR: '.data/s3-faults',
  KF_DIST_DIR: '.next-bench',
  TRUST_PROXY: '1',
  NEXT_TELEMETRY_DISABLED: '1',
} as NodeJS.ProcessEnv;
process.env.KF_BASE_URL = BASE;
// Loaded after KF_BASE_URL is set, so the client talks to this run's app.
const { TestClient } = await import('../helpers/http');

const children: ChildProcess[] = [];
function start(args: string[]): ChildProcess {
  const child = spawn('node', args, { env, detached: true, stdio: 'ignore' });
  children.push(child);
  return child;
}
function stop(child: ChildProcess): void {
  try {
    process.kill(-child.pid!, 'SIGTERM');
  } catch {
    // already gone
  }
}
async function waitFor(url: string, seconds: number): Promise<void> {
  for (let i = 0; i < seconds * 4; i++) {
    if (await fetch(url).then((r) => r.status < 500, () => false)) return;
    await sleep(250);
  }
  throw new Error(`${url} did not come up`);
}

const failures: string[] = [];
const check = (ok: boolean, message: string) => {
  if (!ok) failures.push(message);
  console.log(`${ok ? 'ok  ' : 'FAIL'} ${message}`);
};

try {
  let search = start(['--import', 'tsx', 'scripts/search-fake.ts']);
  start(['--import', 'tsx', 'scripts/mail-fake.ts']);
  start(['--import', 'tsx', 'scripts/s3-fake.ts']);
  await sleep(1500);
  execFileSync('node', ['--conditions=react-server', '--import', 'tsx', 'db/migrate.ts'], { env, stdio: 'inherit' });
  execFileSync('node', ['--conditions=react-server', '--import', 'tsx', 'db/seed.ts'], { env, stdio: 'inherit' });
  execFileSync('npx', ['next', 'build'], { env, stdio: 'ignore' });
  start(['node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(APP_PORT)]);
  await waitFor(`${BASE}/api/health`, 120);

  const brewer = new TestClient('10.9.0.1');
  if (!(await brewer.signIn('wren@kettlefork.test', 'mash-paddle-demo'))) throw new Error('demo sign-in failed');
  const mine = (await brewer.get<{ recipes: { id: string; slug: string }[] }>('/api/recipes?owner=wren')).body.recipes;
  const pages = (await brewer.get<{ recipes: { slug: string }[] }>('/api/recipes')).body.recipes.map((r) => `/recipes/${r.slug}`);
  const target = mine[0];
  let head = (await brewer.get<{ recipe: { headVersionId: string } }>(`/api/recipes/${target.id}`)).body.recipe.headVersionId;
  const document = (await brewer.get<{ version: { document: Record<string, unknown> } }>(`/api/versions/${head}`)).body.version.document;

  const savedIds: string[] = [];
  const statuses = new Map<string, number>();
  const stackLeaks: string[] = [];
  let slowest = 0;
  const deadline = Date.now() + RUN_SECONDS * 1000;

  async function timed(label: string, run: () => Promise<Response>): Promise<Response | null> {
    const t = Date.now();
    try {
      const res = await run();
      const text = await res.clone().text();
      if (res.status >= 500 && /\bat .+\.(js|ts):\d+|node_modules/.test(text)) stackLeaks.push(`${label} ${res.status}`);
      const key = `${label} ${res.status}`;
      statuses.set(key, (statuses.get(key) ?? 0) + 1);
      return res;
    } catch (err) {
      statuses.set(`${label} error`, (statuses.get(`${label} error`) ?? 0) + 1);
      console.log(`${label}: ${(err as Error).message}`);
      return null;
    } finally {
      slowest = Math.max(slowest, Date.now() - t);
    }
  }

  const reader = async (n: number) => {
    const client = new TestClient(`10.9.1.${n}`);
    for (let i = 0; Date.now() < deadline; i++) await timed('page', () => client.fetch(pages[(i + n) % pages.length], { signal: AbortSignal.timeout(15_000) }));
  };
  const searcher = async (n: number) => {
    const client = new TestClient(`10.9.2.${n}`);
    const words = ['pale', 'stout', 'kveik', 'saaz', 'ipa', 'porter'];
    for (let i = 0; Date.now() < deadline; i++) await timed('search', () => client.fetch(`/api/search?q=${words[(i + n) % words.length]}`, { signal: AbortSignal.timeout(15_000) }));
  };
  const saver = async () => {
    for (let i = 0; Date.now() < deadline; i++) {
      const res = await timed('save', () =>
        brewer.fetch(`/api/recipes/${target.id}/versions`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ document: { ...document, notes: `load save ${i}` }, baseVersionId: head, message: `load save ${i}` }),
          signal: AbortSignal.timeout(15_000),
        }),
      );
      if (res && res.status === 201) {
        const body = (await res.json()) as { version: { id: string } };
        savedIds.push(body.version.id);
        head = body.version.id;
      } else if (res?.status === 409) {
        head = (await brewer.get<{ recipe: { headVersionId: string } }>(`/api/recipes/${target.id}`)).body.recipe.headVersionId ?? head;
      } else {
        await sleep(200);
      }
    }
  };

  const faults = (async () => {
    await sleep(8_000);
    console.log('stopping PostgreSQL for 8 s');
    db('stop');
    await sleep(8_000);
    db('start');
    console.log('PostgreSQL is back');
    await sleep(8_000);
    console.log('stopping the search service for 6 s');
    stop(search);
    await sleep(6_000);
    search = start(['--import', 'tsx', 'scripts/search-fake.ts']);
    console.log('search is back (empty: the app rebuilds it)');
  })();

  await Promise.all([...Array.from({ length: 8 }, (_, n) => reader(n)), searcher(0), searcher(1), saver(), faults]);

  console.log('answers:', Object.fromEntries([...statuses].sort()));
  check(slowest < 10_000, `no request took 10 s or more (slowest ${slowest} ms)`);
  check(stackLeaks.length === 0, `no 5xx answer carried a stack trace (${stackLeaks.length})`);
  // A page already rendering when the database drops ends on the plain error page (500); every
  // request that starts during the outage is answered 503 at once.
  const unexpected = [...statuses.keys()].filter((k) => /\b5\d\d$/.test(k) && !k.endsWith(' 503') && k !== 'page 500');
  check(unexpected.length === 0, `outage answers were 503, not other 5xx (${unexpected.join(', ') || 'none'})`);
  const caughtMidRender = statuses.get('page 500') ?? 0;
  check(caughtMidRender <= 20, `only pages caught mid-render by the outage ended on the error page (${caughtMidRender})`);
  check((statuses.get('page 503') ?? 0) > 0, 'pages answered 503 during the database outage');

  await waitFor(`${BASE}/api/health`, 30);
  const after = await new TestClient('10.9.3.1').fetch(pages[0]);
  check(after.status === 200, `the app recovered without a restart (page answers ${after.status})`);

  const client = new Client({ connectionString: databaseUrl });
  await client.connect();
  const found = savedIds.length ? (await client.query('select count(*)::int as n from recipe_versions where id = any($1::uuid[])', [savedIds])).rows[0].n : 0;
  check(savedIds.length > 0 && found === savedIds.length, `every save that answered 2xx is in the database (${found} of ${savedIds.length})`);

  let pending = -1;
  for (let i = 0; i < 60; i++) {
    pending = (await client.query('select count(*)::int as n from search_outbox')).rows[0].n;
    if (pending === 0) break;
    await sleep(1_000);
  }
  await client.end();
  check(pending === 0, `the search outbox drained after the search service came back (${pending} left)`);
  let hits = { status: 0, body: { total: 0 } };
  for (let i = 0; i < 30 && !(hits.status === 200 && hits.body.total > 1); i++) {
    hits = await new TestClient('10.9.3.2').get<{ total: number }>('/api/search?q=pale');
    await sleep(1_000);
  }
  check(hits.status === 200 && hits.body.total > 1, `search answers again with the whole index rebuilt (${hits.status}, ${hits.body.total} hits for "pale")`);
} catch (err) {
  failures.push((err as Error).message);
  console.error(err);
} finally {
  children.forEach(stop);
  execFileSync('bash', ['scripts/db.sh', 'start'], { stdio: 'ignore' });
}

console.log(failures.length ? `\n${failures.length} promise(s) broken` : '\nall promises kept');
process.exit(failures.length ? 1 : 0);
