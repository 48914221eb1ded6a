import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { ids, searchVia, uniqueWord, waitForSearch } from './app-search';

describe('GET /api/search: who sees what', () => {
  it('never shows a private or unlisted recipe to others, and shows a private one to its owner', async () => {
    const { client: owner } = await signedInClient();
    const { client: other } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const anon = new TestClient();
    const word = uniqueWord();
    const priv = await createRecipeVia(owner, {
      visibility: 'private',
      document: paleAle({ title: `Private ${word} Ale` }),
    });
    const unlisted = await createRecipeVia(owner, {
      visibility: 'unlisted',
      document: paleAle({ title: `Unlisted ${word} Ale` }),
    });
    const pub = await createRecipeVia(owner, {
      visibility: 'public',
      document: paleAle({ title: `Public ${word} Ale` }),
    });

    // Once the owner sees all three, the index holds them; the others must still see only the public one.
    const mine = await waitForSearch(owner, { q: word }, (body) => body.total === 3);
    expect(ids(mine).sort()).toEqual([priv.recipe.id, unlisted.recipe.id, pub.recipe.id].sort());
    expect(mine.hits.find((hit) => hit.id === priv.recipe.id)?.visibility).toBe('private');
    for (const viewer of [anon, other, moderator]) {
      const body = (await searchVia(viewer, { q: word })).body;
      expect(ids(body)).toEqual([pub.recipe.id]);
      expect(body.facetDistribution.hops).toEqual({ Magnum: 1, Cascade: 1, Centennial: 1 });
    }
  });

  it('follows a change of visibility', async () => {
    const { client: owner } = await signedInClient();
    const word = uniqueWord();
    const created = await createRecipeVia(owner, { document: paleAle({ title: `Shifting ${word} Ale` }) });
    const anon = new TestClient();
    await waitForSearch(anon, { q: word }, (body) => ids(body).includes(created.recipe.id));
    const changed = await owner.patch(`/api/recipes/${created.recipe.id}`, { visibility: 'private' });
    expect(changed.status).toBeLessThan(300);
    await waitForSearch(anon, { q: word }, (body) => body.total === 0);
    expect(ids((await searchVia(owner, { q: word })).body)).toEqual([created.recipe.id]);
  });

  it('answers an empty search with ways to loosen it', async () => {
    const { client: owner } = await signedInClient();
    const word = uniqueWord();
    const created = await createRecipeVia(owner, { document: paleAle({ title: `Loose ${word} Ale` }) });
    const anon = new TestClient();
    await waitForSearch(anon, { q: word }, (body) => ids(body).includes(created.recipe.id));
    const body = (await searchVia(anon, { q: word, hop: 'Saaz' })).body;
    expect(body.total).toBe(0);
    expect(body.hits).toEqual([]);
    expect(body.suggestions).toEqual(expect.arrayContaining([{ field: 'hop', value: 'Saaz', total: 1 }]));
    expect((await searchVia(anon, { q: word })).body.suggestions).toEqual([]);
  });
});

describe('GET /api/search: refusals', () => {
  const anon = new TestClient();

  async function refusedFields(params: Record<string, string | string[]>): Promise<string[]> {
    const res = await searchVia(anon, params);
    expect(res.status, JSON.stringify(params)).toBe(400);
    expect(res.body.error?.code).toBe('bad_request');
    return (res.body.error?.fields ?? []).map((field) => field.path);
  }

  it('names each field it refuses', async () => {
    expect(await refusedFields({ q: 'x'.repeat(201) })).toEqual(['q']);
    expect(await refusedFields({ sort: 'oldest' })).toEqual(['sort']);
    expect(await refusedFields({ abvMin: '7', abvMax: '4' })).toEqual(['abvMin']);
    expect(await refusedFields({ page: '0' })).toEqual(['page']);
    expect(await refusedFields({ page: 'two' })).toEqual(['page']);
    expect(await refusedFields({ ibuMax: 'lots' })).toEqual(['ibuMax']);
    // A list's refused value is named by its place: the second `hop` given is `hop.1`.
    expect(await refusedFields({ style: 'not a style code!' })).toEqual(['style.0']);
    expect(await refusedFields({ hop: ['Cascade', 'x'.repeat(101)] })).toEqual(['hop.1']);
    expect(await refusedFields({ malt: Array.from({ length: 21 }, (_, i) => `Malt ${i}`) })).toEqual(['malt']);
    expect(await refusedFields({ q: 'pale\u0000ale' })).toEqual(['q']);
    expect(await refusedFields({ ogMin: '1.3' })).toEqual(['ogMin']);
    expect((await refusedFields({ q: 'x'.repeat(201), sort: 'oldest', page: '-1' })).sort()).toEqual([
      'page',
      'q',
      'sort',
    ]);
  });

  it('answers each refused field with its path and message, as every route does', async () => {
    for (const [params, path, message] of [
      [{ sort: 'oldest' }, 'sort', 'sort must be one of relevance, newest, stars, forks'],
      [{ page: 'two' }, 'page', 'page must be a whole number from 1 to 1000'],
      [{ page: '1.5' }, 'page', 'page must be a whole number from 1 to 1000'],
      [{ srmMax: '101' }, 'srmMax', 'srmMax must be at most 100'],
    ] as const) {
      const res = await searchVia(anon, params);
      expect(res.status, JSON.stringify(params)).toBe(400);
      expect(res.body.error?.fields).toEqual([{ path, message }]);
      expect(res.body.error?.message).toBe(`Please check these fields: ${path}: ${message}`);
    }
  });

  it('gives people a message, never a stack', async () => {
    const res = await searchVia(anon, { abvMin: '9', abvMax: '2' });
    expect(res.body.error?.message).toMatch(/abvMin must not be greater than abvMax/);
    expect(JSON.stringify(res.body)).not.toMatch(/at \w+ \(|node_modules/);
  });
});

describe('GET /api/search: hostile values', () => {
  it('cannot widen the results with a filter value, the words or the sort', async () => {
    const { client: owner } = await signedInClient();
    const word = uniqueWord();
    const priv = await createRecipeVia(owner, {
      visibility: 'private',
      document: paleAle({ title: `Guarded ${word} Ale` }),
    });
    await waitForSearch(owner, { q: word }, (body) => ids(body).includes(priv.recipe.id));

    const anon = new TestClient();
    const hostile = [
      'Cascade" OR visibility = "private',
      'x") OR (visibility = "private',
      'Cascade\\" OR hidden = true OR x=\\"',
      "Cascade' OR '1'='1",
    ];
    for (const value of hostile) {
      for (const field of ['hop', 'malt', 'yeast']) {
        const res = await searchVia(anon, { q: word, [field]: value });
        expect(res.status, `${field}=${value}`).toBe(200);
        expect(res.body.total, `${field}=${value}`).toBe(0);
      }
      const res = await searchVia(anon, { q: `${word} ${value}` });
      expect(res.status).toBe(200);
      expect(ids(res.body)).not.toContain(priv.recipe.id);
    }
    expect((await searchVia(anon, { q: word, style: '21A"]OR[' })).status).toBe(400);
    expect((await searchVia(anon, { q: word, sort: 'stars:desc' })).status).toBe(400);
  });
});
