import { beforeAll, describe, expect, it } from 'vitest';
import type { TestClient } from '../helpers/http';
import { ALL_METHODS, apiRoutes } from '../helpers/routes';
import { signedInClient } from '../helpers/users';

// Every route about one row, found on disk with the methods it answers, so a new one cannot be
// left out. A path id that is not an id names no row: each answers 404, exactly as a missing row,
// and never reaches PostgreSQL (which would answer "invalid input syntax for type uuid").
const ROUTES: [method: string, path: (id: string) => string][] = apiRoutes(ALL_METHODS)
  .filter((route) => route.path.includes('[id]'))
  .map((route) => [
    route.method,
    (id: string) =>
      route.path.replace('[id]', id).replace('[size]', 'thumb') +
      (route.path.endsWith('/export') ? '?format=beerjson' : ''),
  ]);

const MALFORMED = [
  '------------------------------------', // 36 characters, the length of an id
  '0000000-0000-4000-8000-000000000000', // one short
  '00000000-0000-4000-8000-0000000000000', // one long
  '{00000000-0000-4000-8000-000000000000}', // braces, which PostgreSQL itself would accept
  'zzzzzzzz-zzzz-zzzz-zzzz-zzzzzzzzzzzz',
  'not-an-id',
  '%00',
];

describe('malformed ids in the path', () => {
  it('finds the routes about one row on disk, the newest included', () => {
    const found = ROUTES.map(([method, path]) => `${method} ${path(':id')}`);
    expect(found).toEqual(expect.arrayContaining(['GET /api/me/members/:id', 'POST /api/brew-days/:id/live']));
    expect(found.length).toBeGreaterThan(35);
  });

  let admin: TestClient;
  beforeAll(async () => {
    // An admin passes every access level, so what answers is the id check itself.
    ({ client: admin } = await signedInClient('admin'));
  });

  for (const [method, path] of ROUTES) {
    it(`${method} ${path(':id')} answers 404 for each malformed id`, async () => {
      for (const id of MALFORMED) {
        const res = await admin.json<{ error: { code: string } }>(
          method,
          path(encodeURIComponent(id).replace('%2500', '%00')),
          method === 'GET' ? undefined : {},
        );
        expect(res.status, `${method} ${path(id)}`).toBe(404);
        expect(res.body.error.code).toBe('not_found');
      }
    });
  }
});
