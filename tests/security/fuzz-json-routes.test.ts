import fc from 'fast-check';
import { sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import type { User } from '@/db/schema';
import type { TestClient } from '../helpers/http';
import { ALL_METHODS, apiRoutes, type ApiRoute } from '../helpers/routes';
import { signedInClient } from '../helpers/users';
import { memberWorld, worldIdFor, type MemberWorld } from '../helpers/world';

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

/** Text that has broken the app before: NUL bytes, lone surrogates, control characters, huge and empty. */
const oddText = fc.oneof(
  fc.constantFrom(
    '\u0000',
    'a\u0000b',
    '\ud800',
    'x\udc00',
    '\udbff\u0000',
    '\u202e',
    '\r\n',
    '',
    ' ',
    'x'.repeat(70_000),
  ),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.string({ maxLength: 40 }).map((s) => `${s}\u0000`),
);

/** Ids that look almost right: all dashes, wrong length, capitals, braces, NUL. */
function nearMissIds(real: string) {
  return fc.constantFrom(
    '-'.repeat(36),
    real.slice(0, 35),
    `${real}a`,
    real.toUpperCase(),
    `{${real}}`,
    real.replace(/-/g, ''),
    `${real.slice(0, 35)}%00`,
    '00000000-0000-0000-0000-000000000000',
    crypto.randomUUID(),
  );
}

/** Arrays nested deep enough to trouble a recursive reader. */
const deepNesting = fc
  .integer({ min: 50, max: 5000 })
  .map(
    (depth) =>
      `{"document":${'['.repeat(depth)}${']'.repeat(depth)},"body":${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}}`,
  );

const FIELDS = [
  'document',
  'message',
  'title',
  'visibility',
  'baseVersionId',
  'versionId',
  'body',
  'reason',
  'role',
  'text',
  'format',
  'note',
  'notes',
  'name',
  'bio',
  'targetId',
  'targetType',
  'comment',
  'description',
  'overall',
  'id',
  'type',
  'parentId',
] as const;

/** Bodies: broken JSON, arbitrary JSON, known field names holding odd text or near-miss ids, deep nesting. */
function bodies(world: MemberWorld) {
  return fc.oneof(
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
    ),
    fc.dictionary(fc.constantFrom(...FIELDS), fc.oneof(fc.jsonValue(), oddText)).map((o) => JSON.stringify(o)),
    fc
      .dictionary(fc.constantFrom(...FIELDS), fc.oneof(oddText, nearMissIds(world.versionId)))
      .map((o) => JSON.stringify(o)),
    deepNesting,
  );
}

/** A query string of keys routes read (?owner=, ?actor=, ?reason=, …) holding odd text or ids. */
function queries(world: MemberWorld) {
  return fc.oneof(
    fc.constant(''),
    fc
      .dictionary(
        fc.constantFrom('owner', 'actor', 'reason', 'token', 'q', 'hop', 'a', 'b', 'page', 'format', 'direction'),
        fc.oneof(oddText, nearMissIds(world.versionId)),
        { minKeys: 1, maxKeys: 3 },
      )
      .map((o) => `?${new URLSearchParams(o).toString()}`),
  );
}

/** The route's [id] filled with one of the member's real rows (to get past "not found") or a near miss. */
function pathFor(route: ApiRoute, world: MemberWorld) {
  const real = worldIdFor(world, route.path);
  return fc
    .oneof(fc.constant(real), nearMissIds(real))
    .map((id) => route.path.replace('[id]', id).replace('[size]', 'thumb'));
}

describe('every JSON route under malformed input', { timeout: 600_000 }, () => {
  let client: TestClient;
  let user: User;
  let world: MemberWorld;
  // next-auth's own endpoints speak forms, not JSON, and are exercised by the sign-in tests.
  const routes = apiRoutes(ALL_METHODS).filter((r) => !r.path.startsWith('/api/auth/'));

  beforeAll(async () => {
    ({ client, user } = await signedInClient());
    world = await memberWorld(client, user);
  });

  it('never answers 5xx, and changes nothing when it refuses', async () => {
    expect(routes.filter((r) => r.method !== 'GET').length).toBeGreaterThan(15);
    const failures: string[] = [];
    const request = fc
      .constantFrom(...routes)
      .chain((route) => fc.tuple(fc.constant(route), pathFor(route, world), queries(world), bodies(world)));
    await fc.assert(
      fc.asyncProperty(request, async ([route, path, query, body]) => {
        const before = await rowsTouching(user.id);
        const res =
          route.method === 'GET'
            ? await client.get(path + query)
            : await client.json(route.method, path + query, body, { 'content-type': 'application/json' });
        const what = `${route.method} ${path + query} → ${res.status} for ${body.slice(0, 80)}`;
        if (res.status >= 500) failures.push(what);
        else if (res.status >= 400 && (await rowsTouching(user.id)) !== before) failures.push(`changed rows: ${what}`);
        return true;
      }),
      { numRuns: 400 },
    );
    expect(failures).toEqual([]);
  });
});
