import { execFileSync } from 'node:child_process';
import { Client } from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

// The demo world is seeded into a scratch database of its own (never the test database, whose
// recipes other tests count), with search pointed nowhere so the demo recipes stay out of the
// test index; then its calendar is checked.

const DATABASE = 'kettlefork_seed_check';
const TODAY = '2026-12-03';
let url = '';

async function rows<T>(text: string): Promise<T[]> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(text)).rows as T[];
  } finally {
    await client.end();
  }
}

beforeAll(() => {
  execFileSync('bash', ['scripts/db.sh', 'drop', DATABASE], { stdio: 'ignore' });
  execFileSync('bash', ['scripts/db.sh', 'create', DATABASE], { stdio: 'ignore' });
  url = execFileSync('bash', ['scripts/db.sh', 'url', DATABASE]).toString().trim();
  const env = { ...process.env, DATABASE_URL: url, DATABASE_REPLICA_URLS: '', MEILI_HOST: 'http://127.0.0.1:9' };
  for (const script of ['db/migrate.ts', 'db/seed.ts'])
    execFileSync('node', ['--conditions=react-server', '--import', 'tsx', script], { env, stdio: 'pipe' });
}, 600_000);

afterAll(() => {
  execFileSync('bash', ['scripts/db.sh', 'drop', DATABASE], { stdio: 'ignore' });
});

describe('the demo world’s calendar', { timeout: 60_000 }, () => {
  it('dates every version in 2026, before today, each after the one before it', async () => {
    const bad = await rows<{ id: string }>(`
      select v.id from recipe_versions v
      where v.created_at < '2026-01-01' or v.created_at >= '${TODAY}'
         or exists (select 1 from recipe_versions p
                    where p.recipe_id = v.recipe_id and p.number < v.number and p.created_at >= v.created_at)`);
    expect(bad).toEqual([]);
    const [{ months }] = await rows<{ months: number }>(
      `select count(distinct date_trunc('month', created_at))::int as months from recipe_versions`,
    );
    expect(months).toBeGreaterThanOrEqual(4);
  });

  it('starts each fork after the version it forked', async () => {
    const bad = await rows<{ slug: string }>(`
      select r.slug from recipes r
      join recipe_versions src on src.id = r.forked_from_version_id
      join recipe_versions first on first.recipe_id = r.id and first.number = 1
      where first.created_at <= src.created_at`);
    expect(bad).toEqual([]);
  });

  it('brews each brew day after its version was saved, and tastes it before today', async () => {
    const days = await rows<{ brewed_on: string; saved: string; last_tasting: string | null }>(`
      select b.brewed_on::text, v.created_at::date::text as saved,
             (select max(tasted_on)::text from tastings t where t.brew_day_id = b.id) as last_tasting
      from brew_days b join recipe_versions v on v.id = b.version_id`);
    expect(days.length).toBeGreaterThan(3);
    for (const d of days) {
      expect(d.brewed_on > d.saved).toBe(true);
      expect((d.last_tasting ?? d.brewed_on) < TODAY).toBe(true);
    }
  });

  it('posts comments after the version they discuss and replies after their thread', async () => {
    const bad = await rows<{ id: string }>(`
      select c.id from comments c
      join recipes r on r.id = c.recipe_id
      join recipe_versions v on v.recipe_id = c.recipe_id and v.number = coalesce(c.version_number, 1)
      left join comments p on p.id = c.parent_id
      where c.created_at <= v.created_at or c.created_at >= '${TODAY}' or c.created_at <= p.created_at`);
    expect(bad).toEqual([]);
  });

  it('opens proposals after the version they offer and the head they target, and saves an acceptance after it', async () => {
    const list = await rows<{ opened: Date; offered: Date; head: Date; accepted: Date | null; decided: Date | null }>(`
      select p.created_at as opened, pv.created_at as offered,
             (select max(created_at) from recipe_versions h
              where h.recipe_id = p.source_recipe_id and h.id is distinct from p.accepted_version_id) as head,
             av.created_at as accepted, p.decided_at as decided
      from proposals p
      join recipe_versions pv on pv.id = p.proposed_version_id
      left join recipe_versions av on av.id = p.accepted_version_id`);
    expect(list.length).toBeGreaterThanOrEqual(2);
    for (const p of list) {
      expect(p.opened.getTime()).toBeGreaterThan(p.offered.getTime());
      expect(p.opened.getTime()).toBeGreaterThan(p.head.getTime());
      if (p.accepted) expect(p.accepted.getTime()).toBeGreaterThan(p.opened.getTime());
    }
    const talk = await rows<{ id: string }>(`
      select c.id from proposal_comments c join proposals p on p.id = c.proposal_id where c.created_at <= p.created_at`);
    expect(talk).toEqual([]);
  });

  it('keeps each recipe’s dates to its versions’ and names no commercial yeast strain', async () => {
    const off = await rows<{ slug: string }>(`
      select r.slug from recipes r
      where r.updated_at <> (select max(created_at) from recipe_versions v where v.recipe_id = r.id)`);
    expect(off).toEqual([]);
    const yeasts = await rows<{ name: string }>(
      `select distinct y->>'name' as name from recipe_versions, jsonb_array_elements(document->'yeasts') y`,
    );
    const names = yeasts.map((y) => y.name);
    expect(names).toContain('English ale yeast, drier strain');
    expect(names).not.toContain('Dry English ale yeast');
  });
});
