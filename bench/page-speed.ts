// Side-by-side page throughput on one build, shared by the page bench (bench/pages.ts) and the
// mixed-traffic run (tests/load/mixed.ts).
import autocannon from 'autocannon';
import type { Client } from 'pg';
import { round } from './stats';

export type SpeedTarget =
  'static asset' | '/about' | 'busiest head page' | 'busiest version 1 page' | 'busiest version 1 page, signed in';

export interface SpeedResult {
  busiest: { slug: string; activity: number };
  seconds: number;
  /** Requests per second and p97.5 latency for each target, by name. */
  targets: Partial<Record<SpeedTarget, { rps: number; p975: number; non2xx: number }>> &
    Record<Exclude<SpeedTarget, 'busiest version 1 page, signed in'>, { rps: number; p975: number; non2xx: number }>;
  versionToStatic: number;
  headToAbout: number;
  /** With a signed-in reader's cookie: their version page against the static file, and whether they got the kept copy. */
  signedIn?: { versionToStatic: number; sharedCopy: boolean };
}

/** The public, unhidden demo recipe with the most brew days, comments and proposals. */
export async function busiestRecipe(sql: Client): Promise<{ slug: string; activity: number }> {
  const row = (
    await sql.query(`
      select r.slug, (select count(*) from brew_days b where b.recipe_id = r.id)
        + (select count(*) from comments c where c.recipe_id = r.id)
        + (select count(*) from proposals p where p.source_recipe_id = r.id) as activity
      from recipes r join users u on u.id = r.owner_id
      where r.visibility = 'public' and r.hidden_at is null and u.handle <> 'loadbrewer'
      order by activity desc, r.slug limit 1`)
  ).rows[0] as { slug: string; activity: string };
  return { slug: row.slug, activity: Number(row.activity) };
}

/**
 * A built script file, /about, and the head and version 1 pages of the busiest demo recipe, each
 * for `seconds` under 20 clients with gzip, one after another; signed out, and the version page
 * once more with `cookie` (a signed-in reader's session) when one is given.
 */
export async function measureSpeed(base: string, sql: Client, seconds: number, cookie?: string): Promise<SpeedResult> {
  const busiest = await busiestRecipe(sql);
  const about = await (await fetch(`${base}/about`)).text();
  const asset = about.match(/<script[^>]*src="(\/_next\/static\/[^"]+\.js)"/)?.[1];
  if (!asset) throw new Error('no built script on /about to measure against');
  const version1 = `/recipes/${busiest.slug}/v/1`;
  const plans: [SpeedTarget, string, Record<string, string>][] = [
    ['static asset', asset, {}],
    ['/about', '/about', {}],
    ['busiest head page', `/recipes/${busiest.slug}`, {}],
    ['busiest version 1 page', version1, {}],
  ];
  if (cookie) plans.push(['busiest version 1 page, signed in', version1, { cookie }]);
  const targets = {} as SpeedResult['targets'];
  for (const [name, path, extra] of plans) {
    const headers = { 'accept-encoding': 'gzip', ...extra };
    const warm = await fetch(`${base}${path}`, { headers });
    await warm.arrayBuffer();
    if (!warm.ok) throw new Error(`${name} (${path}) answered ${warm.status}`);
    const result = await autocannon({ url: `${base}${path}`, connections: 20, duration: seconds, headers });
    targets[name] = { rps: round(result.requests.average, 0), p975: result.latency.p97_5, non2xx: result.non2xx };
  }
  const ratio = (a: number, b: number) => round(a / b, 2);
  let signedIn: SpeedResult['signedIn'];
  if (cookie) {
    const [anon, theirs] = await Promise.all([
      fetch(`${base}${version1}`),
      fetch(`${base}${version1}`, { headers: { cookie } }),
    ]);
    await Promise.all([anon.arrayBuffer(), theirs.arrayBuffer()]);
    signedIn = {
      versionToStatic: ratio(targets['busiest version 1 page, signed in']!.rps, targets['static asset'].rps),
      sharedCopy: anon.headers.get('etag') !== null && anon.headers.get('etag') === theirs.headers.get('etag'),
    };
  }
  return {
    busiest,
    seconds,
    targets,
    versionToStatic: ratio(targets['busiest version 1 page'].rps, targets['static asset'].rps),
    headToAbout: ratio(targets['busiest head page'].rps, targets['/about'].rps),
    signedIn,
  };
}
