import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { signedInClient } from '../helpers/users';

const API_DIR = path.resolve('app/api');
const MUTATING = ['POST', 'PUT', 'PATCH', 'DELETE'] as const;

/** Every state-changing JSON route in the app, found on disk so a new one cannot be forgotten. */
function mutatingRoutes(): { method: string; path: string }[] {
  const routes: { method: string; path: string }[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === 'route.ts') {
        const source = readFileSync(full, 'utf8');
        const urlPath = `/api/${path.relative(API_DIR, path.dirname(full)).split(path.sep).join('/')}`;
        // next-auth's own endpoints speak forms, not JSON, and are exercised by the sign-in tests.
        if (urlPath.startsWith('/api/auth/')) continue;
        for (const method of MUTATING) {
          if (new RegExp(`export (const|async function) ${method}\\b`).test(source))
            routes.push({ method, path: urlPath });
        }
      }
    }
  };
  walk(API_DIR);
  return routes;
}

/** Fills [param] segments with ids that name nothing. */
function concrete(routePath: string): string {
  return routePath.replace(/\[[^\]]+\]/g, () => crypto.randomUUID());
}

/** Rows anywhere in the database that point at this member, through any *_id column naming a person. */
async function rowsTouching(userId: string): Promise<number> {
  const columns = (
    await db.execute<{ table_name: string; column_name: string }>(sql`
      select table_name, column_name from information_schema.columns
      where table_schema = 'public' and data_type = 'text'
        and column_name in ('owner_id', 'author_id', 'user_id', 'brewer_id', 'proposer_id', 'reporter_id', 'actor_id', 'follower_id', 'taster_id', 'uploader_id')`)
  ).rows;
  let total = 0;
  for (const c of columns) {
    if (c.table_name === 'sessions' || c.table_name === 'accounts') continue;
    const [{ n }] = (
      await db.execute<{ n: number }>(
        sql.raw(
          `select count(*)::int as n from "${c.table_name}" where "${c.column_name}" = '${userId.replace(/'/g, "''")}'`,
        ),
      )
    ).rows;
    total += n;
  }
  return total;
}

const malformedBody = fc.oneof(
  fc.jsonValue().map((v) => JSON.stringify(v)),
  fc.string({ maxLength: 200 }),
  fc.constantFrom(
    '{',
    '{"document":',
    '[1,2',
    'null',
    '""',
    '{"__proto__":{"admin":true}}',
    '{"document":{"title":1e309}}',
    // Text PostgreSQL cannot store: a NUL byte, a lone surrogate, in values and in keys.
    '{"title":"a\\u0000b","body":"a\\u0000b","message":"a\\u0000b","text":"a\\u0000b"}',
    '{"title":"\\ud800","body":"\\udc00 tail","message":"\\ud83c"}',
    '{"a\\u0000":1}',
    // Deep nesting.
    '['.repeat(5_000) + ']'.repeat(5_000),
    '{"document":' + '{"a":'.repeat(2_000) + '1' + '}'.repeat(2_001),
  ),
  fc
    .dictionary(
      fc.constantFrom(
        'document',
        'message',
        'title',
        'visibility',
        'baseVersionId',
        'body',
        'reason',
        'role',
        'text',
        'format',
      ),
      fc.jsonValue(),
    )
    .map((o) => JSON.stringify(o)),
);

describe('every JSON route under malformed input', { timeout: 300_000 }, () => {
  it('never answers 5xx and changes nothing when it refuses', async () => {
    const routes = mutatingRoutes();
    expect(routes.length).toBeGreaterThan(15);
    const { client, user } = await signedInClient();
    const before = await rowsTouching(user.id);
    const failures: string[] = [];
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...routes), malformedBody, async (route, body) => {
        const res = await client.json(route.method, concrete(route.path), body, { 'content-type': 'application/json' });
        if (res.status >= 500) failures.push(`${route.method} ${route.path} → ${res.status} for ${body.slice(0, 80)}`);
        return res.status < 500;
      }),
      { numRuns: 300 },
    );
    expect(failures).toEqual([]);
    expect(await rowsTouching(user.id)).toBe(before);
  });
});
