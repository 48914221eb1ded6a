import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

describe('who can see and change a recipe', () => {
  it('keeps a private recipe invisible to others on every route, answering 404 as for a missing one', async () => {
    const { client: owner } = await signedInClient();
    const { client: other } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const anon = new TestClient();
    const priv = await createRecipeVia(owner, { visibility: 'private' });
    const pub = await createRecipeVia(owner);
    const missing = '00000000-0000-4000-8000-000000000000';

    for (const viewer of [other, anon, moderator]) {
      const reads = [
        `/api/recipes/${priv.recipe.id}`,
        `/api/recipes/${priv.recipe.id}/versions`,
        `/api/recipes/${priv.recipe.id}/lineage`,
        `/api/versions/${priv.version.id}`,
        `/api/compare?a=${priv.version.id}&b=${pub.version.id}`,
      ];
      for (const path of reads) {
        const res = await viewer.get<{ error: { message: string } }>(path);
        expect(res.status, path).toBe(404);
        const missingRes = await viewer.get<{ error: { message: string } }>(
          path.replaceAll(priv.recipe.id, missing).replaceAll(priv.version.id, missing),
        );
        expect(res.body.error.message, path).toBe(missingRes.body.error.message);
      }
      const pages = [
        `/recipes/${priv.recipe.slug}`,
        `/recipes/${priv.recipe.slug}/history`,
        `/recipes/${priv.recipe.slug}/v/1`,
      ];
      for (const path of pages) expect((await viewer.fetch(path)).status, path).toBe(404);
    }
    for (const viewer of [other, moderator]) {
      expect((await viewer.post(`/api/versions/${priv.version.id}/fork`, { title: 'Mine now' })).status).toBe(404);
      expect((await saveVia(viewer, priv.recipe.id, priv.version.id, paleAle())).status).toBe(404);
    }
    expect((await owner.get(`/api/recipes/${priv.recipe.id}`)).status).toBe(200);
    expect((await owner.fetch(`/recipes/${priv.recipe.slug}`)).status).toBe(200);
  });

  it('lists only public recipes to others, and all of mine to me', async () => {
    const { client: owner, user } = await signedInClient();
    await createRecipeVia(owner, { visibility: 'private', document: paleAle({ title: 'Secret Stash Ale' }) });
    await createRecipeVia(owner, { visibility: 'unlisted', document: paleAle({ title: 'Link Only Ale' }) });
    await createRecipeVia(owner, { visibility: 'public', document: paleAle({ title: 'Open Door Ale' }) });
    const titles = async (c: TestClient) =>
      ((await c.get<{ recipes: { title: string }[] }>(`/api/recipes?owner=${user.handle}`)).body.recipes ?? [])
        .map((r) => r.title)
        .sort();
    expect(await titles(new TestClient())).toEqual(['Open Door Ale']);
    expect(await titles(owner)).toEqual(['Link Only Ale', 'Open Door Ale', 'Secret Stash Ale']);
  });

  it('lets anyone read an unlisted recipe by its link', async () => {
    const { client: owner } = await signedInClient();
    const unlisted = await createRecipeVia(owner, { visibility: 'unlisted' });
    expect((await new TestClient().get(`/api/recipes/${unlisted.recipe.id}`)).status).toBe(200);
  });

  it('answers 401 to signed-out writes and 403 to a member saving someone else’s public recipe', async () => {
    const { client: owner } = await signedInClient();
    const { client: other } = await signedInClient();
    const pub = await createRecipeVia(owner);
    expect((await new TestClient().post('/api/recipes', { document: paleAle() })).status).toBe(401);
    expect((await saveVia(new TestClient(), pub.recipe.id, pub.version.id, paleAle())).status).toBe(401);
    const res = await saveVia(other, pub.recipe.id, pub.version.id, paleAle());
    expect(res.status).toBe(403);
    expect((await other.patch(`/api/recipes/${pub.recipe.id}`, { visibility: 'private' })).status).toBe(403);
    expect((await owner.patch(`/api/recipes/${pub.recipe.id}`, { visibility: 'private' })).status).toBe(200);
    expect((await other.get(`/api/recipes/${pub.recipe.id}`)).status).toBe(404);
  });

  it('answers a malformed id with 404 and a malformed query with 400 naming the field', async () => {
    const client = new TestClient();
    expect((await client.get('/api/recipes/not-a-uuid')).status).toBe(404);
    const res = await client.get<{ error: { fields: { path: string }[] } }>('/api/compare?a=1&b=2');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f) => f.path).sort()).toEqual(['a', 'b']);
    const page = await client.get<{ error: { fields: { path: string }[] } }>('/api/recipes?page=-3');
    expect(page.status).toBe(400);
    expect(page.body.error.fields[0].path).toBe('page');
  });
});
