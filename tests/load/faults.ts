// npm run faults — the app under steady traffic while PostgreSQL, then the search service, then the
// SMTP server stop and come back. Loopback only, bounded in time; exits non-zero when a promise
// below is broken: no request hangs past 10 s, outage answers are plain 503s, the app recovers
// without a restart, every save that answered 2xx is in the database, the search index catches up,
// and notification e-mails caused while SMTP is down wait in the database and go out when it returns.
import { execFileSync } from 'node:child_process';
import { Client } from 'pg';
import { db, scratchDatabase, signalGroup, sleep, startChild, stopAndWait, stopChildren, waitFor } from './processes';

const APP_PORT = 3950;
const SEARCH_PORT = 7795;
const SMTP_PORT = 2595;
const OUTBOX_PORT = 2596;
const S3_PORT = 4595;
const BASE = `http://127.0.0.1:${APP_PORT}`;
const RUN_SECONDS = 50;
/** The e-mail sender loop's period for this run (30 s in service), so the SMTP outage fits in seconds. */
const EMAIL_LOOP_MS = 2_000;

const databaseUrl = scratchDatabase('kettlefork_faults');
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
  KF_DIST_DIR: '.next-load',
  KF_EMAIL_INTERVAL_MS: String(EMAIL_LOOP_MS),
  TRUST_PROXY: '1',
  NEXT_TELEMETRY_DISABLED: '1',
} as NodeJS.ProcessEnv;
process.env.KF_BASE_URL = BASE;
// Loaded after KF_BASE_URL is set, so the client talks to this run's app.
const { TestClient } = await import('../helpers/http');

const failures: string[] = [];
const check = (ok: boolean, message: string) => {
  if (!ok) failures.push(message);
  console.log(`${ok ? 'ok  ' : 'FAIL'} ${message}`);
};

try {
  let search = startChild(['--import', 'tsx', 'scripts/search-fake.ts'], env);
  let mail = startChild(['--import', 'tsx', 'scripts/mail-fake.ts'], env);
  startChild(['--import', 'tsx', 'scripts/s3-fake.ts'], env);
  await sleep(1500);
  execFileSync('node', ['--conditions=react-server', '--import', 'tsx', 'db/migrate.ts'], { env, stdio: 'inherit' });
  execFileSync('node', ['--conditions=react-server', '--import', 'tsx', 'db/seed.ts'], { env, stdio: 'inherit' });
  execFileSync('npx', ['next', 'build'], { env, stdio: 'ignore' });
  startChild(['scripts/serve.mjs', '-H', '127.0.0.1', '-p', String(APP_PORT)], env);
  await waitFor(`${BASE}/api/health`, 120);

  const brewer = new TestClient('10.9.0.1');
  if (!(await brewer.signIn('wren@kettlefork.test', 'mash-paddle-demo'))) throw new Error('demo sign-in failed');
  const mine = (await brewer.get<{ recipes: { id: string; slug: string }[] }>('/api/recipes?owner=wren')).body.recipes;
  const pages = (await brewer.get<{ recipes: { slug: string }[] }>('/api/recipes')).body.recipes.map(
    (r) => `/recipes/${r.slug}`,
  );
  const target = mine[0];
  let head = (await brewer.get<{ recipe: { headVersionId: string } }>(`/api/recipes/${target.id}`)).body.recipe
    .headVersionId;
  const document = (await brewer.get<{ version: { document: Record<string, unknown> } }>(`/api/versions/${head}`)).body
    .version.document;

  // For the SMTP outage: a member who has never been e-mailed (so no digest interval holds their
  // next message back) and owns a public recipe, and another member who comments on it. E-mails
  // for every kind are on until a member turns them off, so nothing needs switching on.
  const setup = new Client({ connectionString: databaseUrl });
  await setup.connect();
  const recipient = (
    await setup.query<{ email: string; recipeId: string }>(`
      select u.email, r.id as "recipeId" from users u join recipes r on r.owner_id = u.id
      where u.role = 'member' and u.suspended_at is null and u.handle <> 'wren' and r.visibility = 'public' and r.hidden_at is null
        and not exists (select 1 from notification_emails e where e.user_id = u.id)
      order by u.handle, r.slug limit 1`)
  ).rows[0];
  await setup.end();
  if (!recipient) throw new Error('no demo member without e-mails to notify');
  const commenter = new TestClient('10.9.4.1');
  const commenterEmail =
    recipient.email === 'kofi@kettlefork.test' ? 'juniper@kettlefork.test' : 'kofi@kettlefork.test';
  if (!(await commenter.signIn(commenterEmail, 'mash-paddle-demo'))) throw new Error('commenter sign-in failed');
  const mailOutage = { comments: 0, pending: 0, tried: false, received: 0, sentRows: 0 };

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
      if (res.status >= 500 && /\bat .+\.(js|ts):\d+|node_modules/.test(text))
        stackLeaks.push(`${label} ${res.status}`);
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
    for (let i = 0; Date.now() < deadline; i++)
      await timed('page', () => client.fetch(pages[(i + n) % pages.length], { signal: AbortSignal.timeout(15_000) }));
  };
  const searcher = async (n: number) => {
    const client = new TestClient(`10.9.2.${n}`);
    const words = ['pale', 'stout', 'kveik', 'saaz', 'ipa', 'porter'];
    for (let i = 0; Date.now() < deadline; i++)
      await timed('search', () =>
        client.fetch(`/api/search?q=${words[(i + n) % words.length]}`, { signal: AbortSignal.timeout(15_000) }),
      );
  };
  const saver = async () => {
    for (let i = 0; Date.now() < deadline; i++) {
      const res = await timed('save', () =>
        brewer.fetch(`/api/recipes/${target.id}/versions`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({
            document: { ...document, notes: `load save ${i}` },
            baseVersionId: head,
            message: `load save ${i}`,
          }),
          signal: AbortSignal.timeout(15_000),
        }),
      );
      if (res && res.status === 201) {
        const body = (await res.json()) as { version: { id: string } };
        savedIds.push(body.version.id);
        head = body.version.id;
      } else if (res?.status === 409) {
        head =
          (await brewer.get<{ recipe: { headVersionId: string } }>(`/api/recipes/${target.id}`)).body.recipe
            .headVersionId ?? head;
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
    signalGroup(search, 'SIGTERM');
    await sleep(6_000);
    search = startChild(['--import', 'tsx', 'scripts/search-fake.ts'], env);
    console.log('search is back (empty: the app rebuilds it)');
    await sleep(4_000);
    await smtpOutage();
  })();

  /** Stops the mail fake, comments on the recipient's recipe, and follows the e-mails through. */
  async function smtpOutage(): Promise<void> {
    console.log('stopping the SMTP server for 8 s');
    const outageStart = Date.now();
    await stopAndWait(mail);
    const tags: string[] = [];
    for (let i = 1; i <= 3; i++) {
      const tag = `mail-outage-${i}-${Date.now().toString(36)}`;
      const res = await commenter.post(`/api/recipes/${recipient.recipeId}/comments`, {
        body: `How long did you cold crash this one? (${tag})`,
      });
      if (res.status === 201) tags.push(tag);
      else console.log(`comment answered ${res.status}`);
    }
    mailOutage.comments = tags.length;
    const queue = new Client({ connectionString: databaseUrl });
    await queue.connect();
    try {
      const readQueue = async () =>
        (
          await queue.query<{ pending: number; tried: number; sent: number }>(
            `select count(*) filter (where sent_at is null)::int as pending,
                    count(*) filter (where sent_at is null and attempts > 0 and last_error is not null)::int as tried,
                    count(*) filter (where outcome = 'sent')::int as sent
             from notification_emails e join users u on u.id = e.user_id where u.email = $1`,
            [recipient.email],
          )
        ).rows[0];
      // The sender loop tries, fails, and leaves every row queued with its error.
      for (let i = 0; i < 40; i++) {
        const q = await readQueue();
        mailOutage.pending = q.pending;
        mailOutage.tried = q.pending > 0 && q.tried === q.pending;
        if (mailOutage.tried && q.pending >= tags.length) break;
        await sleep(250);
      }
      await sleep(Math.max(0, 8_000 - (Date.now() - outageStart)));
      mail = startChild(['--import', 'tsx', 'scripts/mail-fake.ts'], env);
      await waitFor(`http://127.0.0.1:${OUTBOX_PORT}/health`, 15);
      console.log('SMTP is back');
      for (let i = 0; i < 60 && mailOutage.received < tags.length; i++) {
        await sleep(500);
        const res = await fetch(`http://127.0.0.1:${OUTBOX_PORT}/messages?to=${encodeURIComponent(recipient.email)}`);
        const { messages } = (await res.json()) as { messages: { text: string }[] };
        mailOutage.received = tags.filter((tag) => messages.some((m) => m.text.includes(tag))).length;
      }
      mailOutage.sentRows = (await readQueue()).sent;
    } finally {
      await queue.end();
    }
  }

  await Promise.all([...Array.from({ length: 8 }, (_, n) => reader(n)), searcher(0), searcher(1), saver(), faults]);

  console.log('answers:', Object.fromEntries([...statuses].sort()));
  check(slowest < 10_000, `no request took 10 s or more (slowest ${slowest} ms)`);
  check(stackLeaks.length === 0, `no 5xx answer carried a stack trace (${stackLeaks.length})`);
  // A page already rendering when the database drops ends on the plain error page (500); every
  // request that starts during the outage is answered 503 at once.
  const unexpected = [...statuses.keys()].filter((k) => /\b5\d\d$/.test(k) && !k.endsWith(' 503') && k !== 'page 500');
  check(unexpected.length === 0, `outage answers were 503, not other 5xx (${unexpected.join(', ') || 'none'})`);
  const caughtMidRender = statuses.get('page 500') ?? 0;
  check(
    caughtMidRender <= 20,
    `only pages caught mid-render by the outage ended on the error page (${caughtMidRender})`,
  );
  check((statuses.get('page 503') ?? 0) > 0, 'pages answered 503 during the database outage');

  await waitFor(`${BASE}/api/health`, 30);
  const after = await new TestClient('10.9.3.1').fetch(pages[0]);
  check(after.status === 200, `the app recovered without a restart (page answers ${after.status})`);

  const client = new Client({ connectionString: databaseUrl });
  await client.connect();
  const found = savedIds.length
    ? (await client.query('select count(*)::int as n from recipe_versions where id = any($1::uuid[])', [savedIds]))
        .rows[0].n
    : 0;
  check(
    savedIds.length > 0 && found === savedIds.length,
    `every save that answered 2xx is in the database (${found} of ${savedIds.length})`,
  );

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
  check(
    hits.status === 200 && hits.body.total > 1,
    `search answers again with the whole index rebuilt (${hits.status}, ${hits.body.total} hits for "pale")`,
  );

  check(
    mailOutage.comments === 3 && mailOutage.tried && mailOutage.pending === mailOutage.comments,
    `notification e-mails wait while SMTP is down (${mailOutage.pending} pending, tried and kept with their error)`,
  );
  check(
    mailOutage.comments > 0 &&
      mailOutage.received === mailOutage.comments &&
      mailOutage.sentRows >= mailOutage.comments,
    `they are delivered when it returns (${mailOutage.received} received)`,
  );
} catch (err) {
  failures.push((err as Error).message);
  console.error(err);
} finally {
  await stopChildren();
  execFileSync('bash', ['scripts/db.sh', 'start'], { stdio: 'ignore' });
}

console.log(failures.length ? `\n${failures.length} promise(s) broken` : '\nall promises kept');
process.exit(failures.length ? 1 : 0);
