import { beforeAll, describe, expect, it } from 'vitest';
import type { TestClient } from '../helpers/http';
import { signedInClient } from '../helpers/users';

// Every route about one row, with the methods it answers. A path id that is not an id names no row:
// each answers 404, exactly as a missing row, and never reaches PostgreSQL (which would answer
// "invalid input syntax for type uuid").
const ROUTES: [method: string, path: (id: string) => string][] = [
  ['PUT', (id) => `/api/admin/users/${id}/role`],
  ['POST', (id) => `/api/brew-days/${id}/photos`],
  ['POST', (id) => `/api/brew-days/${id}/readings`],
  ['GET', (id) => `/api/brew-days/${id}`],
  ['PATCH', (id) => `/api/brew-days/${id}`],
  ['POST', (id) => `/api/brew-days/${id}/tastings`],
  ['PATCH', (id) => `/api/comments/${id}`],
  ['DELETE', (id) => `/api/comments/${id}`],
  ['POST', (id) => `/api/moderation/comments/${id}`],
  ['POST', (id) => `/api/moderation/reports/${id}`],
  ['GET', (id) => `/api/photos/${id}/thumb`],
  ['GET', (id) => `/api/photos/${id}/display`],
  ['DELETE', (id) => `/api/photos/${id}`],
  ['POST', (id) => `/api/proposals/${id}/accept`],
  ['POST', (id) => `/api/proposals/${id}/comments`],
  ['POST', (id) => `/api/proposals/${id}/decision`],
  ['GET', (id) => `/api/proposals/${id}`],
  ['PATCH', (id) => `/api/proposals/${id}`],
  ['POST', (id) => `/api/proposals/${id}/withdraw`],
  ['GET', (id) => `/api/recipes/${id}/comments`],
  ['POST', (id) => `/api/recipes/${id}/comments`],
  ['GET', (id) => `/api/recipes/${id}/lineage`],
  ['POST', (id) => `/api/recipes/${id}/restore`],
  ['GET', (id) => `/api/recipes/${id}`],
  ['PATCH', (id) => `/api/recipes/${id}`],
  ['PUT', (id) => `/api/recipes/${id}/star`],
  ['DELETE', (id) => `/api/recipes/${id}/star`],
  ['GET', (id) => `/api/recipes/${id}/versions`],
  ['POST', (id) => `/api/recipes/${id}/versions`],
  ['PUT', (id) => `/api/users/${id}/suspension`],
  ['GET', (id) => `/api/versions/${id}/export?format=beerjson`],
  ['GET', (id) => `/api/versions/${id}`],
  ['POST', (id) => `/api/versions/${id}/fork`],
];

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
