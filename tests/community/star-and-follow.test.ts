import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { brewDays, notifications, recipes } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { textOf } from './helpers';

async function waitForSearchHit(q: string, match: (hit: { id: string; stars: number }) => boolean): Promise<void> {
  const deadline = Date.now() + 15_000;
  while (Date.now() < deadline) {
    const res = await new TestClient().get<{ hits: { id: string; stars: number }[] }>(
      `/api/search?q=${encodeURIComponent(q)}`,
    );
    if (res.status === 200 && res.body.hits.some(match)) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`search for ${q} never showed the expected hit`);
}

async function starCount(recipeId: string): Promise<number> {
  const [row] = await db.select({ n: recipes.starCount }).from(recipes).where(eq(recipes.id, recipeId));
  return row.n;
}

describe('stars', () => {
  it('keeps star_count in step, tells the owner once, and queues the recipe for search', async () => {
    const { client: owner, user: ownerUser } = await signedInClient();
    const { client: fan } = await signedInClient();
    const word = `zqstar${Date.now().toString(36)}`;
    const recipe = await createRecipeVia(owner, { document: paleAle({ title: `Starry ${word} Ale` }) });
    const starred = await fan.put<{ starred: boolean; starCount: number }>(`/api/recipes/${recipe.recipe.id}/star`);
    expect(starred.status).toBe(200);
    expect(starred.body).toEqual({ starred: true, starCount: 1 });
    expect((await fan.put(`/api/recipes/${recipe.recipe.id}/star`)).body).toEqual({ starred: true, starCount: 1 });
    expect(await starCount(recipe.recipe.id)).toBe(1);
    // Search ranks by stars: the index follows through the outbox within moments.
    await waitForSearchHit(word, (hit) => hit.id === recipe.recipe.id && hit.stars === 1);

    expect((await fan.delete(`/api/recipes/${recipe.recipe.id}/star`)).body).toEqual({ starred: false, starCount: 0 });
    expect((await fan.delete(`/api/recipes/${recipe.recipe.id}/star`)).body).toEqual({ starred: false, starCount: 0 });
    await fan.put(`/api/recipes/${recipe.recipe.id}/star`);
    const told = await db
      .select()
      .from(notifications)
      .where(and(eq(notifications.userId, ownerUser.id), eq(notifications.kind, 'star')));
    expect(told).toHaveLength(1);
    const page = await (await new TestClient().fetch(`/recipes/${recipe.recipe.slug}`)).text();
    expect(textOf(page)).toContain('Star (1)');
  });

  it('answers 404 for a recipe the member cannot see and 401 when signed out', async () => {
    const { client: owner } = await signedInClient();
    const { client: fan } = await signedInClient();
    const priv = await createRecipeVia(owner, { visibility: 'private' });
    expect((await fan.put(`/api/recipes/${priv.recipe.id}/star`)).status).toBe(404);
    expect((await new TestClient().put(`/api/recipes/${priv.recipe.id}/star`)).status).toBe(401);
    expect(await starCount(priv.recipe.id)).toBe(0);
  });
});

describe('follows and the feed', () => {
  it('brings a followed member’s new recipes, versions and brew days, and a followed recipe’s versions, into the feed', async () => {
    const { client: brewer, user: brewerUser } = await signedInClient();
    const { client: other } = await signedInClient();
    const { client: reader, user: readerUser } = await signedInClient();
    const watched = await createRecipeVia(other, { document: paleAle({ title: 'Watched Bitter' }) });
    expect((await reader.post('/api/follows', { type: 'member', id: brewerUser.id })).status).toBe(201);
    expect((await reader.post('/api/follows', { type: 'recipe', id: watched.recipe.id })).status).toBe(201);
    expect((await reader.post('/api/follows', { type: 'member', id: readerUser.id })).status).toBe(400);

    const fresh = await createRecipeVia(brewer, { document: paleAle({ title: 'Followed Pale' }) });
    await createRecipeVia(brewer, { visibility: 'private', document: paleAle({ title: 'Secret Pale' }) });
    await saveVia(other, watched.recipe.id, watched.version.id, paleAle({ title: 'Watched Bitter' }), 'More hops');
    await db.insert(brewDays).values({
      recipeId: fresh.recipe.id,
      versionId: fresh.version.id,
      brewerId: brewerUser.id,
      brewedOn: '2026-03-01',
    });

    const feed = textOf(await (await reader.fetch('/feed')).text());
    expect(feed).toContain('Followed Pale');
    expect(feed).toContain('saved version 2 of Watched Bitter');
    expect(feed).toContain('brewed Followed Pale (version 1)');
    expect(feed).not.toContain('Secret Pale');

    const told = await db
      .select()
      .from(notifications)
      .where(and(eq(notifications.userId, readerUser.id), eq(notifications.kind, 'new_recipe')));
    expect(told.map((n) => n.recipeId)).toEqual([fresh.recipe.id]);

    expect((await reader.delete('/api/follows', { type: 'member', id: brewerUser.id })).status).toBe(200);
    await createRecipeVia(brewer, { document: paleAle({ title: 'Unfollowed Pale' }) });
    expect(await (await reader.fetch('/feed')).text()).not.toContain('Unfollowed Pale');
  });

  it('tells the source owner about a public fork, and shows forks and stars received on the member page', async () => {
    const { client: owner, user: ownerUser } = await signedInClient();
    const { client: forker, user: forkerUser } = await signedInClient();
    const source = await createRecipeVia(owner, { document: paleAle({ title: 'Source Pale' }) });
    const fork = await forker.post<{ recipe: { slug: string } }>(`/api/versions/${source.version.id}/fork`, {
      title: 'Forked Pale',
      visibility: 'public',
    });
    expect(fork.status).toBe(201);
    await forker.put(`/api/recipes/${source.recipe.id}/star`);
    const told = await db
      .select()
      .from(notifications)
      .where(and(eq(notifications.userId, ownerUser.id), eq(notifications.kind, 'fork')));
    expect(told).toMatchObject([
      { actorId: forkerUser.id, recipeId: source.recipe.id, url: `/recipes/${fork.body.recipe.slug}` },
    ]);

    const forkerPage = await (await new TestClient().fetch(`/members/${forkerUser.handle}`)).text();
    expect(forkerPage).toContain('Forked Pale');
    expect(forkerPage).toContain('Source Pale');
    const ownerPage = await (await new TestClient().fetch(`/members/${ownerUser.handle}`)).text();
    expect(textOf(ownerPage)).toContain('1 star received');
  });
});
