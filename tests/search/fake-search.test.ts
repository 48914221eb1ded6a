import { MeilisearchApiError } from 'meilisearch';
import { describe, expect, it } from 'vitest';
import { fakeAroundTests } from './fixtures';

const index = () => fake.client.index('beers');

const BEERS = [
  {
    id: 'b1',
    title: 'Cascade Sunrise',
    category: 'Pale Ale',
    hops: ['Cascade'],
    malts: ['Pale ale malt'],
    abv: 5.1,
    stars: 12,
  },
  {
    id: 'b2',
    title: 'Harbour Pale',
    category: 'Pale Ale',
    hops: ['Cascade', 'Centennial'],
    malts: ['Pale ale malt', 'Munich'],
    abv: 5.6,
    stars: 30,
  },
  {
    id: 'b3',
    title: 'Copper Bitter',
    category: 'Bitter',
    hops: ['Fuggle', 'East Kent Golding'],
    malts: ['Maris-style pale malt', 'Crystal 60'],
    abv: 4.1,
    stars: 8,
  },
  { id: 'b4', title: 'Village Pils', category: 'Lager', hops: ['Saaz'], malts: ['Pilsner malt'], abv: 4.9, stars: 30 },
  {
    id: 'b5',
    title: 'Forest Porter',
    category: 'Porter',
    hops: ['Willamette'],
    malts: ['Pale ale malt', 'Chocolate malt'],
    abv: 6.0,
    stars: 2,
  },
  {
    id: 'b6',
    title: 'Dark Sky Stout',
    category: 'Stout',
    hops: ['East Kent Golding'],
    malts: ['Roasted barley', 'Pale ale malt'],
    abv: 7.2,
    stars: 19,
  },
  {
    id: 'b7',
    title: 'Hop Ridge',
    category: 'IPA',
    hops: ['Chinook', 'Centennial', 'Cascade'],
    malts: ['Pale ale malt'],
    abv: 6.8,
  },
];

const fake = fakeAroundTests({
  setup: async () => {
    await index()
      .updateSettings({
        searchableAttributes: ['title', 'hops', 'malts', 'category'],
        filterableAttributes: ['category', 'hops', 'malts', 'abv', 'stars'],
        sortableAttributes: ['abv', 'stars', 'title'],
      })
      .waitTask();
    await index().addDocuments(BEERS, { primaryKey: 'id' }).waitTask();
  },
});

const hitIds = (hits: Array<Record<string, unknown>>) => hits.map((hit) => hit.id);

describe('text matching', () => {
  it('matches the last word as a prefix', async () => {
    const { hits } = await index().search('casc');
    expect(hitIds(hits).sort()).toEqual(['b1', 'b2', 'b7']);
  });

  it('tolerates a typo in a longer word', async () => {
    const { hits } = await index().search('cascde');
    expect(hitIds(hits).sort()).toEqual(['b1', 'b2', 'b7']);
    expect(hitIds((await index().search('centenial')).hits).sort()).toEqual(['b2', 'b7']);
  });

  it('allows no typo in a short word', async () => {
    expect((await index().search('sazz pils')).hits).toHaveLength(0);
  });

  it('requires every word, preferring the title', async () => {
    const { hits } = await index().search('cascade sunrise');
    expect(hitIds(hits)).toEqual(['b1']);
    expect(hitIds((await index().search('cascade')).hits)[0]).toBe('b1');
  });

  it('drops trailing words when no document holds them all, unless asked to match all', async () => {
    expect(hitIds((await index().search('stout zzzz')).hits)).toEqual(['b6']);
    expect((await index().search('stout zzzz', { matchingStrategy: 'all' })).hits).toHaveLength(0);
  });

  it('ignores letter case and diacritics', async () => {
    expect(hitIds((await index().search('VÍLLAGE')).hits)).toEqual(['b4']);
  });
});

describe('facets', () => {
  it('counts values over the matched documents and gives numeric min/max', async () => {
    const result = await index().search('', { filter: 'malts = "Pale ale malt"', facets: ['category', 'hops', 'abv'] });
    expect(result.facetDistribution?.category).toEqual({ IPA: 1, 'Pale Ale': 2, Porter: 1, Stout: 1 });
    expect(result.facetDistribution?.hops).toMatchObject({ Cascade: 3, Centennial: 2, 'East Kent Golding': 1 });
    expect(result.facetStats?.abv).toEqual({ min: 5.1, max: 7.2 });
  });

  it('refuses a facet that is not filterable', async () => {
    const error = await index()
      .search('', { facets: ['title'] })
      .catch((caught: unknown) => caught);
    expect((error as MeilisearchApiError).cause?.code).toBe('invalid_search_facets');
  });
});

describe('sorting', () => {
  it('sorts by one and several attributes, missing values last', async () => {
    expect(hitIds((await index().search('', { sort: ['abv:asc'] })).hits)).toEqual([
      'b3',
      'b4',
      'b1',
      'b2',
      'b5',
      'b7',
      'b6',
    ]);
    expect(hitIds((await index().search('', { sort: ['stars:desc', 'abv:asc'] })).hits)).toEqual([
      'b4',
      'b2',
      'b6',
      'b1',
      'b3',
      'b5',
      'b7',
    ]);
    expect(hitIds((await index().search('', { sort: ['stars:asc'] })).hits).at(-1)).toBe('b7');
  });

  it('keeps the order in step with writes: a changed value moves a document, a deleted one leaves, a new one joins', async () => {
    const shelf = fake.client.index('sorted-writes');
    await shelf.updateSettings({ sortableAttributes: ['stars'] }).waitTask();
    await shelf
      .addDocuments(
        [
          { id: 's1', title: 'One', stars: 1 },
          { id: 's2', title: 'Two', stars: 2 },
          { id: 's3', title: 'Three', stars: 3 },
        ],
        { primaryKey: 'id' },
      )
      .waitTask();
    const order = async () => hitIds((await shelf.search('', { sort: ['stars:desc'] })).hits);
    expect(await order()).toEqual(['s3', 's2', 's1']);
    await shelf.updateDocuments([{ id: 's1', stars: 9 }]).waitTask();
    expect(await order()).toEqual(['s1', 's3', 's2']);
    await shelf.addDocuments([{ id: 's2', title: 'Two, unrated' }]).waitTask();
    expect(await order()).toEqual(['s1', 's3', 's2']);
    await shelf.deleteDocument('s3').waitTask();
    await shelf.addDocuments([{ id: 's4', title: 'Four', stars: 5 }]).waitTask();
    expect(await order()).toEqual(['s1', 's4', 's2']);
  });

  it('refuses an attribute that is not sortable', async () => {
    const error = await index()
      .search('', { sort: ['category:asc'] })
      .catch((caught: unknown) => caught);
    expect((error as MeilisearchApiError).cause?.code).toBe('invalid_search_sort');
  });
});

describe('paging', () => {
  it('pages with limit and offset and estimates the total', async () => {
    const result = await index().search('', { sort: ['abv:asc'], limit: 2, offset: 2 });
    expect(hitIds(result.hits)).toEqual(['b1', 'b2']);
    expect(result).toMatchObject({ limit: 2, offset: 2, estimatedTotalHits: 7 });
  });

  it('pages with page and hitsPerPage and counts pages', async () => {
    const result = await index().search('', { sort: ['abv:asc'], page: 3, hitsPerPage: 3 });
    expect(hitIds(result.hits)).toEqual(['b6']);
    expect(result).toMatchObject({ page: 3, hitsPerPage: 3, totalHits: 7, totalPages: 3 });
    expect((await index().search('', { page: 9, hitsPerPage: 3 })).hits).toEqual([]);
  });

  it('returns only the attributes asked for', async () => {
    const { hits } = await index().search('pils', { attributesToRetrieve: ['id', 'title'] });
    expect(hits).toEqual([{ id: 'b4', title: 'Village Pils' }]);
  });

  it('reports processing time in whole milliseconds, no longer than the round trip the client saw', async () => {
    const sent = performance.now();
    const { processingTimeMs } = await index().search('pale');
    const roundTripMs = performance.now() - sent;
    expect(Number.isInteger(processingTimeMs)).toBe(true);
    expect(processingTimeMs).toBeGreaterThanOrEqual(0);
    // Rounding may add half a millisecond to the engine's own time, which the round trip contains.
    expect(processingTimeMs).toBeLessThanOrEqual(Math.ceil(roundTripMs));
  });
});

describe('GET search', () => {
  it('accepts the same parameters in the query string', async () => {
    const result = await index().searchGet('pale', {
      filter: 'abv < 5.5',
      sort: ['abv:desc'],
      facets: ['category'],
      attributesToRetrieve: ['id'],
    });
    expect(result.hits).toEqual([{ id: 'b1' }, { id: 'b3' }]);
    expect(result.facetDistribution?.category).toEqual({ Bitter: 1, 'Pale Ale': 1 });
  });
});

describe('freshness', () => {
  it('shows a saved document to the next query once its task has succeeded', async () => {
    expect((await index().search('meadowsweet')).hits).toHaveLength(0);
    const task = await index()
      .addDocuments([{ id: 'b8', title: 'Meadowsweet Gruit', category: 'Herb', hops: [], malts: [], abv: 4.4 }])
      .waitTask();
    expect(task.status).toBe('succeeded');
    expect(hitIds((await index().search('meadowsweet')).hits)).toEqual(['b8']);
    await index().deleteDocument('b8').waitTask();
    expect((await index().search('meadowsweet')).hits).toHaveLength(0);
  });

  it('reindexes an updated document for text and filters', async () => {
    await index()
      .updateDocuments([{ id: 'b5', title: 'Forest Brown', abv: 5.0 }])
      .waitTask();
    expect(hitIds((await index().search('brown', { filter: 'abv = 5' })).hits)).toEqual(['b5']);
    expect((await index().search('porter', { filter: 'abv = 6' })).hits).toHaveLength(0);
    expect((await index().search('', { filter: 'category = Porter' })).hits).toHaveLength(1);
  });
});
