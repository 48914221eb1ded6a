/**
 * Full-text matching on minisearch, tuned the way the engine behaves: every term must
 * match (AND), only the last term matches as a prefix, and typos are allowed only on
 * longer terms (one from `oneTypo` letters, two from `twoTypos`). Matches are ordered by
 * the engine's ranking rules (./ranking.ts) and kept per query over the whole index; a
 * filter then keeps the candidates among them. `only` narrows the searched fields
 * (`attributesToSearchOn`).
 */
import type MiniSearch from 'minisearch';
import type { SearchResult } from 'minisearch';
import type { Bitset } from './bitset';
import type { QueryShape, Relevance } from './ranking';
import type { FakeIndex } from './store';
import type { IndexSettings } from './settings';

export interface TextMatch {
  /** Matched slots, best first; shared, so read only. */
  slots: number[];
  /** Relevance per slot; null when there was no query. */
  relevance: Map<number, Relevance> | null;
}

export type MatchingStrategy = 'last' | 'all' | 'frequency';

export function typoBudget(settings: IndexSettings): (term: string) => number {
  const { enabled, minWordSizeForTypos, disableOnWords, disableOnNumbers } = settings.typoTolerance;
  const oneTypo = minWordSizeForTypos?.oneTypo ?? 5;
  const twoTypos = minWordSizeForTypos?.twoTypos ?? 9;
  const exact = new Set((disableOnWords ?? []).map((word) => word.toLowerCase()));
  return (term) => {
    if (!enabled || exact.has(term) || (disableOnNumbers && /^\d+$/.test(term))) return 0;
    if (term.length >= twoTypos) return 2;
    return term.length >= oneTypo ? 1 : 0;
  };
}

/** Every document of `text` holding all of the query's words (the last one as a prefix too). */
export function runTextSearch<T>(
  text: MiniSearch<T>,
  shape: QueryShape,
  only?: (slot: number) => boolean,
): SearchResult[] {
  return text.search(shape.terms.join(' '), {
    fields: shape.fields,
    combineWith: 'AND',
    prefix: (_term: string, i: number, all: string[]) => i === all.length - 1,
    fuzzy: (term: string) => shape.typos(term),
    // Documents the filter excludes are never scored.
    boostDocument: only ? (slot: number) => (only(slot) ? 1 : 0) : undefined,
  });
}

/**
 * With the default `last` strategy, when no candidate holds every term the trailing
 * terms are dropped one at a time until something matches; `all` never drops terms.
 */
export function matchText(
  index: FakeIndex,
  terms: string[],
  candidates: Bitset | null,
  strategy: MatchingStrategy,
  only: string[] | null = null,
): TextMatch {
  const admits = candidates ? (slot: number) => candidates.has(slot) : null;
  for (let kept = terms.length; ; kept--) {
    const match = index.textMatch(terms.slice(0, kept), only, admits);
    if (match.order.length > 0 || strategy === 'all' || kept === 1)
      return { slots: match.order, relevance: match.relevance };
  }
}
