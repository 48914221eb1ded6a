/**
 * Relevance as the engine's ranking rules give it, per document: each matched document is placed by
 * how many typos its matches needed (`typo`), in which searchable attribute its words were found,
 * earlier ones first (`attribute`), and how many query words it holds exactly rather than as a prefix
 * or with a typo (`exactness`), in the order the index's `rankingRules` name them. `words` is the same
 * for every document of one query (all its words must match), and `proximity` is not modelled.
 * Custom `attribute:asc|desc` ranking rules are not modelled either.
 *
 * A document's place depends on nothing but the document and the query, never on the rest of the
 * index, so a query's matches can be kept and brought up to date one written document at a time
 * (`MatchCache`), exactly as a fresh search would order them.
 */
import { distance } from 'fastest-levenshtein';
import type { SearchResult } from 'minisearch';

/** A document's relevance: rules ranked before `sort`, and those after it; higher is better. */
export interface Relevance {
  beforeSort: number;
  afterSort: number;
}

const BUCKET_RULES = new Set(['typo', 'attribute', 'exactness']);
/** Each bucket is a whole number below this, so buckets fold into one number without overlap. */
const BUCKET_RANGE = 1_000;

export interface QueryShape {
  /** Query words, already processed like the index's terms. */
  terms: string[];
  /** Searched fields, in attribute order. */
  fields: string[];
  /** Typos each query word may have. */
  typos: (term: string) => number;
  rankingRules: string[];
}

/** The earliest of `fields` in the searched order, or the number of searched fields when none is searched. */
function firstField(fields: string[], order: string[]): number {
  let first = order.length;
  for (const name of fields) {
    const at = order.indexOf(name);
    if (at >= 0 && at < first) first = at;
  }
  return first;
}

/** The typo, attribute and exactness buckets of one matched document (lower is better for all three). */
function buckets(result: SearchResult, shape: QueryShape): Record<'typo' | 'attribute' | 'exactness', number> {
  const match = result.match;
  let typo = 0;
  let attribute = 0;
  let inexact = 0;
  const last = shape.terms.length - 1;
  shape.terms.forEach((term, i) => {
    // The word itself: no typo and exact, so only the attribute is left to compare.
    const own = Object.hasOwn(match, term) ? match[term] : undefined;
    if (own) {
      attribute += firstField(own, shape.fields);
      return;
    }
    let best = { typos: Infinity, field: Infinity };
    for (const word in match) {
      let typos = 0;
      if (!(i === last && word.startsWith(term))) {
        typos = distance(term, word);
        if (typos > shape.typos(term)) continue;
      }
      const field = firstField(match[word], shape.fields);
      if (typos < best.typos || (typos === best.typos && field < best.field)) best = { typos, field };
    }
    typo += Number.isFinite(best.typos) ? best.typos : shape.typos(term);
    attribute += Number.isFinite(best.field) ? best.field : shape.fields.length;
    inexact += 1;
  });
  const cap = (n: number) => Math.min(n, BUCKET_RANGE - 1);
  return { typo: cap(typo), attribute: cap(attribute), exactness: cap(inexact) };
}

/** Folds the buckets in the ranking rules' order into the two numbers the comparator reads. */
export function relevanceOf(result: SearchResult, shape: QueryShape): Relevance {
  const values = buckets(result, shape);
  let beforeSort = 0;
  let afterSort = 0;
  let seenSort = false;
  for (const rule of shape.rankingRules) {
    if (rule === 'sort') seenSort = true;
    else if (BUCKET_RULES.has(rule)) {
      const value = values[rule as keyof typeof values];
      if (seenSort) afterSort = afterSort * BUCKET_RANGE + (BUCKET_RANGE - 1 - value);
      else beforeSort = beforeSort * BUCKET_RANGE + (BUCKET_RANGE - 1 - value);
    }
  }
  return { beforeSort, afterSort };
}

/** Best first: higher relevance before the sort rules, then after them, then the earlier slot. */
export function compareRelevance(a: Relevance, b: Relevance, slotA: number, slotB: number): number {
  return b.beforeSort - a.beforeSort || b.afterSort - a.afterSort || slotA - slotB;
}

/** One kept query: every matching slot (no filter applied), best first, and each one's relevance. */
export interface KeptMatch {
  order: number[];
  relevance: Map<number, Relevance>;
}

/**
 * Runs a query on a text index (the whole index's, or one holding a single document); with
 * `only`, documents outside it are never scored.
 */
export type TextSearch<I> = (index: I, shape: QueryShape, only?: (slot: number) => boolean) => SearchResult[];

/** A query's matches among the documents `only` admits (all when absent), best first. */
function matchesOf<I>(search: TextSearch<I>, index: I, shape: QueryShape, only?: (slot: number) => boolean): KeptMatch {
  const relevance = new Map<number, Relevance>();
  const ranked = search(index, shape, only).map((result) => {
    const place = relevanceOf(result, shape);
    relevance.set(result.id as number, place);
    return { slot: result.id as number, place };
  });
  ranked.sort((a, b) => compareRelevance(a.place, b.place, a.slot, b.slot));
  return { order: ranked.map((entry) => entry.slot), relevance };
}

/** How many recently seen queries are remembered, so the second asking of one may keep its matches. */
const SEEN_QUERIES = 512;

/**
 * Matches of recent queries over the whole index, kept until the settings change. A query is
 * scored among the filter's candidates only the first time it is asked, as most queries are never
 * asked again; asked again after matching many, it is kept. Every written document is taken out of each kept query
 * and, if it matches, put back in its place, which is found by searching that one document alone:
 * its relevance needs nothing else.
 */
export class MatchCache<I> {
  private readonly kept = new Map<string, { shape: QueryShape; match: KeptMatch }>();
  /** Recently asked queries not kept, with how many candidates they matched. */
  private readonly seen = new Map<string, number>();

  /**
   * `limit` queries at most, and no more than `slotBudget` matched documents in all (about 80 bytes
   * each), so an index of many documents keeps fewer queries; the least recently used go first. A
   * query is kept only when its first asking matched at least `keepFrom` candidates: then the filter
   * hardly narrowed it, and scoring it over the whole index costs about what each asking costs
   * anyway; a narrow one is cheaper to score among its candidates every time than to keep.
   */
  constructor(
    private readonly search: TextSearch<I>,
    private readonly limit: number,
    private readonly slotBudget: number,
    private readonly keepFrom: number,
  ) {}

  static keyOf(shape: QueryShape): string {
    return JSON.stringify([shape.terms, shape.fields]);
  }

  /**
   * A query's matches, best first, among the documents `candidates` admits (every document when
   * null): from the kept matches when the query is kept, else from `index`. The answer is shared:
   * read it, never change it.
   */
  get(shape: QueryShape, index: I, candidates: ((slot: number) => boolean) | null): KeptMatch {
    const key = MatchCache.keyOf(shape);
    const hit = this.kept.get(key);
    if (hit) {
      this.kept.delete(key);
      this.kept.set(key, hit);
      return filtered(hit.match, candidates);
    }
    const before = this.seen.get(key);
    if (before === undefined || before < this.keepFrom) {
      const direct = matchesOf(this.search, index, shape, candidates ?? undefined);
      this.seen.delete(key);
      this.seen.set(key, direct.order.length);
      if (this.seen.size > SEEN_QUERIES) this.seen.delete(this.seen.keys().next().value!);
      return direct;
    }
    this.seen.delete(key);
    const match = matchesOf(this.search, index, shape);
    this.kept.set(key, { shape, match });
    let slots = 0;
    for (const { match: each } of this.kept.values()) slots += each.order.length;
    while (this.kept.size > 1 && (this.kept.size > this.limit || slots > this.slotBudget)) {
      const [oldest, entry] = this.kept.entries().next().value!;
      slots -= entry.match.order.length;
      this.kept.delete(oldest);
    }
    return filtered(match, candidates);
  }

  /** Takes `slot` out of every kept query. */
  remove(slot: number): void {
    for (const { match } of this.kept.values()) {
      const place = match.relevance.get(slot);
      if (!place) continue;
      match.order.splice(this.position(match, place, slot), 1);
      match.relevance.delete(slot);
    }
  }

  /** Puts `slot` into every kept query it matches; `alone(fields)` is an index holding only its document. */
  add(slot: number, alone: (fields: string[]) => I): void {
    for (const { shape, match } of this.kept.values()) {
      const [result] = this.search(alone(shape.fields), shape);
      if (!result) continue;
      const place = relevanceOf(result, shape);
      match.order.splice(this.position(match, place, slot), 0, slot);
      match.relevance.set(slot, place);
    }
  }

  clear(): void {
    this.kept.clear();
    this.seen.clear();
  }

  /** Where `slot` with relevance `place` stands (or would stand) in the order: a binary search. */
  private position(match: KeptMatch, place: Relevance, slot: number): number {
    let lo = 0;
    let hi = match.order.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      const other = match.order[mid];
      if (compareRelevance(match.relevance.get(other)!, place, other, slot) < 0) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }
}

function filtered(match: KeptMatch, candidates: ((slot: number) => boolean) | null): KeptMatch {
  return candidates ? { order: match.order.filter(candidates), relevance: match.relevance } : match;
}
