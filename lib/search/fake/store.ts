/** One index of the fake: documents in slots, a minisearch text index, and facet lookups. */
import MiniSearch from 'minisearch';
import { Bitset } from './bitset';
import { badRequest } from './errors';
import { FacetIndex } from './facets';
import { covers, valueAtPath, valuesAtPath } from './paths';
import { MatchCache, type KeptMatch } from './ranking';
import { applySettingsPatch, defaultSettings, type IndexSettings } from './settings';
import { runTextSearch, typoBudget } from './text';

export type Document = Record<string, unknown>;

/** What a document sorts by for one attribute: a number or string, or undefined (sorts last). */
export type SortKey = number | string | undefined;

/** Numbers and strings sort as themselves, booleans as text; anything else (a list, an object, nothing) has no key. */
function sortKeyOf(value: unknown): SortKey {
  if (typeof value === 'number' || typeof value === 'string') return value;
  if (typeof value === 'boolean') return String(value);
  return undefined;
}

interface TextEntry {
  slot: number;
  doc: Document;
}

/** Catch-all text field used while searchableAttributes is `["*"]`. */
const ALL_FIELDS = '_all';

export interface TextFields {
  index: MiniSearch<TextEntry>;
  /** The searched fields, in attribute order (earlier ones rank first). */
  fields: string[];
}

/** How many queries' matches an index keeps (ranking.ts), how many matched documents in all, and from what size. */
const KEPT_QUERIES = 64;
const KEPT_MATCHED_SLOTS = 250_000;
const KEEP_FROM_MATCHES = 500;

export interface FakeIndexOptions {
  /** Keep a query's matches when it is asked again after matching this many candidates (500). */
  keepMatchesFrom?: number;
}

function createTextIndex(fields: string[]): MiniSearch<TextEntry> {
  return new MiniSearch<TextEntry>({
    idField: 'slot',
    fields,
    storeFields: [],
    extractField: (entry, field) => {
      if (field === 'slot') return entry.slot as unknown as string;
      return field === ALL_FIELDS ? textOf(entry.doc) : textOf(valuesAtPath(entry.doc, field));
    },
    processTerm,
  });
}

/** Lower case and strip diacritics, so "Mittelfrüh" and "mittelfruh" meet. */
export function processTerm(term: string): string {
  return term.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase();
}

function textOf(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (Array.isArray(value)) return value.map(textOf).join(' ');
  if (typeof value === 'object') return Object.values(value).map(textOf).join(' ');
  return String(value);
}

const DOCUMENT_ID = /^[a-zA-Z0-9_-]{1,511}$/;

/** The engine accepts integer or `[a-zA-Z0-9_-]` string ids and compares them as strings. */
export function documentKey(id: unknown): string | null {
  if (typeof id === 'number' && Number.isInteger(id) && id >= 0) return String(id);
  if (typeof id === 'string' && DOCUMENT_ID.test(id)) return id;
  return null;
}

export class FakeIndex {
  primaryKey: string | null;
  readonly createdAt = new Date();
  updatedAt = new Date();
  settings: IndexSettings = defaultSettings();
  private readonly slots: Array<Document | undefined> = [];
  private readonly slotByKey = new Map<string, number>();
  private facets = new Map<string, FacetIndex>();
  private text: MiniSearch<TextEntry>;
  private textFields: string[] = [ALL_FIELDS];
  private live: Bitset | null = null;
  /** Per sortable attribute asked for, each slot's sort key; kept up to date by writes. */
  private sortKeyLists = new Map<string, SortKey[]>();
  /** Recent queries' matches over the whole index, brought up to date by every write. */
  private readonly matches: MatchCache<MiniSearch<TextEntry>>;
  /** A text index over other fields than the settings' (for `attributesToSearchOn`), kept until a write. */
  private restricted: { key: string; text: TextFields } | null = null;

  constructor(
    public uid: string,
    primaryKey: string | null,
    options: FakeIndexOptions = {},
  ) {
    this.primaryKey = primaryKey;
    this.matches = new MatchCache(
      runTextSearch,
      KEPT_QUERIES,
      KEPT_MATCHED_SLOTS,
      options.keepMatchesFrom ?? KEEP_FROM_MATCHES,
    );
    this.text = this.createTextIndex();
  }

  /** Renames the index in place (the engine's PATCH with a new `uid`); documents and settings stay. */
  rename(uid: string): void {
    this.uid = uid;
    this.updatedAt = new Date();
  }

  get capacity(): number {
    return this.slots.length;
  }

  get documentCount(): number {
    return this.slotByKey.size;
  }

  /**
   * The text index to search and its weighted fields: the settings' own, or, for `attributesToSearchOn`,
   * the same fields narrowed to `only` (a separate index when they are not fields of the main one).
   */
  textFor(only: string[] | null): TextFields {
    if (!only) return { index: this.text, fields: this.textFields };
    if (only.every((field) => this.textFields.includes(field))) {
      const fields = this.textFields.filter((field) => only.includes(field));
      return { index: this.text, fields };
    }
    const key = JSON.stringify(only);
    if (this.restricted?.key !== key) {
      const index = createTextIndex(only);
      for (const slot of this.slotByKey.values()) index.add({ slot, doc: this.slots[slot] as Document });
      this.restricted = { key, text: { index, fields: only } };
    }
    return this.restricted.text;
  }

  document(slot: number): Document | undefined {
    return this.slots[slot];
  }

  slotOf(id: string): number | undefined {
    return this.slotByKey.get(id);
  }

  /** The lookup for a filterable attribute or nested path, built from the documents on first use. */
  facet(attribute: string): FacetIndex | undefined {
    let facet = this.facets.get(attribute);
    if (!facet && this.isFilterable(attribute)) {
      facet = new FacetIndex();
      for (const slot of this.slotByKey.values()) facet.add(slot, valueAtPath(this.slots[slot] as Document, attribute));
      this.facets.set(attribute, facet);
    }
    return facet;
  }

  /**
   * Drops the kept query matches: before a large batch of writes, which would otherwise bring each
   * kept query up to date one document at a time; the next queries start afresh.
   */
  forgetKeptMatches(): void {
    this.matches.clear();
  }

  /**
   * Every document matching `terms` in the fields searched (all of them, or `only`) that
   * `candidates` admits, best first; shared, so read only.
   */
  textMatch(terms: string[], only: string[] | null, candidates: ((slot: number) => boolean) | null): KeptMatch {
    const { index, fields } = this.textFor(only);
    const shape = { terms, fields, typos: typoBudget(this.settings), rankingRules: this.settings.rankingRules };
    return this.matches.get(shape, index, candidates);
  }

  /**
   * Each slot's sort key for `attribute`, read from the documents on first use and then kept by
   * every write, so sorting compares array entries instead of walking documents. Shared: callers
   * must not change it.
   */
  sortKeys(attribute: string): readonly SortKey[] {
    let keys = this.sortKeyLists.get(attribute);
    if (!keys) {
      keys = [];
      for (const slot of this.slotByKey.values())
        keys[slot] = sortKeyOf(valueAtPath(this.slots[slot] as Document, attribute));
      this.sortKeyLists.set(attribute, keys);
    }
    return keys;
  }

  /** Slots holding a document; shared between calls, so callers must not change it. */
  liveSlots(): Bitset {
    this.live ??= Bitset.fromIterable(this.capacity, this.slotByKey.values());
    return this.live;
  }

  allDocuments(): Document[] {
    return [...this.slotByKey.values()].map((slot) => this.slots[slot] as Document);
  }

  fieldDistribution(): Record<string, number> {
    const counts: Record<string, number> = {};
    for (const doc of this.allDocuments()) for (const key of Object.keys(doc)) counts[key] = (counts[key] ?? 0) + 1;
    return counts;
  }

  /** Stores a document under its primary key value, replacing any earlier one in the same slot. */
  put(key: string, doc: Document): void {
    const existing = this.slotByKey.get(key);
    if (existing !== undefined) this.unindex(existing);
    const slot = existing ?? this.slots.length;
    this.slots[slot] = doc;
    this.slotByKey.set(key, slot);
    this.live = null;
    this.index(slot, doc);
    this.updatedAt = new Date();
  }

  delete(key: string): boolean {
    const slot = this.slotByKey.get(key);
    if (slot === undefined) return false;
    this.unindex(slot);
    this.slots[slot] = undefined;
    this.slotByKey.delete(key);
    this.live = null;
    this.updatedAt = new Date();
    return true;
  }

  clear(): number {
    const removed = this.documentCount;
    this.slots.length = 0;
    this.slotByKey.clear();
    this.live = null;
    this.rebuild();
    return removed;
  }

  updateSettings(patch: Partial<IndexSettings>): void {
    this.settings = applySettingsPatch(this.settings, patch);
    this.rebuild();
    this.updatedAt = new Date();
  }

  /** Whether `attribute` (or a parent of it) may be used in filters and facets. */
  isFilterable(attribute: string): boolean {
    return covers(this.settings.filterableAttributes, attribute);
  }

  isSortable(attribute: string): boolean {
    return covers(this.settings.sortableAttributes, attribute);
  }

  isSearchable(attribute: string): boolean {
    return covers(this.settings.searchableAttributes, attribute);
  }

  private createTextIndex(): MiniSearch<TextEntry> {
    const searchable = this.settings.searchableAttributes;
    this.textFields = searchable.includes('*') ? [ALL_FIELDS] : [...searchable];
    return createTextIndex(this.textFields);
  }

  /** Declared filterable attributes get their lookups at once; nested paths and `*` fields on first use. */
  private index(slot: number, doc: Document): void {
    for (const attribute of this.settings.filterableAttributes) {
      if (attribute !== '*' && !this.facets.has(attribute)) this.facets.set(attribute, new FacetIndex());
    }
    for (const [attribute, facet] of this.facets) facet.add(slot, valueAtPath(doc, attribute));
    for (const [attribute, keys] of this.sortKeyLists) keys[slot] = sortKeyOf(valueAtPath(doc, attribute));
    this.text.add({ slot, doc });
    this.restricted = null;
    const alone = new Map<string, MiniSearch<TextEntry>>();
    this.matches.add(slot, (fields) => {
      const key = JSON.stringify(fields);
      let one = alone.get(key);
      if (!one) {
        one = createTextIndex(fields);
        one.add({ slot, doc });
        alone.set(key, one);
      }
      return one;
    });
  }

  private unindex(slot: number): void {
    if (!this.slots[slot]) return;
    for (const facet of this.facets.values()) facet.remove(slot);
    for (const keys of this.sortKeyLists.values()) keys[slot] = undefined;
    this.text.discard(slot);
    this.matches.remove(slot);
    this.restricted = null;
  }

  private rebuild(): void {
    this.facets = new Map();
    this.sortKeyLists = new Map();
    this.matches.clear();
    this.restricted = null;
    this.text = this.createTextIndex();
    for (const slot of this.slotByKey.values()) this.index(slot, this.slots[slot] as Document);
  }
}

/** Picks the primary key the way the engine infers it: the one attribute whose name ends in "id". */
export function inferPrimaryKey(doc: Document): string {
  const candidates = Object.keys(doc).filter((key) => key.toLowerCase().endsWith('id'));
  if (candidates.length === 1) return candidates[0];
  if (candidates.length === 0) {
    throw badRequest(
      'index_primary_key_no_candidate_found',
      'The primary key inference failed as the engine did not find any field ending with `id` in its name. Please specify the primary key manually using the `primaryKey` query parameter.',
    );
  }
  throw badRequest(
    'index_primary_key_multiple_candidates_found',
    `The primary key inference failed as the engine found ${candidates.length} fields ending with \`id\` in their names: '${candidates.join("' and '")}'. Please specify the primary key manually using the \`primaryKey\` query parameter.`,
  );
}
