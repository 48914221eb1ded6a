import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { createRecipeVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

const IMMUTABLE = 'public, max-age=31536000, immutable';

describe('immutable version JSON and exports', () => {
  it('lets any cache keep a public version for a year, with an ETag that answers 304 when it still matches', async () => {
    const { client: owner } = await signedInClient();
    const saved = await createRecipeVia(owner);
    const anon = new TestClient();
    for (const path of [
      `/api/versions/${saved.version.id}`,
      `/api/versions/${saved.version.id}/export?format=beerxml`,
      `/api/versions/${saved.version.id}/export?format=beerjson`,
      `/api/versions/${saved.version.id}/export?format=kettlefork`,
    ]) {
      const first = await anon.fetch(path);
      expect(first.status, path).toBe(200);
      expect(first.headers.get('cache-control'), path).toBe(IMMUTABLE);
      const etag = first.headers.get('etag');
      expect(etag, path).toMatch(/^"[A-Za-z0-9_-]{20,}"$/);
      const body = await first.text();
      expect(body.length, path).toBeGreaterThan(100);

      // The same bytes for its owner, so the owner's browser and a stranger's share one validator.
      const mine = await owner.fetch(path);
      expect(mine.headers.get('etag'), path).toBe(etag);
      expect(await mine.text(), path).toBe(body);

      const again = await anon.fetch(path, { headers: { 'if-none-match': etag! } });
      expect(again.status, path).toBe(304);
      expect(again.headers.get('etag'), path).toBe(etag);
      expect(again.headers.get('cache-control'), path).toBe(IMMUTABLE);
      expect(await again.text(), path).toBe('');

      const stale = await anon.fetch(path, { headers: { 'if-none-match': '"something-else"' } });
      expect(stale.status, path).toBe(200);
      expect(await stale.text(), path).toBe(body);
    }
    // Each format is its own file with its own tag.
    const tags = await Promise.all(
      ['beerxml', 'beerjson', 'kettlefork'].map(async (f) =>
        (await anon.fetch(`/api/versions/${saved.version.id}/export?format=${f}`)).headers.get('etag'),
      ),
    );
    expect(new Set(tags).size).toBe(3);
  });

  it('caches unlisted versions like public ones, but never a private one', async () => {
    const { client: owner } = await signedInClient();
    const unlisted = await createRecipeVia(owner, { visibility: 'unlisted' });
    const anon = new TestClient();
    const res = await anon.fetch(`/api/versions/${unlisted.version.id}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe(IMMUTABLE);

    const priv = await createRecipeVia(owner, { visibility: 'private' });
    for (const path of [`/api/versions/${priv.version.id}`, `/api/versions/${priv.version.id}/export`]) {
      const res = await owner.fetch(path);
      expect(res.status, path).toBe(200);
      expect(res.headers.get('cache-control'), path).toBe('private, no-store');
      expect(res.headers.get('etag'), path).toBeNull();
      expect((await anon.fetch(path)).status, path).toBe(404);
    }
  });
});
