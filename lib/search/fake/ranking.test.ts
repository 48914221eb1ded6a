import { describe, expect, it } from 'vitest';
import { runSearch } from './search';
import { FakeIndex, type Document } from './store';

const WORDS = ['amber', 'bitter', 'citra', 'copper', 'harvest', 'lager', 'porter', 'stout', 'golden', 'hazy'];
const SETTINGS = {
  searchableAttributes: ['title', 'hops', 'notes'],
  filterableAttributes: ['abv'],
  sortableAttributes: ['abv'],
  rankingRules: ['words', 'typo', 'proximity', 'attribute', 'sort', 'exactness'],
};
const QUERIES = [
  { q: 'amber' },
  { q: 'ambr' },
  { q: 'harvst lager' },
  { q: 'cop' },
  { q: 'golden hazy', sort: ['abv:desc'] },
  { q: 'porter', filter: 'abv > 5' },
  { q: 'bitter', attributesToSearchOn: ['notes'] },
];

/** A small seeded generator, so every run writes the same documents. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a * 1664525 + 1013904223) >>> 0;
    return a / 4294967296;
  };
}

function phrase(r: () => number, n: number): string {
  return Array.from({ length: n }, () => WORDS[Math.floor(r() * WORDS.length)]).join(' ');
}

function makeDoc(id: number, r: () => number): Document {
  return {
    id: `d${id}`,
    title: phrase(r, 2),
    hops: [phrase(r, 1)],
    notes: phrase(r, 4),
    abv: Math.round(r() * 80) / 10,
  };
}

function freshIndex(docs: Document[]): FakeIndex {
  const index = new FakeIndex('fresh', 'id');
  index.updateSettings(SETTINGS);
  for (const doc of docs) index.put(String(doc.id), doc);
  return index;
}

const idsOf = (index: FakeIndex, query: Record<string, unknown>) =>
  (runSearch(index, { ...query, limit: 1000 }).hits as Document[]).map((hit) => hit.id);

describe('kept query matches', () => {
  it('order documents through any run of writes exactly as a fresh index of the same documents does', () => {
    const r = seeded(7);
    // Every query is kept from its second asking, however few it matches.
    const index = new FakeIndex('kept', 'id', { keepMatchesFrom: 0 });
    index.updateSettings(SETTINGS);
    const docs = new Map<string, Document>();
    for (let i = 0; i < 60; i++) {
      const doc = makeDoc(i, r);
      docs.set(String(doc.id), doc);
      index.put(String(doc.id), doc);
    }
    for (let round = 0; round < 40; round++) {
      // Every query is kept before the writes, so the writes must bring each one up to date.
      for (const query of QUERIES) idsOf(index, query);
      const id = `d${Math.floor(r() * 70)}`;
      if (r() < 0.25 && docs.has(id)) {
        index.delete(id);
        docs.delete(id);
      } else {
        const doc = makeDoc(Number(id.slice(1)), r);
        docs.set(id, doc);
        index.put(id, doc);
      }
      // A fresh index holding the same documents in the same slot order must agree on every query.
      const inSlotOrder = [...docs.values()].sort((a, b) => index.slotOf(String(a.id))! - index.slotOf(String(b.id))!);
      const fresh = freshIndex(inSlotOrder);
      for (const query of QUERIES) expect(idsOf(index, query), JSON.stringify(query)).toEqual(idsOf(fresh, query));
    }
  });

  it('ranks fewer typos first, then matches in earlier attributes, then exact words over prefixes', () => {
    const index = freshIndex([
      { id: 'notes-exact', title: 'session', hops: [], notes: 'harvest' },
      { id: 'title-typo', title: 'harvast', hops: [], notes: '' },
      { id: 'title-exact', title: 'harvest', hops: [], notes: '' },
      { id: 'title-prefix', title: 'harvests', hops: [], notes: '' },
    ]);
    expect(idsOf(index, { q: 'harvest' })).toEqual(['title-exact', 'title-prefix', 'notes-exact', 'title-typo']);
  });
});
