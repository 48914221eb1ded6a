import { eq } from 'drizzle-orm';
import { Meilisearch } from 'meilisearch';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { recipes, recipeVersions, searchOutbox } from '@/db/schema';
import { computeStats, ENGINE_VERSION, recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing';
import { deleteRecipeDocuments, getSearchClient, searchRecipes } from '@/lib/search/client';
import { recipeSearchQuerySchema } from '@/lib/search/schemas';
import { ensureSearchReady, processSearchOutbox, rebuildSearchIndex } from '@/lib/search/sync';
import { hideRecipeThroughReport } from '../community/helpers';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { createUser, signedInClient } from '../helpers/users';
import { ids, searchVia, uniqueWord, waitForSearch } from './app-search';
import { startFake, type FakeHarness } from './fixtures';

/** An invented farmhouse IPA: Willamette and East Kent Golding, rye, a kveik strain, style 21A. */
function farmhouseIpa(word: string): RecipeDocumentInput {
  const doc = paleAle({ title: `Harvest ${word} Ale`, style: { code: '21A', name: 'American IPA' } });
  doc.hops = [
    { name: 'Willamette', amountG: 30, alphaPct: 5, use: 'boil', timeMin: 60, form: 'pellet' },
    { name: 'East Kent Golding', amountG: 40, alphaPct: 5.5, use: 'whirlpool', timeMin: 15, form: 'pellet', tempC: 80 },
    { name: 'Willamette', amountG: 50, alphaPct: 5, use: 'dry_hop', timeMin: 4320, form: 'leaf' },
  ];
  doc.fermentables = [
    ...doc.fermentables,
    { name: 'Rye malt', amountKg: 0.5, potentialPpg: 29, colorLovibond: 4, kind: 'grain' },
  ];
  doc.yeasts = [{ name: 'Farmhouse kveik blend', kind: 'kveik', attenuationPct: 80, tempMinC: 25, tempMaxC: 38 }];
  doc.fermentation = { steps: [{ tempC: 32, days: 5 }] };
  return doc;
}

const query = (input: Parameters<typeof recipeSearchQuerySchema.parse>[0]) => recipeSearchQuerySchema.parse(input);

describe('keeping the index in step with recipes', () => {
  it('finds a new recipe by title, hop, malt, yeast kind and style once its change is sent', async () => {
    const { client, user } = await signedInClient();
    const word = uniqueWord();
    const created = await createRecipeVia(client, { document: farmhouseIpa(word) });
    const anon = new TestClient();

    const found = await waitForSearch(anon, { q: word }, (body) => ids(body).includes(created.recipe.id));
    expect(found.hits[0]).toMatchObject({
      title: `Harvest ${word} Ale`,
      slug: created.recipe.slug,
      authorHandle: user.handle,
      styleCode: '21A',
      styleCategory: 'IPA',
      forks: 0,
      stars: 0,
      hidden: false,
    });
    const matching: Array<Record<string, string>> = [
      { hop: 'Willamette' },
      { hop: 'East Kent Golding' },
      { malt: 'Rye malt' },
      { yeast: 'kveik' },
      { style: '21A' },
    ];
    for (const filter of matching) {
      expect(ids((await searchVia(anon, { q: word, ...filter })).body), JSON.stringify(filter)).toEqual([
        created.recipe.id,
      ]);
    }
    const missing: Array<Record<string, string>> = [
      { hop: 'Saaz' },
      { malt: 'Smoked malt' },
      { yeast: 'lager' },
      { style: '4A' },
    ];
    for (const filter of missing) {
      expect((await searchVia(anon, { q: word, ...filter })).body.total, JSON.stringify(filter)).toBe(0);
    }
    // Each hop counts once, however many additions name it.
    expect((await searchVia(anon, { q: word })).body.facetDistribution.hops).toEqual({
      Willamette: 1,
      'East Kent Golding': 1,
    });

    const pending = await db.select().from(searchOutbox).where(eq(searchOutbox.recipeId, created.recipe.id));
    expect(pending).toEqual([]);
  });

  it('replaces a recipe’s document when a new version is saved', async () => {
    const { client } = await signedInClient();
    const before = uniqueWord();
    const after = uniqueWord();
    const created = await createRecipeVia(client, { document: farmhouseIpa(before) });
    const anon = new TestClient();
    await waitForSearch(anon, { q: before }, (body) => ids(body).includes(created.recipe.id));

    const changed = farmhouseIpa(after);
    changed.hops = [{ name: 'Saaz', amountG: 40, alphaPct: 3.5, use: 'boil', timeMin: 60, form: 'pellet' }];
    const saved = await saveVia(client, created.recipe.id, created.version.id, changed, 'Saaz only');
    expect(saved.status).toBe(201);

    await waitForSearch(anon, { q: after }, (body) => ids(body).includes(created.recipe.id));
    expect(ids((await searchVia(anon, { q: after, hop: 'Saaz' })).body)).toEqual([created.recipe.id]);
    expect((await searchVia(anon, { q: after, hop: 'Willamette' })).body.total).toBe(0);
    expect(ids((await searchVia(anon, { q: before })).body)).not.toContain(created.recipe.id);
  });

  it('counts a fork on the source recipe', async () => {
    const { client: owner } = await signedInClient();
    const { client: forker } = await signedInClient();
    const word = uniqueWord();
    const source = await createRecipeVia(owner, { document: farmhouseIpa(word) });
    const fork = await forker.post(`/api/versions/${source.version.id}/fork`, { title: `My take on ${word}` });
    expect(fork.status).toBe(201);
    const found = await waitForSearch(
      new TestClient(),
      { q: word },
      (body) => body.hits.find((hit) => hit.id === source.recipe.id)?.forks === 1,
    );
    expect(found.total).toBe(2);
  });

  it('takes a fork that moderators hide out of its source’s count, and counts it again once restored', async () => {
    const { client: owner } = await signedInClient();
    const { client: forker } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const word = uniqueWord();
    const source = await createRecipeVia(owner, { document: farmhouseIpa(word) });
    const fork = await forker.post<{ recipe: { id: string } }>(`/api/versions/${source.version.id}/fork`, {
      title: `Spam take on ${word}`,
    });
    expect(fork.status).toBe(201);
    const forksOfSource = (n: number) => (body: Parameters<Parameters<typeof waitForSearch>[2]>[0]) =>
      body.hits.find((hit) => hit.id === source.recipe.id)?.forks === n;
    await waitForSearch(new TestClient(), { q: word }, forksOfSource(1));

    await hideRecipeThroughReport(reader, moderator, fork.body.recipe.id);
    const afterHide = await waitForSearch(new TestClient(), { q: word }, forksOfSource(0));
    expect(ids(afterHide)).toEqual([source.recipe.id]);

    const restored = await moderator.post('/api/moderation/restore', {
      targetType: 'recipe',
      targetId: fork.body.recipe.id,
      reason: 'Reviewed again',
    });
    expect(restored.status).toBe(200);
    await waitForSearch(new TestClient(), { q: word }, forksOfSource(1));
  });
});

describe('when search is down', () => {
  class Rollback extends Error {}

  it('keeps changes in the outbox with their attempts counted, and sends them once search answers', async () => {
    const owner = await createUser();
    const word = uniqueWord();
    const document = recipeDocumentSchema.parse(paleAle({ title: `Outage ${word} Ale` }));
    const stats = computeStats(document);
    const unreachable = new Meilisearch({ host: 'http://127.0.0.1:9', timeout: 2_000 });
    const live = getSearchClient();
    let recipeId = '';

    // Everything happens in one transaction that is rolled back, so the app under test (which sends
    // every committed change) never sees this recipe or its outbox row.
    const run = db.transaction(async (tx) => {
      const [recipe] = await tx
        .insert(recipes)
        .values({ slug: `outage-${word}`, ownerId: owner.id, title: document.title })
        .returning({ id: recipes.id });
      recipeId = recipe.id;
      const [version] = await tx
        .insert(recipeVersions)
        .values({
          recipeId,
          number: 1,
          authorId: owner.id,
          document,
          stats,
          og: stats.og,
          fg: stats.fg,
          abv: stats.abv,
          ibu: stats.ibu,
          srm: stats.srm,
          styleCode: document.style?.code ?? null,
          engineVersion: ENGINE_VERSION,
        })
        .returning({ id: recipeVersions.id });
      await tx.update(recipes).set({ headVersionId: version.id, headNumber: 1 }).where(eq(recipes.id, recipeId));
      await tx.insert(searchOutbox).values({ recipeId });
      const outboxRows = () => tx.select().from(searchOutbox).where(eq(searchOutbox.recipeId, recipeId));

      await expect(processSearchOutbox(unreachable, tx)).resolves.toBeUndefined();
      let rows = await outboxRows();
      expect(rows).toHaveLength(1);
      expect(rows[0].attempts).toBe(1);
      expect(rows[0].lastError).toMatch(/\S/);

      await processSearchOutbox(unreachable, tx);
      rows = await outboxRows();
      expect(rows[0].attempts).toBe(2);
      expect((await searchRecipes(query({ q: word }), null, live)).total).toBe(0);

      await processSearchOutbox(live, tx);
      expect(await outboxRows()).toEqual([]);
      const result = await searchRecipes(query({ q: word }), null, live);
      expect(result.hits.map((hit) => hit.id)).toEqual([recipeId]);
      throw new Rollback();
    });
    await expect(run).rejects.toBeInstanceOf(Rollback);
    await deleteRecipeDocuments([recipeId], live);
  });
});

describe('rebuilding from PostgreSQL', () => {
  let fake: FakeHarness;
  beforeAll(async () => {
    fake = await startFake();
  });
  afterAll(async () => {
    await fake.server.close();
  });

  it('fills an empty index with every recipe, and leaves a filled one alone', async () => {
    const { client } = await signedInClient();
    const word = uniqueWord();
    const created = await createRecipeVia(client, { document: farmhouseIpa(word), visibility: 'private' });

    await ensureSearchReady(fake.client);
    const stats = await fake.client.index('recipes').getStats();
    expect(stats.numberOfDocuments).toBeGreaterThan(0);
    const owned = await searchRecipes(query({ q: word }), { id: (await client.me())!.id, role: 'member' }, fake.client);
    expect(owned.hits.map((hit) => hit.id)).toEqual([created.recipe.id]);
    expect(owned.hits[0].visibility).toBe('private');

    await deleteRecipeDocuments([created.recipe.id], fake.client);
    await ensureSearchReady(fake.client);
    expect(
      (await searchRecipes(query({ q: word }), { id: (await client.me())!.id, role: 'member' }, fake.client)).total,
    ).toBe(0);

    const rebuilt = await rebuildSearchIndex(fake.client);
    expect(rebuilt.count).toBeGreaterThanOrEqual(stats.numberOfDocuments);
    expect((await fake.client.index('recipes').getStats()).numberOfDocuments).toBe(rebuilt.count);
  });
});
