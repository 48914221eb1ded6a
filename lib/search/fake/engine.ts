/** The fake's state and operations, independent of HTTP: indexes, documents, settings, tasks. */
import { badRequest, FakeApiError, indexNotFound } from './errors';
import { evaluateFilter, parseFilterOrFail } from './evaluate';
import { selectPaths } from './paths';
import { buildComparator, parseSort, runSearch, topK, validateSearchRequest, withVectors } from './search';
import { settingNameFromRoute, validateSettingsPatch, defaultSettings, type IndexSettings } from './settings';
import { documentKey, FakeIndex, inferPrimaryKey, type Document } from './store';
import { TaskQueue, type EnqueuedTaskView } from './tasks';

const INDEX_UID = /^[a-zA-Z0-9_-]{1,400}$/;
/** A write of more documents than this starts the kept query matches afresh rather than updating them. */
const BATCH_FORGETS_KEPT_MATCHES = 100;

export interface IndexView {
  uid: string;
  primaryKey: string | null;
  createdAt: string;
  updatedAt: string;
}

function indexView(index: FakeIndex): IndexView {
  return {
    uid: index.uid,
    primaryKey: index.primaryKey,
    createdAt: index.createdAt.toISOString(),
    updatedAt: index.updatedAt.toISOString(),
  };
}

function checkIndexUid(uid: unknown): string {
  if (typeof uid !== 'string' || !INDEX_UID.test(uid)) {
    throw badRequest(
      'invalid_index_uid',
      `\`${String(uid)}\` is not a valid index uid. Index uid can be an integer or a string containing only alphanumeric characters, hyphens (-) and underscores (_), and can not be more than 400 bytes.`,
    );
  }
  return uid;
}

function asDocuments(body: unknown): Document[] {
  const list = Array.isArray(body) ? body : [body];
  if (!list.every((doc) => typeof doc === 'object' && doc !== null && !Array.isArray(doc))) {
    throw badRequest('malformed_payload', 'The documents payload must be a JSON object or an array of JSON objects.');
  }
  return list as Document[];
}

function pagingParam(params: URLSearchParams, name: string, fallback: number): number {
  const raw = params.get(name);
  const value = raw === null ? fallback : Number(raw);
  if (!Number.isInteger(value) || value < 0)
    throw badRequest(
      `invalid_document_${name}`,
      `Invalid value in parameter \`${name}\`: expected a positive integer.`,
    );
  return value;
}

/** What a document listing asks for, from `GET /documents` parameters or a `POST /documents/fetch` body. */
interface DocumentsQuery {
  offset: number;
  limit: number;
  fields: string[] | null;
  filter: unknown;
  ids: string[] | null;
  sort: string[] | undefined;
  retrieveVectors: boolean;
}

const DOCUMENTS_QUERY_FIELDS = ['offset', 'limit', 'fields', 'filter', 'ids', 'sort', 'retrieveVectors'];

function unknownField(key: string, expected: string[], where: 'parameter' | 'field'): FakeApiError {
  return badRequest(
    'bad_request',
    `Unknown ${where} \`${key}\`: expected one of ${expected.map((name) => `\`${name}\``).join(', ')}`,
  );
}

function documentIds(raw: unknown): string[] {
  if (!Array.isArray(raw)) throw badRequest('invalid_document_ids', 'Invalid value type at `.ids`: expected an array.');
  return raw.map((id, i) => {
    const key = documentKey(id);
    if (key === null) {
      throw badRequest(
        'invalid_document_ids',
        `In \`.ids[${i}]\`: Document identifier \`${JSON.stringify(id)}\` is invalid. A document identifier can be of type integer or string, only composed of alphanumeric characters (a-z A-Z 0-9), hyphens (-) and underscores (_), and can not be more than 511 bytes.`,
      );
    }
    return key;
  });
}

function stringListOrFail(raw: unknown, name: string): string[] {
  if (!Array.isArray(raw) || !raw.every((item) => typeof item === 'string')) {
    throw badRequest(`invalid_document_${name}`, `Invalid value type at \`.${name}\`: expected an array of strings.`);
  }
  return raw;
}

function naturalOrFail(raw: unknown, name: string): number {
  if (typeof raw !== 'number' || !Number.isInteger(raw) || raw < 0) {
    throw badRequest(`invalid_document_${name}`, `Invalid value type at \`.${name}\`: expected a positive integer.`);
  }
  return raw;
}

function documentsQueryFromParams(params: URLSearchParams): DocumentsQuery {
  for (const key of params.keys()) {
    if (!DOCUMENTS_QUERY_FIELDS.includes(key)) throw unknownField(key, DOCUMENTS_QUERY_FIELDS, 'parameter');
  }
  const list = (name: string) => {
    const raw = params.get(name);
    return raw === null ? null : raw.split(',').map((item) => item.trim());
  };
  const vectors = params.get('retrieveVectors');
  if (vectors !== null && vectors !== 'true' && vectors !== 'false') {
    throw badRequest(
      'invalid_document_retrieve_vectors',
      `Invalid value in parameter \`retrieveVectors\`: could not parse \`${vectors}\` as a boolean, expected either \`true\` or \`false\``,
    );
  }
  const ids = list('ids');
  return {
    offset: pagingParam(params, 'offset', 0),
    limit: pagingParam(params, 'limit', 20),
    fields: list('fields'),
    filter: params.get('filter') ?? undefined,
    ids: ids === null ? null : documentIds(ids),
    sort: list('sort')?.filter(Boolean),
    retrieveVectors: vectors === 'true',
  };
}

function documentsQueryFromBody(body: unknown): DocumentsQuery {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    throw badRequest('bad_request', 'Invalid value type: expected an object');
  }
  const record = body as Record<string, unknown>;
  for (const key of Object.keys(record)) {
    if (!DOCUMENTS_QUERY_FIELDS.includes(key)) throw unknownField(key, DOCUMENTS_QUERY_FIELDS, 'field');
  }
  const { offset, limit, fields, filter, ids, sort, retrieveVectors } = record;
  if (retrieveVectors !== undefined && typeof retrieveVectors !== 'boolean') {
    throw badRequest(
      'invalid_document_retrieve_vectors',
      'Invalid value type at `.retrieveVectors`: expected a boolean.',
    );
  }
  return {
    offset: offset === undefined ? 0 : naturalOrFail(offset, 'offset'),
    limit: limit === undefined ? 20 : naturalOrFail(limit, 'limit'),
    fields: fields === undefined || fields === null ? null : stringListOrFail(fields, 'fields'),
    filter,
    ids: ids === undefined || ids === null ? null : documentIds(ids),
    sort: sort === undefined || sort === null ? undefined : stringListOrFail(sort, 'sort'),
    retrieveVectors: retrieveVectors === true,
  };
}

export class FakeEngine {
  private readonly indexes = new Map<string, FakeIndex>();
  readonly tasks = new TaskQueue();

  // Indexes

  getIndex(uid: string): FakeIndex {
    const index = this.indexes.get(uid);
    if (!index) throw indexNotFound(uid);
    return index;
  }

  describeIndex(uid: string): IndexView {
    return indexView(this.getIndex(uid));
  }

  listIndexes(params: URLSearchParams): Record<string, unknown> {
    const offset = pagingParam(params, 'offset', 0);
    const limit = pagingParam(params, 'limit', 20);
    const all = [...this.indexes.values()].sort((a, b) => (a.uid < b.uid ? -1 : 1));
    return { results: all.slice(offset, offset + limit).map(indexView), offset, limit, total: all.length };
  }

  createIndex(body: unknown): EnqueuedTaskView {
    const { uid, primaryKey } = (body ?? {}) as { uid?: unknown; primaryKey?: unknown };
    const checked = checkIndexUid(uid);
    const key = typeof primaryKey === 'string' ? primaryKey : null;
    return this.tasks.enqueue(checked, 'indexCreation', { primaryKey: key }, () => {
      if (this.indexes.has(checked))
        throw new FakeApiError(409, 'index_already_exists', `Index \`${checked}\` already exists.`);
      this.indexes.set(checked, new FakeIndex(checked, key));
      return {};
    });
  }

  /** `PATCH /indexes/{uid}`: sets the primary key of an index without documents, renames it with a new `uid`. */
  updateIndex(uid: string, body: unknown): EnqueuedTaskView {
    if (typeof body !== 'object' || body === null || Array.isArray(body)) {
      throw badRequest('bad_request', 'Invalid value type: expected an object');
    }
    const record = body as Record<string, unknown>;
    for (const key of Object.keys(record)) {
      if (key !== 'primaryKey' && key !== 'uid') throw unknownField(key, ['primaryKey', 'uid'], 'field');
    }
    const { primaryKey } = record;
    if (primaryKey !== undefined && primaryKey !== null && typeof primaryKey !== 'string') {
      throw badRequest('invalid_index_primary_key', 'Invalid value type at `.primaryKey`: expected a string.');
    }
    const newUid = record.uid === undefined || record.uid === null ? null : checkIndexUid(record.uid);
    const details: Record<string, unknown> = { primaryKey: primaryKey ?? null };
    if (newUid !== null) Object.assign(details, { oldIndexUid: uid, newIndexUid: newUid });
    return this.tasks.enqueue(uid, 'indexUpdate', details, () => {
      const index = this.getIndex(uid);
      if (newUid !== null && newUid !== uid && this.indexes.has(newUid)) {
        throw new FakeApiError(409, 'index_already_exists', `Index \`${newUid}\` already exists.`);
      }
      if (typeof primaryKey === 'string' && primaryKey !== index.primaryKey) {
        if (index.documentCount > 0) {
          throw badRequest(
            'index_primary_key_already_exists',
            `Index \`${uid}\` already has a primary key: \`${index.primaryKey}\`.`,
          );
        }
        index.primaryKey = primaryKey;
      }
      if (newUid !== null && newUid !== uid) {
        this.indexes.delete(uid);
        index.rename(newUid);
        this.indexes.set(newUid, index);
      }
      return {};
    });
  }

  deleteIndex(uid: string): EnqueuedTaskView {
    return this.tasks.enqueue(uid, 'indexDeletion', { deletedDocuments: 0 }, () => {
      const index = this.getIndex(uid);
      this.indexes.delete(uid);
      return { deletedDocuments: index.documentCount };
    });
  }

  private getOrCreateIndex(uid: string): FakeIndex {
    let index = this.indexes.get(uid);
    if (!index) {
      index = new FakeIndex(uid, null);
      this.indexes.set(uid, index);
    }
    return index;
  }

  // Documents

  /** POST replaces whole documents; PUT merges the given fields into existing ones. */
  writeDocuments(uid: string, body: unknown, params: URLSearchParams, mode: 'replace' | 'merge'): EnqueuedTaskView {
    checkIndexUid(uid);
    const docs = asDocuments(body);
    const requestedKey = params.get('primaryKey');
    const details = { receivedDocuments: docs.length, indexedDocuments: null as number | null };
    return this.tasks.enqueue(uid, 'documentAdditionOrUpdate', details, () => {
      const index = this.getOrCreateIndex(uid);
      const primaryKey = this.resolvePrimaryKey(index, requestedKey, docs);
      const keyed = docs.map((doc) => [this.keyOf(doc, primaryKey), doc] as const);
      if (keyed.length > BATCH_FORGETS_KEPT_MATCHES) index.forgetKeptMatches();
      for (const [key, doc] of keyed) {
        const existing = mode === 'merge' ? index.document(index.slotOf(key) ?? -1) : undefined;
        index.put(key, existing ? { ...existing, ...doc } : doc);
      }
      return { indexedDocuments: docs.length };
    });
  }

  private resolvePrimaryKey(index: FakeIndex, requested: string | null, docs: Document[]): string {
    if (requested && index.primaryKey && requested !== index.primaryKey) {
      throw badRequest(
        'index_primary_key_already_exists',
        `Index \`${index.uid}\` already has a primary key: \`${index.primaryKey}\`.`,
      );
    }
    if (!index.primaryKey && docs.length > 0) index.primaryKey = requested ?? inferPrimaryKey(docs[0]);
    return index.primaryKey ?? requested ?? '';
  }

  private keyOf(doc: Document, primaryKey: string): string {
    const raw = doc[primaryKey];
    if (raw === undefined) {
      throw badRequest(
        'missing_document_id',
        `Document doesn't have a \`${primaryKey}\` attribute: \`${JSON.stringify(doc).slice(0, 200)}\`.`,
      );
    }
    const key = documentKey(raw);
    if (key === null) {
      throw badRequest(
        'invalid_document_id',
        `Document identifier \`${JSON.stringify(raw)}\` is invalid. A document identifier can be of type integer or string, only composed of alphanumeric characters (a-z A-Z 0-9), hyphens (-) and underscores (_), and can not be more than 511 bytes.`,
      );
    }
    return key;
  }

  getDocument(uid: string, id: string, params: URLSearchParams): Document {
    const index = this.getIndex(uid);
    const doc = index.document(index.slotOf(id) ?? -1);
    if (!doc) throw new FakeApiError(404, 'document_not_found', `Document \`${id}\` not found.`);
    return withVectors(selectPaths(doc, params.get('fields')?.split(',') ?? null), false);
  }

  listDocuments(uid: string, params: URLSearchParams): Record<string, unknown> {
    const index = this.getIndex(uid);
    return this.queryDocuments(index, documentsQueryFromParams(params));
  }

  fetchDocuments(uid: string, body: unknown): Record<string, unknown> {
    const index = this.getIndex(uid);
    return this.queryDocuments(index, documentsQueryFromBody(body));
  }

  /** Documents in the order they were first added, narrowed by ids and filter, then sorted and paged. */
  private queryDocuments(index: FakeIndex, query: DocumentsQuery): Record<string, unknown> {
    const rules = parseSort(index, query.sort, 'invalid_document_sort');
    const selected = evaluateFilter(index, query.filter, 'invalid_document_filter');
    const wanted = query.ids === null ? null : new Set(query.ids.map((id) => index.slotOf(id)));
    const slots: number[] = [];
    (selected ?? index.liveSlots()).forEach((slot) => {
      if (!wanted || wanted.has(slot)) slots.push(slot);
    });
    const end = query.offset + query.limit;
    const ordered = rules.length === 0 ? slots.slice(0, end) : topK(slots, end, buildComparator(index, rules, null));
    return {
      results: ordered
        .slice(query.offset)
        .map((slot) => withVectors(selectPaths(index.document(slot) as Document, query.fields), query.retrieveVectors)),
      offset: query.offset,
      limit: query.limit,
      total: slots.length,
    };
  }

  deleteDocument(uid: string, id: string): EnqueuedTaskView {
    return this.deleteByIds(uid, [id]);
  }

  deleteDocumentBatch(uid: string, body: unknown): EnqueuedTaskView {
    if (!Array.isArray(body)) throw badRequest('malformed_payload', 'Expected an array of document ids.');
    return this.deleteByIds(
      uid,
      body.map((id) => String(id)),
    );
  }

  private deleteByIds(uid: string, ids: string[]): EnqueuedTaskView {
    return this.tasks.enqueue(uid, 'documentDeletion', { providedIds: ids.length, deletedDocuments: null }, () => {
      const index = this.getIndex(uid);
      return { deletedDocuments: ids.filter((id) => index.delete(id)).length };
    });
  }

  /** The filter's syntax is checked when the task is enqueued; whether its attributes are filterable, when it runs. */
  deleteDocumentsByFilter(uid: string, body: unknown): EnqueuedTaskView {
    if (typeof body !== 'object' || body === null || Array.isArray(body)) {
      throw badRequest('bad_request', 'Invalid value type: expected an object');
    }
    for (const key of Object.keys(body)) {
      if (key !== 'filter') throw unknownField(key, ['filter'], 'field');
    }
    const { filter } = body as { filter?: unknown };
    if (filter === undefined || filter === null) throw badRequest('missing_document_filter', 'Missing field `filter`.');
    if (parseFilterOrFail(filter, 'invalid_document_filter') === null) {
      throw badRequest('invalid_document_filter', 'Sending an empty filter is forbidden.');
    }
    return this.tasks.enqueue(
      uid,
      'documentDeletion',
      { providedIds: 0, originalFilter: JSON.stringify(filter), deletedDocuments: null },
      () => {
        const index = this.getIndex(uid);
        const keys: string[] = [];
        evaluateFilter(index, filter, 'invalid_document_filter')?.forEach((slot) => {
          const doc = index.document(slot);
          if (doc && index.primaryKey) keys.push(String(doc[index.primaryKey]));
        });
        return { deletedDocuments: keys.filter((key) => index.delete(key)).length };
      },
    );
  }

  deleteAllDocuments(uid: string): EnqueuedTaskView {
    return this.tasks.enqueue(uid, 'documentDeletion', { deletedDocuments: null }, () => ({
      deletedDocuments: this.getIndex(uid).clear(),
    }));
  }

  // Settings

  getSettings(uid: string): IndexSettings {
    return this.getIndex(uid).settings;
  }

  getSetting(uid: string, route: string): unknown {
    const name = this.settingName(route);
    return this.getIndex(uid).settings[name];
  }

  updateSettings(uid: string, body: unknown): EnqueuedTaskView {
    checkIndexUid(uid);
    const patch = validateSettingsPatch(body);
    return this.tasks.enqueue(uid, 'settingsUpdate', { ...patch }, () => {
      this.getOrCreateIndex(uid).updateSettings(patch);
      return {};
    });
  }

  updateSetting(uid: string, route: string, body: unknown): EnqueuedTaskView {
    return this.updateSettings(uid, { [this.settingName(route)]: body });
  }

  resetSettings(uid: string): EnqueuedTaskView {
    return this.tasks.enqueue(uid, 'settingsUpdate', {}, () => {
      this.getIndex(uid).updateSettings(defaultSettings());
      return {};
    });
  }

  resetSetting(uid: string, route: string): EnqueuedTaskView {
    return this.updateSettings(uid, { [this.settingName(route)]: null });
  }

  private settingName(route: string): keyof IndexSettings {
    const name = settingNameFromRoute(route);
    if (!name) throw new FakeApiError(404, 'not_found', 'The requested route does not exist.');
    return name;
  }

  // Search and stats

  search(uid: string, body: unknown): Record<string, unknown> {
    return runSearch(this.getIndex(uid), validateSearchRequest(body));
  }

  indexStats(uid: string): Record<string, unknown> {
    const index = this.getIndex(uid);
    return {
      numberOfDocuments: index.documentCount,
      isIndexing: this.tasks.isBusy(uid),
      fieldDistribution: index.fieldDistribution(),
      numberOfEmbeddedDocuments: 0,
      numberOfEmbeddings: 0,
      rawDocumentDbSize: 0,
      avgDocumentSize: 0,
      indexSize: 0,
      usedIndexSize: 0,
    };
  }

  stats(): Record<string, unknown> {
    const indexes = Object.fromEntries([...this.indexes.keys()].map((uid) => [uid, this.indexStats(uid)]));
    return { databaseSize: 0, usedDatabaseSize: 0, lastUpdate: null, indexes };
  }
}
