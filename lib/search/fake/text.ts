/**
 * Full-text matching on minisearch, tuned the way the engine behaves: every term must
 * match (AND), only the last term matches as a prefix, and typos are allowed only on
 * longer terms (one from `oneTypo` letters, two from `twoTypos`). Filter candidates are
 * applied inside scoring through `boostDocument`, so excluded documents are never scored.
 * `only` narrows the searched fields (`attributesToSearchOn`).
 */
import type { Bitset } from './bitset';
import type { FakeIndex } from './store';

export interface TextMatch {
  /** Matched slots, best first. */
  slots: number[];
  /** Relevance score per slot; null when there was no query. */
  scores: Map<number, number> | null;
}

export type MatchingStrategy = 'last' | 'all' | 'frequency';

function typoBudget(index: FakeIndex): (term: string) => number {
  const { enabled, minWordSizeForTypos, disableOnWords, disableOnNumbers } = index.settings.typoTolerance;
  const oneTypo = minWordSizeForTypos?.oneTypo ?? 5;
  const twoTypos = minWordSizeForTypos?.twoTypos ?? 9;
  const exact = new Set((disableOnWords ?? []).map((word) => word.toLowerCase()));
  return (term) => {
    if (!enabled || exact.has(term) || (disableOnNumbers && /^\d+$/.test(term))) return 0;
    if (term.length >= twoTypos) return 2;
    return term.length >= oneTypo ? 1 : 0;
  };
}

function searchAll(index: FakeIndex, terms: string[], candidates: Bitset | null, only: string[] | null): TextMatch {
  const { index: text, fields, boost } = index.textFor(only);
  const results = text.search(terms.join(' '), {
    fields,
    boost,
    combineWith: 'AND',
    prefix: (_term: string, i: number, all: string[]) => i === all.length - 1,
    fuzzy: typoBudget(index),
    boostDocument: candidates ? (slot: number) => (candidates.has(slot) ? 1 : 0) : undefined,
  });
  const scores = new Map<number, number>();
  const slots = results.map((result) => {
    scores.set(result.id as number, result.score);
    return result.id as number;
  });
  return { slots, scores };
}

/**
 * With the default `last` strategy, when no document holds every term the trailing
 * terms are dropped one at a time until something matches; `all` never drops terms.
 */
export function matchText(
  index: FakeIndex,
  terms: string[],
  candidates: Bitset | null,
  strategy: MatchingStrategy,
  only: string[] | null = null,
): TextMatch {
  let match = searchAll(index, terms, candidates, only);
  for (let kept = terms.length - 1; match.slots.length === 0 && strategy !== 'all' && kept > 0; kept--) {
    match = searchAll(index, terms.slice(0, kept), candidates, only);
  }
  return match;
}
