/**
 * The search fake answers as the engine does, or refuses with the engine's documented error code
 * and status — never accepts a request and quietly drops part of it. Driven through the official
 * `meilisearch` client against a fake on a free loopback port.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { apiError, fakeAroundTests, refusal } from './fixtures';

const fake = fakeAroundTests();

const ids = (hits: Array<Record<string, unknown>>) => hits.map((hit) => hit.id);

const LOG = [
  { id: 'n1', title: 'Amber session', info: { comment: 'smooth caramel finish', reviewNb: 12 }, notes: 'pale' },
  { id: 'n2', title: 'Pale session', info: { comment: 'bright citrus nose', reviewNb: 3 }, notes: 'caramel' },
  { id: 'n3', title: 'Dark session', info: { comment: 'roasty and dry', reviewNb: 40 }, notes: 'citrus' },
];

describe('attributesToSearchOn', () => {
  const index = () => fake.client.index('search-on');

  beforeAll(async () => {
    await index()
      .updateSettings({ searchableAttributes: ['title', 'notes', 'info.comment'] })
      .waitTask();
    await index().addDocuments(LOG, { primaryKey: 'id' }).waitTask();
  });

  it('searches only the attributes named', async () => {
    expect(ids((await index().search('caramel')).hits).sort()).toEqual(['n1', 'n2']);
    expect(ids((await index().search('caramel', { attributesToSearchOn: ['notes'] })).hits)).toEqual(['n2']);
    expect(ids((await index().search('caramel', { attributesToSearchOn: ['info.comment'] })).hits)).toEqual(['n1']);
    expect(ids((await index().search('caramel', { attributesToSearchOn: ['*'] })).hits).sort()).toEqual(['n1', 'n2']);
  });

  it('narrows a wildcard index to nested fields too', async () => {
    const open = fake.client.index('search-on-all');
    await open.addDocuments(LOG, { primaryKey: 'id' }).waitTask();
    expect(ids((await open.search('citrus', { attributesToSearchOn: ['info.comment'] })).hits)).toEqual(['n2']);
    expect(ids((await open.search('citrus', { attributesToSearchOn: ['info'] })).hits)).toEqual(['n2']);
    expect(ids((await open.searchGet('citrus', { attributesToSearchOn: ['notes'] })).hits)).toEqual(['n3']);
  });

  it('refuses an attribute that is not searchable', async () => {
    expect(await refusal(index().search('caramel', { attributesToSearchOn: ['id'] }))).toEqual({
      status: 400,
      code: 'invalid_search_attributes_to_search_on',
    });
  });
});

describe('nested fields', () => {
  const index = () => fake.client.index('nested');

  beforeAll(async () => {
    await index()
      .updateSettings({
        searchableAttributes: ['title', 'info.comment'],
        sortableAttributes: ['info.reviewNb'],
        filterableAttributes: ['info'],
      })
      .waitTask();
    await index().addDocuments(LOG, { primaryKey: 'id' }).waitTask();
  });

  it('searches a nested field', async () => {
    expect(ids((await index().search('roasty')).hits)).toEqual(['n3']);
  });

  it('sorts on a nested field both ways', async () => {
    expect(ids((await index().search('', { sort: ['info.reviewNb:asc'] })).hits)).toEqual(['n2', 'n1', 'n3']);
    expect(ids((await index().search('', { sort: ['info.reviewNb:desc'] })).hits)).toEqual(['n3', 'n1', 'n2']);
  });

  it('filters and counts facets on fields below a filterable parent', async () => {
    const result = await index().search('', { filter: 'info.reviewNb > 10', facets: ['info.reviewNb'] });
    expect(ids(result.hits).sort()).toEqual(['n1', 'n3']);
    expect(result.facetStats?.['info.reviewNb']).toEqual({ min: 12, max: 40 });
  });

  it('retrieves a nested field in its parent object', async () => {
    const { hits } = await index().search('roasty', { attributesToRetrieve: ['id', 'info.comment'] });
    expect(hits).toEqual([{ id: 'n3', info: { comment: 'roasty and dry' } }]);
  });
});

describe('getDocuments', () => {
  const index = () => fake.client.index('listing');

  beforeAll(async () => {
    await index()
      .updateSettings({ sortableAttributes: ['abv'], filterableAttributes: ['style'] })
      .waitTask();
    await index()
      .addDocuments(
        [
          { id: 1, style: 'stout', abv: 6.5 },
          { id: 2, style: 'mild', abv: 3.4 },
          { id: 3, style: 'stout', abv: 4.2 },
          { id: 4, style: 'bitter', abv: 4.0 },
        ],
        { primaryKey: 'id' },
      )
      .waitTask();
  });

  it('returns only the ids asked for, in stored order', async () => {
    const listed = await index().getDocuments({ ids: [3, 1] });
    expect(listed.results.map((doc) => doc.id)).toEqual([1, 3]);
    expect(listed.total).toBe(2);
    const filtered = await index().getDocuments({ ids: ['1', '2', '3'], filter: 'style = stout' });
    expect(filtered.results.map((doc) => doc.id)).toEqual([1, 3]);
  });

  it('sorts by a sortable attribute', async () => {
    const listed = await index().getDocuments({ sort: ['abv:asc'], fields: ['id'] });
    expect(listed.results).toEqual([{ id: 2 }, { id: 4 }, { id: 3 }, { id: 1 }]);
    const fetched = await index().getDocuments({ sort: ['abv:desc'], filter: 'style = stout', limit: 1 });
    expect(fetched.results.map((doc) => doc.id)).toEqual([1]);
  });

  it('refuses a sort on an attribute that is not sortable, and invalid ids', async () => {
    expect(await refusal(index().getDocuments({ sort: ['style:asc'] }))).toEqual({
      status: 400,
      code: 'invalid_document_sort',
    });
    expect(await refusal(index().getDocuments({ sort: ['style:asc'], filter: 'style = mild' }))).toEqual({
      status: 400,
      code: 'invalid_document_sort',
    });
    expect(await refusal(index().getDocuments({ ids: ['bad/id'] }))).toEqual({
      status: 400,
      code: 'invalid_document_ids',
    });
  });

  it('refuses a filter on an attribute that is not filterable with the documents code', async () => {
    expect(await refusal(index().getDocuments({ filter: 'abv > 4' }))).toEqual({
      status: 400,
      code: 'invalid_document_filter',
    });
  });
});

describe('deleteDocuments by filter', () => {
  const index = () => fake.client.index('deleting');

  it('refuses an empty filter', async () => {
    await index()
      .addDocuments([{ id: 'd1', style: 'mild' }])
      .waitTask();
    const error = await apiError(index().deleteDocuments({ filter: '' }));
    expect(error.response.status).toBe(400);
    expect(error.cause?.code).toBe('invalid_document_filter');
    expect(error.message).toContain('Sending an empty filter is forbidden.');
    expect(await refusal(index().deleteDocuments({ filter: [] }))).toEqual({
      status: 400,
      code: 'invalid_document_filter',
    });
  });

  it('fails the task for an attribute that is not filterable', async () => {
    const task = await index().deleteDocuments({ filter: 'style = mild' }).waitTask();
    expect(task.status).toBe('failed');
    expect(task.error?.code).toBe('invalid_document_filter');
    expect((await index().getStats()).numberOfDocuments).toBe(1);
  });
});

describe('task list filters', () => {
  it('filters by enqueue time, exclusively, and lists oldest first with reverse', async () => {
    const index = fake.client.index('timed');
    const first = await index.addDocuments([{ id: 't1' }]).waitTask();
    await new Promise((resolve) => setTimeout(resolve, 5));
    const second = await index.addDocuments([{ id: 't2' }]).waitTask();

    const after = await fake.client.tasks.getTasks({ indexUids: ['timed'], afterEnqueuedAt: first.enqueuedAt });
    expect(after.results.map((task) => task.uid)).toEqual([second.uid]);
    const before = await fake.client.tasks.getTasks({ indexUids: ['timed'], beforeEnqueuedAt: second.enqueuedAt });
    expect(before.results.map((task) => task.uid)).toEqual([first.uid]);
    const finished = await fake.client.tasks.getTasks({ indexUids: ['timed'], beforeFinishedAt: '2000-01-01' });
    expect(finished.results).toEqual([]);

    const reversed = await fake.client.tasks.getTasks({ indexUids: ['timed'], reverse: true });
    expect(reversed.results.map((task) => task.uid)).toEqual([first.uid, second.uid]);
    const paged = await fake.client.tasks.getTasks({ indexUids: ['timed'], reverse: true, limit: 1 });
    expect(paged).toMatchObject({ from: first.uid, next: second.uid });
  });

  it('refuses unknown types, bad dates and unknown parameters', async () => {
    const tasks = fake.client.tasks;
    expect(await refusal(tasks.getTasks({ types: ['recipeBrewing' as 'indexCreation'] }))).toEqual({
      status: 400,
      code: 'invalid_task_types',
    });
    expect(await refusal(tasks.getTasks({ afterEnqueuedAt: 'last tuesday' }))).toEqual({
      status: 400,
      code: 'invalid_task_after_enqueued_at',
    });
    expect(await refusal(tasks.getTasks({ reverse: 'sometimes' as unknown as boolean }))).toEqual({
      status: 400,
      code: 'invalid_task_reverse',
    });
    expect(await refusal(tasks.getTasks({ uids: [-1] }))).toEqual({ status: 400, code: 'invalid_task_uids' });
    expect(
      await refusal(tasks.getTasks({ brewDay: 'saturday' } as unknown as Parameters<typeof tasks.getTasks>[0])),
    ).toEqual({ status: 400, code: 'bad_request' });
  });
});

describe('resetting nested settings with null', () => {
  const index = () => fake.client.index('resets');

  beforeAll(async () => {
    await index()
      .updateSettings({ filterableAttributes: ['style'] })
      .waitTask();
    await index()
      .addDocuments([
        { id: 'r1', style: 'mild' },
        { id: 'r2', style: 'stout' },
      ])
      .waitTask();
  });

  it('puts maxTotalHits back to its default and keeps finding documents', async () => {
    await index().updatePagination({ maxTotalHits: 1 }).waitTask();
    expect((await index().search('')).estimatedTotalHits).toBe(1);
    expect((await index().updatePagination({ maxTotalHits: null }).waitTask()).status).toBe('succeeded');
    expect(await index().getPagination()).toEqual({ maxTotalHits: 1000 });
    expect(ids((await index().search('')).hits)).toEqual(['r1', 'r2']);
  });

  it('puts maxValuesPerFacet back to its default and keeps counting facets', async () => {
    await index().updateFaceting({ maxValuesPerFacet: 12 }).waitTask();
    await index().updateFaceting({ maxValuesPerFacet: null }).waitTask();
    expect(await index().getFaceting()).toEqual({ maxValuesPerFacet: 100, sortFacetValuesBy: { '*': 'alpha' } });
    expect((await index().search('', { facets: ['style'] })).facetDistribution?.style).toEqual({ mild: 1, stout: 1 });
  });

  it('replaces sortFacetValuesBy as a whole, with `*` alphabetical unless given', async () => {
    await index()
      .updateFaceting({ maxValuesPerFacet: 7, sortFacetValuesBy: { style: 'count' } })
      .waitTask();
    expect(await index().getFaceting()).toEqual({
      maxValuesPerFacet: 7,
      sortFacetValuesBy: { '*': 'alpha', style: 'count' },
    });
    await index()
      .updateFaceting({ sortFacetValuesBy: { '*': 'count' } })
      .waitTask();
    expect(await index().getFaceting()).toEqual({ maxValuesPerFacet: 7, sortFacetValuesBy: { '*': 'count' } });
  });

  it('refuses a nested setting of the wrong type', async () => {
    expect(await refusal(index().updatePagination({ maxTotalHits: 'many' as unknown as number }))).toEqual({
      status: 400,
      code: 'invalid_settings_pagination',
    });
    expect(await refusal(index().updateFaceting({ sortFacetValuesBy: { style: 'random' as 'count' } }))).toEqual({
      status: 400,
      code: 'invalid_settings_faceting',
    });
  });
});

describe('renaming an index', () => {
  it('moves documents and settings to the new uid', async () => {
    await fake.client
      .index('old-name')
      .updateSettings({ filterableAttributes: ['style'] })
      .waitTask();
    await fake.client
      .index('old-name')
      .addDocuments([{ id: 'x1', style: 'mild' }])
      .waitTask();
    const task = await fake.client.updateIndex('old-name', { uid: 'new-name' }).waitTask();
    expect(task).toMatchObject({
      status: 'succeeded',
      type: 'indexUpdate',
      indexUid: 'old-name',
      details: { oldIndexUid: 'old-name', newIndexUid: 'new-name' },
    });
    expect(await refusal(fake.client.getRawIndex('old-name'))).toEqual({ status: 404, code: 'index_not_found' });
    expect((await fake.client.getIndex('new-name')).uid).toBe('new-name');
    expect(await fake.client.index('new-name').getFilterableAttributes()).toEqual(['style']);
    expect(ids((await fake.client.index('new-name').search('', { filter: 'style = mild' })).hits)).toEqual(['x1']);
  });

  it('fails the task when the new uid is taken, and refuses an invalid uid', async () => {
    await fake.client.createIndex('taken-a').waitTask();
    await fake.client.createIndex('taken-b').waitTask();
    const task = await fake.client.updateIndex('taken-a', { uid: 'taken-b' }).waitTask();
    expect(task.status).toBe('failed');
    expect(task.error?.code).toBe('index_already_exists');
    expect(await refusal(fake.client.updateIndex('taken-a', { uid: 'not valid!' }))).toEqual({
      status: 400,
      code: 'invalid_index_uid',
    });
  });
});

describe('finite pagination', () => {
  const index = () => fake.client.index('pages');

  beforeAll(async () => {
    await index()
      .addDocuments([{ id: 'p1' }, { id: 'p2' }, { id: 'p3' }])
      .waitTask();
  });

  it('answers page 0 with no hits but the real counts', async () => {
    const result = await index().search('', { page: 0, hitsPerPage: 2 });
    expect(result.hits).toEqual([]);
    expect(result).toMatchObject({ page: 0, hitsPerPage: 2, totalHits: 3, totalPages: 2 });
  });

  it('answers hitsPerPage 0 with no hits and no pages', async () => {
    const result = await index().search('', { page: 1, hitsPerPage: 0 });
    expect(result.hits).toEqual([]);
    expect(result).toMatchObject({ page: 1, hitsPerPage: 0, totalHits: 3, totalPages: 0 });
  });
});
