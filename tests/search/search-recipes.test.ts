import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  deleteRecipeDocuments,
  ensureRecipeIndex,
  isSearchAvailable,
  searchRecipes,
  suggestLoosening,
  upsertRecipeDocuments,
  type SearchViewer,
} from '../../lib/search/client';
import { RECIPES_INDEX } from '../../lib/search/document';
import { buildRecipeFilter } from '../../lib/search/filters';
import { recipeSearchQuerySchema, type RecipeSearchQueryInput } from '../../lib/search/schemas';
import { recipe, startFake, type FakeHarness } from './fixtures';

let fake: FakeHarness;

const OWNER: SearchViewer = { id: 'owner-a', role: 'member' };
const OTHER: SearchViewer = { id: 'owner-b', role: 'member' };
const MODERATOR: SearchViewer = { id: 'mod-1', role: 'moderator' };

const RECIPES = [
  recipe({
    title: 'Porch Light Pale',
    hops: ['Cascade', 'Centennial'],
    abv: 5.4,
    ibu: 38,
    stars: 9,
    ownerId: 'owner-a',
  }),
  recipe({
    title: 'Cellar Door Lager',
    styleCode: '4A',
    styleName: 'Pale Malty Lager',
    styleCategory: 'Pale Malty European Lager',
    hops: ['Hallertau Mittelfrüh', 'Saaz'],
    fermentables: ['Pilsner malt', 'Munich'],
    yeasts: ['Bottom-fermenting lager yeast'],
    yeastKinds: ['lager'],
    abv: 4.8,
    ibu: 22,
    srm: 4,
    og: 1.048,
    stars: 20,
    ownerId: 'owner-b',
  }),
  recipe({
    title: 'Smoke Signal Porter',
    styleCode: '20A',
    styleName: 'Porter',
    styleCategory: 'Dark Ale',
    hops: ['Fuggle', 'East Kent Golding'],
    fermentables: ['Pale ale malt', 'Chocolate malt'],
    abv: 6.2,
    ibu: 30,
    srm: 30,
    og: 1.062,
    forks: 4,
    ownerId: 'owner-b',
  }),
  recipe({
    title: 'Farmhouse Kveik Pale',
    hops: ['Chinook', 'Cascade'],
    yeasts: ['Farmhouse kveik blend'],
    yeastKinds: ['kveik'],
    abv: 6.6,
    ibu: 45,
    ownerId: 'owner-b',
  }),
  recipe({ title: 'Draft Notes Pale', hops: ['Cascade'], visibility: 'private', ownerId: 'owner-a' }),
  recipe({ title: 'Shared Link Pale', hops: ['Cascade'], visibility: 'unlisted', ownerId: 'owner-b' }),
  recipe({ title: 'Flagged Pale', hops: ['Cascade'], hidden: true, ownerId: 'owner-b' }),
];

const query = (input: RecipeSearchQueryInput = {}) => recipeSearchQuerySchema.parse(input);
const titles = (result: { hits: Array<{ title: string }> }) => result.hits.map((hit) => hit.title).sort();

beforeAll(async () => {
  fake = await startFake();
  expect(await ensureRecipeIndex(fake.client)).toEqual({ documentCount: 0 });
  await upsertRecipeDocuments(RECIPES, fake.client);
});

afterAll(async () => {
  await fake.server.close();
});

describe('index setup', () => {
  it('is idempotent and reports the document count', async () => {
    expect(await ensureRecipeIndex(fake.client)).toEqual({ documentCount: RECIPES.length });
    const settings = await fake.client.index(RECIPES_INDEX).getSettings();
    expect(settings.filterableAttributes).toContain('hops');
    expect(settings.sortableAttributes).toContain('stars');
  });

  it('reports availability', async () => {
    expect(await isSearchAvailable(fake.client)).toBe(true);
    const { Meilisearch } = await import('meilisearch');
    expect(await isSearchAvailable(new Meilisearch({ host: 'http://127.0.0.1:9' }))).toBe(false);
  });
});

describe('viewer rule', () => {
  it('shows anonymous readers only public, unhidden recipes', async () => {
    const result = await searchRecipes(query({ q: 'cascade' }), null, fake.client);
    expect(titles(result)).toEqual(['Farmhouse Kveik Pale', 'Porch Light Pale']);
  });

  it('adds a member’s own recipes of any visibility, never others’ unlisted ones', async () => {
    expect(titles(await searchRecipes(query({ q: 'cascade' }), OWNER, fake.client))).toEqual([
      'Draft Notes Pale',
      'Farmhouse Kveik Pale',
      'Porch Light Pale',
    ]);
    expect(titles(await searchRecipes(query({ q: 'cascade' }), OTHER, fake.client))).toEqual([
      'Farmhouse Kveik Pale',
      'Flagged Pale',
      'Porch Light Pale',
      'Shared Link Pale',
    ]);
  });

  it('shows moderators hidden public recipes, marked hidden', async () => {
    const result = await searchRecipes(query({ q: 'cascade' }), MODERATOR, fake.client);
    expect(titles(result)).toEqual(['Farmhouse Kveik Pale', 'Flagged Pale', 'Porch Light Pale']);
    expect(result.hits.find((hit) => hit.title === 'Flagged Pale')?.hidden).toBe(true);
    expect(result.hits.find((hit) => hit.title === 'Porch Light Pale')?.hidden).toBe(false);
  });
});

describe('filters, facets and paging', () => {
  it('filters by style, hop, malt, yeast name or kind, and ranges', async () => {
    expect(titles(await searchRecipes(query({ style: ['4A', '20A'] }), null, fake.client))).toEqual([
      'Cellar Door Lager',
      'Smoke Signal Porter',
    ]);
    expect(titles(await searchRecipes(query({ hop: ['Cascade', 'Chinook'] }), null, fake.client))).toEqual([
      'Farmhouse Kveik Pale',
    ]);
    expect(titles(await searchRecipes(query({ malt: ['Munich'] }), null, fake.client))).toEqual(['Cellar Door Lager']);
    expect(titles(await searchRecipes(query({ yeast: ['kveik'] }), null, fake.client))).toEqual([
      'Farmhouse Kveik Pale',
    ]);
    expect(titles(await searchRecipes(query({ abvMin: 5, abvMax: 6.3, ibuMax: 35 }), null, fake.client))).toEqual([
      'Smoke Signal Porter',
    ]);
    expect(titles(await searchRecipes(query({ srmMin: 20, ogMin: 1.06 }), null, fake.client))).toEqual([
      'Smoke Signal Porter',
    ]);
  });

  it('returns the hit fields the results page shows, facet counts and stats', async () => {
    const result = await searchRecipes(query({ hop: ['Cascade'] }), null, fake.client);
    expect(result.total).toBe(2);
    expect(result.hits[0]).toEqual(
      expect.objectContaining({
        title: expect.any(String),
        slug: expect.any(String),
        authorName: 'Ada Brewer',
        styleName: 'American Pale Ale',
        og: expect.any(Number),
        fg: expect.any(Number),
        abv: expect.any(Number),
        ibu: expect.any(Number),
        srm: expect.any(Number),
        forks: 0,
        stars: expect.any(Number),
        hidden: false,
      }),
    );
    expect(result.hits[0]).not.toHaveProperty('notes');
    expect(result.facetDistribution.hops).toEqual({ Cascade: 2, Centennial: 1, Chinook: 1 });
    expect(result.facetDistribution.yeastKinds).toEqual({ 'clean ale': 1, kveik: 1 });
    expect(result.facetDistribution.styleCategory).toEqual({ 'Pale American Ale': 2 });
    expect(result.facetStats.abv).toEqual({ min: 5.4, max: 6.6 });
  });

  it('counts styles as if none were chosen, so a reader can add a second style', async () => {
    const result = await searchRecipes(query({ style: ['4A'] }), null, fake.client);
    expect(result.total).toBe(1);
    expect(result.facetDistribution.styleCode).toEqual({ '18B': 2, '4A': 1, '20A': 1 });
    expect(result.facetDistribution.styleCategory).toEqual({
      'Pale American Ale': 2,
      'Pale Malty European Lager': 1,
      'Dark Ale': 1,
    });
    expect(result.facetDistribution.hops).toEqual({ 'Hallertau Mittelfrüh': 1, Saaz: 1 });
  });

  it('sorts by stars, forks and newest, and pages', async () => {
    expect((await searchRecipes(query({ sort: 'stars' }), null, fake.client)).hits[0].title).toBe('Cellar Door Lager');
    expect((await searchRecipes(query({ sort: 'forks' }), null, fake.client)).hits[0].title).toBe(
      'Smoke Signal Porter',
    );
    expect((await searchRecipes(query({ sort: 'newest' }), null, fake.client)).hits[0].title).toBe(
      'Farmhouse Kveik Pale',
    );
    const second = await searchRecipes(query({ page: 2 }), null, fake.client);
    expect(second).toMatchObject({ page: 2, pageCount: 1, total: 4, hits: [] });
  });

  it('finds prefixes and typos in recipe words', async () => {
    expect(titles(await searchRecipes(query({ q: 'smok' }), null, fake.client))).toEqual(['Smoke Signal Porter']);
    expect(titles(await searchRecipes(query({ q: 'casc' }), null, fake.client))).toEqual([
      'Farmhouse Kveik Pale',
      'Porch Light Pale',
    ]);
    expect(titles(await searchRecipes(query({ q: 'cascde' }), null, fake.client))).toEqual([
      'Farmhouse Kveik Pale',
      'Porch Light Pale',
    ]);
  });
});

describe('hostile values', () => {
  const hostile = 'Cascade" OR hidden = true OR x="';

  it('quotes every string so a value cannot widen the filter', async () => {
    const filter = buildRecipeFilter(query({ hop: [hostile] }), null);
    expect(filter).toContain('hops = "Cascade\\" OR hidden = true OR x=\\""');
    const result = await searchRecipes(query({ hop: [hostile], yeast: [hostile], malt: [hostile] }), null, fake.client);
    expect(result.total).toBe(0);
  });

  it('keeps a hostile viewer id inside its quotes', async () => {
    const result = await searchRecipes(query(), { id: 'x" OR visibility = "private', role: 'member' }, fake.client);
    expect(result.hits.every((hit) => hit.visibility === 'public' && !hit.hidden)).toBe(true);
  });

  it('matches a value holding quotes and backslashes literally', async () => {
    const odd = recipe({ title: 'Odd Hop Trial', hops: ['Trial "X" \\ blend'] });
    await upsertRecipeDocuments([odd], fake.client);
    expect(titles(await searchRecipes(query({ hop: ['Trial "X" \\ blend'] }), null, fake.client))).toEqual([
      'Odd Hop Trial',
    ]);
    await deleteRecipeDocuments([odd.id], fake.client);
    expect((await searchRecipes(query({ q: 'odd hop trial' }), null, fake.client)).total).toBe(0);
  });
});

describe('suggestLoosening', () => {
  it('names the filters whose removal would give results', async () => {
    const tooStrong = query({ q: 'porter', hop: ['Fuggle'], abvMax: 5 });
    expect((await searchRecipes(tooStrong, null, fake.client)).total).toBe(0);
    expect(await suggestLoosening(tooStrong, null, fake.client)).toEqual([{ field: 'abv', total: 1 }]);

    const tooManyHops = query({ q: 'lager', hop: ['Saaz', 'Cascade'] });
    expect(await suggestLoosening(tooManyHops, null, fake.client)).toEqual([
      { field: 'hop', value: 'Cascade', total: 1 },
    ]);
  });

  it('offers nothing when no single change helps', async () => {
    expect(await suggestLoosening(query({ q: 'zzzzzz', hop: ['Nonesuch'] }), null, fake.client)).toEqual([]);
  });
});
