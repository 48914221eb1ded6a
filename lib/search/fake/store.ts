/** One index of the fake: documents in slots, a minisearch text index, and facet lookups. */
import MiniSearch from 'minisearch';
import { Bitset } from './bitset';
import { badRequest } from './errors';
import { FacetIndex } from './facets';
import { applySettingsPatch, defaultSettings, type IndexSettings } from './settings';

export type Document = Record<string, unknown>;

interface TextEntry {
  slot: number;
  doc: Document;
}

/** Catch-all text field used while searchableAttributes is `["*"]`. */
const ALL_FIELDS = '_all';

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

  constructor(
    readonly uid: string,
    primaryKey: string | null,
  ) {
    this.primaryKey = primaryKey;
    this.text = this.createTextIndex();
  }

  get capacity(): number {
    return this.slots.length;
  }

  get documentCount(): number {
    return this.slotByKey.size;
  }

  /** The fields minisearch indexes and their weights, from searchableAttributes (earlier = stronger). */
  get searchFields(): { fields: string[]; boost: Record<string, number> } {
    const boost: Record<string, number> = {};
    this.textFields.forEach((field, i) => {
      boost[field] = 1 + (this.textFields.length - i) / this.textFields.length;
    });
    return { fields: this.textFields, boost };
  }

  get textIndex(): MiniSearch<TextEntry> {
    return this.text;
  }

  document(slot: number): Document | undefined {
    return this.slots[slot];
  }

  slotOf(id: string): number | undefined {
    return this.slotByKey.get(id);
  }

  facet(attribute: string): FacetIndex | undefined {
    return this.facets.get(attribute);
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

  /** Whether `attribute` may be used in filters and facets. */
  isFilterable(attribute: string): boolean {
    return this.settings.filterableAttributes.includes(attribute) || this.settings.filterableAttributes.includes('*');
  }

  isSortable(attribute: string): boolean {
    return this.settings.sortableAttributes.includes(attribute) || this.settings.sortableAttributes.includes('*');
  }

  /** Filter lookups exist for filterable attributes; sortable ones read values from the document. */
  private facetAttributes(doc: Document): string[] {
    if (this.settings.filterableAttributes.includes('*')) return Object.keys(doc);
    return this.settings.filterableAttributes;
  }

  private createTextIndex(): MiniSearch<TextEntry> {
    const searchable = this.settings.searchableAttributes;
    this.textFields = searchable.includes('*') ? [ALL_FIELDS] : [...searchable];
    return new MiniSearch<TextEntry>({
      idField: 'slot',
      fields: this.textFields,
      storeFields: [],
      extractField: (entry, field) => {
        if (field === 'slot') return entry.slot as unknown as string;
        return field === ALL_FIELDS ? textOf(entry.doc) : textOf(entry.doc[field]);
      },
      processTerm,
    });
  }

  private index(slot: number, doc: Document): void {
    for (const attribute of this.facetAttributes(doc)) {
      let facet = this.facets.get(attribute);
      if (!facet) {
        facet = new FacetIndex();
        this.facets.set(attribute, facet);
      }
      facet.add(slot, doc[attribute]);
    }
    this.text.add({ slot, doc });
  }

  private unindex(slot: number): void {
    const doc = this.slots[slot];
    if (!doc) return;
    for (const attribute of this.facetAttributes(doc)) this.facets.get(attribute)?.remove(slot);
    this.text.discard(slot);
  }

  private rebuild(): void {
    this.facets = new Map();
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
