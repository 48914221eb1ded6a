import { MeilisearchApiError } from 'meilisearch';
import { describe, expect, it } from 'vitest';
import { apiError, fakeAroundTests } from './fixtures';

const fake = fakeAroundTests();

describe('health and version', () => {
  it('reports itself available', async () => {
    expect(await fake.client.health()).toEqual({ status: 'available' });
    expect(await fake.client.isHealthy()).toBe(true);
    expect((await fake.client.getVersion()).pkgVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });
});

describe('indexes', () => {
  it('creates, lists, describes and deletes an index through tasks', async () => {
    const enqueued = await fake.client.createIndex('beers', { primaryKey: 'id' });
    expect(enqueued).toMatchObject({ indexUid: 'beers', status: 'enqueued', type: 'indexCreation' });
    const task = await fake.client.tasks.waitForTask(enqueued.taskUid);
    expect(task).toMatchObject({ uid: enqueued.taskUid, status: 'succeeded', error: null, indexUid: 'beers' });
    expect(task.startedAt).not.toBeNull();
    expect(task.finishedAt).not.toBeNull();
    expect(task.duration).toMatch(/^PT\d+\.\d+S$/);

    const index = await fake.client.getIndex('beers');
    expect(index.primaryKey).toBe('id');
    const { results } = await fake.client.getRawIndexes();
    expect(results.map((raw) => raw.uid)).toContain('beers');

    expect((await fake.client.deleteIndex('beers').waitTask()).status).toBe('succeeded');
    const missing = await apiError(fake.client.getRawIndex('beers'));
    expect(missing.cause).toMatchObject({ code: 'index_not_found', type: 'invalid_request' });
    expect(missing.response.status).toBe(404);
  });

  it('fails the task when the index already exists', async () => {
    await fake.client.createIndex('twice').waitTask();
    const second = await fake.client.createIndex('twice').waitTask();
    expect(second.status).toBe('failed');
    expect(second.error).toMatchObject({ code: 'index_already_exists' });
  });

  it('refuses an invalid index uid at once', async () => {
    const error = await apiError(fake.client.createIndex('bad uid!'));
    expect(error.response.status).toBe(400);
    expect(error.cause?.code).toBe('invalid_index_uid');
  });

  it('answers 404 index_not_found when searching a missing index', async () => {
    const error = await apiError(fake.client.index('nowhere').search('x'));
    expect(error.response.status).toBe(404);
    expect(error.cause).toMatchObject({ code: 'index_not_found', link: expect.stringContaining('index_not_found') });
  });
});

describe('settings', () => {
  it('applies and reads back settings', async () => {
    const index = fake.client.index('settings-check');
    const task = await index
      .updateSettings({
        searchableAttributes: ['title', 'hops'],
        filterableAttributes: ['hops', 'abv'],
        sortableAttributes: ['abv'],
        rankingRules: ['sort', 'words', 'typo', 'proximity', 'attribute', 'exactness'],
        typoTolerance: { minWordSizeForTypos: { oneTypo: 4, twoTypos: 8 } },
      })
      .waitTask();
    expect(task).toMatchObject({ status: 'succeeded', type: 'settingsUpdate' });
    const settings = await index.getSettings();
    expect(settings.searchableAttributes).toEqual(['title', 'hops']);
    expect(settings.filterableAttributes).toEqual(['hops', 'abv']);
    expect(settings.sortableAttributes).toEqual(['abv']);
    expect(settings.typoTolerance?.minWordSizeForTypos).toEqual({ oneTypo: 4, twoTypos: 8 });
    expect(await index.getFilterableAttributes()).toEqual(['hops', 'abv']);

    await index.updateSortableAttributes(['abv', 'ibu']).waitTask();
    expect(await index.getSortableAttributes()).toEqual(['abv', 'ibu']);
    await index.resetSortableAttributes().waitTask();
    expect(await index.getSortableAttributes()).toEqual([]);
  });

  it('refuses a settings payload of the wrong type', async () => {
    const error = await apiError(
      fake.client.index('settings-check').updateSettings({ filterableAttributes: 'hops' as unknown as string[] }),
    );
    expect(error.response.status).toBe(400);
    expect(error.cause?.code).toBe('invalid_settings_filterable_attributes');
  });
});

describe('documents', () => {
  const index = () => fake.client.index('docs');

  it('adds, replaces, updates and reads documents', async () => {
    const added = await index()
      .addDocuments([
        { id: 'a1', title: 'Amber', abv: 5 },
        { id: 'a2', title: 'Bitter', abv: 4 },
      ])
      .waitTask();
    expect(added).toMatchObject({
      status: 'succeeded',
      type: 'documentAdditionOrUpdate',
      details: { receivedDocuments: 2, indexedDocuments: 2 },
    });
    expect((await fake.client.getIndex('docs')).primaryKey).toBe('id');

    await index()
      .addDocuments([{ id: 'a1', title: 'Amber Two' }])
      .waitTask();
    expect(await index().getDocument('a1')).toEqual({ id: 'a1', title: 'Amber Two' });

    await index()
      .updateDocuments([{ id: 'a2', abv: 4.2 }])
      .waitTask();
    expect(await index().getDocument('a2')).toEqual({ id: 'a2', title: 'Bitter', abv: 4.2 });
    expect(await index().getDocument('a2', { fields: ['title'] })).toEqual({ title: 'Bitter' });

    const listed = await index().getDocuments({ limit: 1 });
    expect(listed.total).toBe(2);
    expect(listed.results).toHaveLength(1);
    expect((await index().getStats()).numberOfDocuments).toBe(2);
  });

  it('deletes one, a batch and all documents', async () => {
    await index()
      .addDocuments([{ id: 'd1' }, { id: 'd2' }, { id: 'd3' }, { id: 'd4' }])
      .waitTask();
    expect((await index().deleteDocument('d1').waitTask()).details?.deletedDocuments).toBe(1);
    const missing = await apiError(index().getDocument('d1'));
    expect(missing.response.status).toBe(404);
    expect(missing.cause?.code).toBe('document_not_found');

    const batch = await index().deleteDocuments(['d2', 'd3', 'never']).waitTask();
    expect(batch).toMatchObject({
      status: 'succeeded',
      type: 'documentDeletion',
      details: { providedIds: 3, deletedDocuments: 2 },
    });

    await index().deleteAllDocuments().waitTask();
    expect((await index().getStats()).numberOfDocuments).toBe(0);
  });

  it('fails the task for a document without a valid id, keeping the batch out', async () => {
    const bad = await index()
      .addDocuments([{ id: 'ok-1' }, { id: 'not valid!' }])
      .waitTask();
    expect(bad.status).toBe('failed');
    expect(bad.error).toMatchObject({ code: 'invalid_document_id', type: 'invalid_request' });
    await expect(index().getDocument('ok-1')).rejects.toBeInstanceOf(MeilisearchApiError);
  });
});

describe('tasks', () => {
  it('answers enqueued, then processes tasks one at a time in order', async () => {
    const index = fake.client.index('ordered');
    const first = await index.addDocuments([{ id: 'x1', n: 1 }]);
    const second = await index.addDocuments([{ id: 'x1', n: 2 }]);
    expect(second.taskUid).toBeGreaterThan(first.taskUid);
    expect(second.status).toBe('enqueued');
    const [a, b] = await fake.client.tasks.waitForTasks([first, second]);
    expect(Date.parse(a.finishedAt ?? '')).toBeLessThanOrEqual(Date.parse(b.startedAt ?? ''));
    expect(await index.getDocument('x1')).toEqual({ id: 'x1', n: 2 });

    const listed = await fake.client.tasks.getTasks({ indexUids: ['ordered'], limit: 1 });
    expect(listed.results).toHaveLength(1);
    expect(listed.results[0].uid).toBe(second.taskUid);
    expect(listed.next).toBe(first.taskUid);
  });

  it('answers 404 task_not_found for an unknown task', async () => {
    const error = await apiError(fake.client.tasks.getTask(999_999));
    expect(error.cause?.code).toBe('task_not_found');
  });
});

describe('authorization', () => {
  const locked = fakeAroundTests({ apiKey: 'brewing-secret' });

  it('accepts the configured key and leaves /health open', async () => {
    expect((await locked.client.createIndex('locked').waitTask()).status).toBe('succeeded');
    const { Meilisearch } = await import('meilisearch');
    expect(await new Meilisearch({ host: locked.server.url }).isHealthy()).toBe(true);
  });

  it('answers 401 without a key and 403 with a wrong one', async () => {
    const { Meilisearch } = await import('meilisearch');
    const anonymous = await apiError(new Meilisearch({ host: locked.server.url }).getRawIndexes());
    expect(anonymous.response.status).toBe(401);
    expect(anonymous.cause).toMatchObject({ code: 'missing_authorization_header', type: 'auth' });
    const wrong = await apiError(new Meilisearch({ host: locked.server.url, apiKey: 'guess' }).getRawIndexes());
    expect(wrong.response.status).toBe(403);
    expect(wrong.cause).toMatchObject({ code: 'invalid_api_key', type: 'auth' });
  });
});
