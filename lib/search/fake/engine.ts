/** The fake's state and operations, independent of HTTP: indexes, documents, settings, tasks. */
import { badRequest, FakeApiError, indexNotFound } from './errors';
import { evaluateFilter } from './evaluate';
import { runSearch, validateSearchRequest } from './search';
import { settingNameFromRoute, validateSettingsPatch, defaultSettings, type IndexSettings } from './settings';
import { documentKey, FakeIndex, inferPrimaryKey, type Document } from './store';
import { TaskQueue, type EnqueuedTaskView } from './tasks';

const INDEX_UID = /^[a-zA-Z0-9_-]{1,400}$/;

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

function pickFields(doc: Document, fields: string[] | null): Document {
  if (!fields || fields.includes('*')) return doc;
  return Object.fromEntries(Object.entries(doc).filter(([key]) => fields.includes(key)));
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

  updateIndex(uid: string, body: unknown): EnqueuedTaskView {
    const { primaryKey } = (body ?? {}) as { primaryKey?: unknown };
    return this.tasks.enqueue(uid, 'indexUpdate', { primaryKey: primaryKey ?? null }, () => {
      const index = this.getIndex(uid);
      if (typeof primaryKey === 'string' && primaryKey !== index.primaryKey) {
        if (index.documentCount > 0) {
          throw badRequest(
            'index_primary_key_already_exists',
            `Index \`${uid}\` already has a primary key: \`${index.primaryKey}\`.`,
          );
        }
        index.primaryKey = primaryKey;
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
    return pickFields(doc, params.get('fields')?.split(',') ?? null);
  }

  listDocuments(uid: string, params: URLSearchParams): Record<string, unknown> {
    const index = this.getIndex(uid);
    const offset = pagingParam(params, 'offset', 0);
    const limit = pagingParam(params, 'limit', 20);
    const fields = params.get('fields')?.split(',') ?? null;
    const all = index.allDocuments();
    return {
      results: all.slice(offset, offset + limit).map((doc) => pickFields(doc, fields)),
      offset,
      limit,
      total: all.length,
    };
  }

  fetchDocuments(uid: string, body: unknown): Record<string, unknown> {
    const index = this.getIndex(uid);
    const {
      filter,
      offset = 0,
      limit = 20,
      fields = null,
    } = (body ?? {}) as { filter?: unknown; offset?: number; limit?: number; fields?: string[] | null };
    const selected = evaluateFilter(index, filter);
    const docs: Document[] = [];
    (selected ?? index.liveSlots()).forEach((slot) => docs.push(index.document(slot) as Document));
    return {
      results: docs.slice(offset, offset + limit).map((doc) => pickFields(doc, fields)),
      offset,
      limit,
      total: docs.length,
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

  deleteDocumentsByFilter(uid: string, body: unknown): EnqueuedTaskView {
    const { filter } = (body ?? {}) as { filter?: unknown };
    if (filter === undefined) throw badRequest('missing_document_filter', 'Missing field `filter`.');
    return this.tasks.enqueue(
      uid,
      'documentDeletion',
      { originalFilter: JSON.stringify(filter), deletedDocuments: null },
      () => {
        const index = this.getIndex(uid);
        const keys: string[] = [];
        evaluateFilter(index, filter)?.forEach((slot) => {
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
