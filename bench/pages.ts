// The page bench: the demo world in a scratch database, the production build served on every core
// (scripts/serve.mjs), and the throughput of recipe pages against a built script file and /about,
// each alone under 20 clients. Targets: a public version page at least half a static file's rate
// (it is a copy from memory, lib/page-cache.ts), the busiest recipe's head page at least 0.8 of
// /about's (a page with no data at all), and a signed-in reader's version page as the first.
import { rmSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { Client } from 'pg';
import { DEMO_PASSWORD } from '../db/seed/people';
import { runQuiet, scratchDatabase, startChild, stopChildren, waitFor } from '../tests/load/processes';
import { busiestRecipe, measureSpeed } from './page-speed';
import type { BenchRow } from './types';

const PORT = 3910;
const S3_PORT = 4910;
const BASE = `http://127.0.0.1:${PORT}`;
const DATABASE = 'kettlefork_pages';
const SECONDS = Number(process.env.KF_SPEED_SECONDS ?? 10);

export async function benchPages(): Promise<BenchRow[]> {
  const databaseUrl = scratchDatabase(DATABASE);
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: databaseUrl,
    NEXTAUTH_URL: BASE,
    NEXTAUTH_SECRET: 'bench-secret-0123456789abcdef0123456789',
    KF_SEARCH_SYNC: 'off',
    KF_EMAIL_SENDER: 'off',
    KF_DIST_DIR: '.next-bench',
    // The demo's brew-day photos go to the local S3 fake; search and mail are not needed here.
    S3_ENDPOINT: `http://127.0.0.1:${S3_PORT}`,
    S3_FAKE_PORT: String(S3_PORT),
    S3_FAKE_DIR: '.data/s3-bench',
    TRUST_PROXY: '1',
    NEXT_TELEMETRY_DISABLED: '1',
  } as NodeJS.ProcessEnv;
  const tsx = ['--conditions=react-server', '--import', 'tsx'];
  const { TestClient } = await import('../tests/helpers/http');
  const sql = new Client({ connectionString: databaseUrl });
  try {
    rmSync(env.S3_FAKE_DIR!, { recursive: true, force: true });
    startChild(['--import', 'tsx', 'scripts/s3-fake.ts'], env);
    await waitFor(`http://127.0.0.1:${S3_PORT}/`, 30);
    runQuiet('node', [...tsx, 'db/migrate.ts'], env);
    runQuiet('node', [...tsx, 'db/seed.ts'], env);
    console.log('bench pages: building into .next-bench');
    runQuiet('npx', ['next', 'build'], env);
    startChild(['scripts/serve.mjs', '-H', '127.0.0.1', '-p', String(PORT)], env);
    await waitFor(`${BASE}/api/health`, 120);
    await sql.connect();
    // A demo member reading someone else's recipe, as most signed-in readers do.
    const { slug } = await busiestRecipe(sql);
    const { email } = (
      await sql.query(
        `select u.email from users u
         where u.role = 'member' and u.units = 'metric' and u.suspended_at is null and u.password_hash is not null
           and u.id <> (select owner_id from recipes where slug = $1)
         order by u.handle limit 1`,
        [slug],
      )
    ).rows[0] as { email: string };
    const member = new TestClient('10.97.0.1', BASE);
    if (!(await member.signIn(email, DEMO_PASSWORD))) throw new Error(`could not sign in as ${email}`);
    const speed = await measureSpeed(BASE, sql, SECONDS, member.cookieHeader());
    const cores = availableParallelism();
    const t = speed.targets;
    const each = (name: keyof typeof t) => `${t[name]!.rps} req/s, p97.5 ${t[name]!.p975} ms`;
    const setup = `${cores} workers on ${cores} cores, 20 clients with gzip, ${SECONDS} s each, one after another; busiest demo recipe ${speed.busiest.slug} with ${speed.busiest.activity} brew days, comments and proposals`;
    const rows: BenchRow[] = [
      {
        area: 'pages',
        metric: `public version page against a built script file, throughput ratio (${each('busiest version 1 page')} against ${each('static asset')}; ${setup})`,
        value: speed.versionToStatic,
        unit: '×',
        target: { op: '>', value: 0.5 },
      },
      {
        area: 'pages',
        metric: `busiest recipe's head page against /about, throughput ratio (${each('busiest head page')} against ${each('/about')})`,
        value: speed.headToAbout,
        unit: '×',
        target: { op: '>', value: 0.8 },
      },
    ];
    if (speed.signedIn) {
      rows.push({
        area: 'pages',
        metric: `the same version page for a signed-in member against the script file (${each('busiest version 1 page, signed in')}; ${speed.signedIn.sharedCopy ? 'served the kept copy' : 'rendered for them'})`,
        value: speed.signedIn.versionToStatic,
        unit: '×',
        target: { op: '>', value: 0.5 },
      });
    }
    rows.push({
      area: 'pages',
      metric: 'non-2xx answers while measuring',
      value: Object.values(t).reduce((n, x) => n + (x?.non2xx ?? 0), 0),
      unit: 'count',
      target: { op: '<', value: 1 },
    });
    return rows;
  } finally {
    await stopChildren();
    await sql.end().catch(() => undefined);
  }
}
