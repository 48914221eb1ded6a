/** Runs one search request against a FakeIndex and shapes the engine's response. */
import type { Bitset } from './bitset';
import { badRequest } from './errors';
import { evaluateFilter } from './evaluate';
import { selectPaths } from './paths';
import { processTerm, type Document, type FakeIndex, type SortKey } from './store';
import type { Relevance } from './ranking';
import { matchText, type TextMatch } from './text';

export interface SearchRequest {
  q?: string | null;
  offset?: number;
  limit?: number;
  page?: number;
  hitsPerPage?: number;
  filter?: unknown;
  facets?: string[];
  sort?: string[];
  attributesToRetrieve?: string[];
  attributesToSearchOn?: string[];
  matchingStrategy?: 'last' | 'all' | 'frequency';
  retrieveVectors?: boolean;
}

/** Parameters the fake accepts and ignores (highlighting, cropping, ranking details and the like). */
const IGNORED_PARAMETERS = new Set([
  'attributesToHighlight',
  'highlightPreTag',
  'highlightPostTag',
  'attributesToCrop',
  'cropLength',
  'cropMarker',
  'showMatchesPosition',
  'showRankingScore',
  'showRankingScoreDetails',
  'rankingScoreThreshold',
  'locales',
  'showPerformanceDetails',
]);

const KNOWN_PARAMETERS = new Set([
  'q',
  'offset',
  'limit',
  'page',
  'hitsPerPage',
  'filter',
  'facets',
  'sort',
  'attributesToRetrieve',
  'attributesToSearchOn',
  'matchingStrategy',
  'retrieveVectors',
  ...IGNORED_PARAMETERS,
]);

function snake(name: string): string {
  return name.replace(/[A-Z]/g, (ch) => `_${ch.toLowerCase()}`);
}

function requireNaturalNumber(body: Record<string, unknown>, key: string, min = 0): number | undefined {
  const value = body[key];
  if (value === undefined || value === null) return undefined;
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min) {
    throw badRequest(
      `invalid_search_${snake(key)}`,
      `Invalid value at \`.${key}\`: expected a positive integer${min > 0 ? ` from ${min}` : ''}, but found \`${JSON.stringify(value)}\`.`,
    );
  }
  return value;
}

function requireStringList(body: Record<string, unknown>, key: string): string[] | undefined {
  const value = body[key];
  if (value === undefined || value === null) return undefined;
  if (!Array.isArray(value) || !value.every((item) => typeof item === 'string')) {
    throw badRequest(
      `invalid_search_${snake(key)}`,
      `Invalid value type at \`.${key}\`: expected an array of strings.`,
    );
  }
  return value;
}

/** Validates a POST body (or a GET query already converted to one) into a SearchRequest. */
export function validateSearchRequest(body: unknown): SearchRequest {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    throw badRequest('bad_request', 'Invalid value type: expected an object');
  }
  const record = body as Record<string, unknown>;
  for (const key of Object.keys(record)) {
    if (!KNOWN_PARAMETERS.has(key)) throw badRequest('bad_request', `Unknown field \`${key}\` in the search request.`);
  }
  const { q, matchingStrategy, retrieveVectors } = record;
  if (retrieveVectors !== undefined && typeof retrieveVectors !== 'boolean') {
    throw badRequest(
      'invalid_search_retrieve_vectors',
      'Invalid value type at `.retrieveVectors`: expected a boolean.',
    );
  }
  if (q !== undefined && q !== null && typeof q !== 'string') {
    throw badRequest('invalid_search_q', 'Invalid value type at `.q`: expected a string.');
  }
  if (matchingStrategy !== undefined && !['last', 'all', 'frequency'].includes(matchingStrategy as string)) {
    throw badRequest(
      'invalid_search_matching_strategy',
      'Unknown value at `.matchingStrategy`: expected one of `last`, `all`, `frequency`.',
    );
  }
  return {
    q: q as string | null | undefined,
    offset: requireNaturalNumber(record, 'offset'),
    limit: requireNaturalNumber(record, 'limit'),
    page: requireNaturalNumber(record, 'page'),
    hitsPerPage: requireNaturalNumber(record, 'hitsPerPage'),
    filter: record.filter,
    facets: requireStringList(record, 'facets'),
    sort: requireStringList(record, 'sort'),
    attributesToRetrieve: requireStringList(record, 'attributesToRetrieve'),
    attributesToSearchOn: requireStringList(record, 'attributesToSearchOn'),
    matchingStrategy: matchingStrategy as SearchRequest['matchingStrategy'],
    retrieveVectors: retrieveVectors as boolean | undefined,
  };
}

export interface SortRule {
  attribute: string;
  direction: 1 | -1;
}

function notSortableMessage(index: FakeIndex, attribute: string): string {
  const available = index.settings.sortableAttributes;
  return available.length === 0
    ? `Attribute \`${attribute}\` is not sortable. This index does not have configured sortable attributes.`
    : `Attribute \`${attribute}\` is not sortable. Available sortable attributes are: \`${[...available].sort().join(', ')}\`.`;
}

/** Parses `attribute:asc|desc` rules; `code` is the route's error code (search or documents). */
export function parseSort(index: FakeIndex, sort: string[] | undefined, code = 'invalid_search_sort'): SortRule[] {
  return (sort ?? []).map((expression) => {
    const match = /^(.+):(asc|desc)$/.exec(expression.trim());
    if (!match) {
      throw badRequest(
        code,
        `Invalid syntax for the sort parameter: expected expression ending by \`:asc\` or \`:desc\`, found \`${expression}\`.`,
      );
    }
    const [, attribute, direction] = match;
    if (!index.isSortable(attribute)) throw badRequest(code, notSortableMessage(index, attribute));
    return { attribute, direction: direction === 'asc' ? 1 : -1 };
  });
}

/** Numbers sort before strings; documents without the attribute always go last. */
function compareKeys(a: SortKey, b: SortKey, direction: 1 | -1): number {
  if (a === b) return 0;
  if (a === undefined) return 1;
  if (b === undefined) return -1;
  if (typeof a !== typeof b) return typeof a === 'number' ? -direction : direction;
  return (a < b ? -1 : 1) * direction;
}

type Comparator = (a: number, b: number) => number;

export function buildComparator(
  index: FakeIndex,
  rules: SortRule[],
  relevance: Map<number, Relevance> | null,
): Comparator {
  const keys = rules.map((rule) => index.sortKeys(rule.attribute));
  const none: Relevance = { beforeSort: 0, afterSort: 0 };
  const placeOf = (slot: number) => relevance?.get(slot) ?? none;
  return (a, b) => {
    const pa = placeOf(a);
    const pb = placeOf(b);
    // Ranking rules before "sort" decide first, then the sort, then the rules after it.
    if (pa.beforeSort !== pb.beforeSort) return pb.beforeSort - pa.beforeSort;
    for (let r = 0; r < rules.length; r++) {
      const order = compareKeys(keys[r][a], keys[r][b], rules[r].direction);
      if (order !== 0) return order;
    }
    return pb.afterSort - pa.afterSort || a - b;
  };
}

/** The first `k` items of `items` under `compare`, without sorting the whole list when k is small. */
export function topK(items: ArrayLike<number>, k: number, compare: Comparator): number[] {
  if (k <= 0) return [];
  if (k * 8 >= items.length) return Array.from(items).sort(compare).slice(0, k);
  const best: number[] = [];
  for (let i = 0; i < items.length; i++) {
    const item = items[i];
    if (best.length === k && compare(item, best[k - 1]) >= 0) continue;
    let lo = 0;
    let hi = best.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (compare(best[mid], item) <= 0) lo = mid + 1;
      else hi = mid;
    }
    best.splice(lo, 0, item);
    if (best.length > k) best.pop();
  }
  return best;
}

interface Window {
  start: number;
  size: number;
}

/** Page 0 asks for no hits but still counts them, as the engine does. */
function pageWindow(request: SearchRequest): Window & { finite: boolean } {
  if (request.page !== undefined || request.hitsPerPage !== undefined) {
    const page = request.page ?? 1;
    const hitsPerPage = request.hitsPerPage ?? 20;
    return { finite: true, start: Math.max(0, page - 1) * hitsPerPage, size: page === 0 ? 0 : hitsPerPage };
  }
  return { finite: false, start: request.offset ?? 0, size: request.limit ?? 20 };
}

/**
 * `_vectors` is hidden unless asked for; asked for, it holds the document's own vectors (the fake
 * has no embedders, so nothing is added to them).
 */
export function withVectors(doc: Document, retrieveVectors: boolean): Document {
  const { _vectors: vectors, ...rest } = doc;
  if (!retrieveVectors) return rest;
  return { ...rest, _vectors: typeof vectors === 'object' && vectors !== null ? vectors : {} };
}

function project(doc: Document, request: SearchRequest, displayed: string[]): Document {
  const shown = selectPaths(doc, displayed);
  return withVectors(selectPaths(shown, request.attributesToRetrieve ?? null), request.retrieveVectors ?? false);
}

/** `attributesToSearchOn` may only name searchable attributes; null means every searchable one. */
function searchedAttributes(index: FakeIndex, request: SearchRequest): string[] | null {
  const wanted = request.attributesToSearchOn;
  if (!wanted || wanted.includes('*')) return null;
  for (const attribute of wanted) {
    if (!index.isSearchable(attribute)) {
      const available = [...index.settings.searchableAttributes].sort().join(', ');
      throw badRequest(
        'invalid_search_attributes_to_search_on',
        `Attribute \`${attribute}\` is not searchable. Available searchable attributes are: \`${available}\`.`,
      );
    }
  }
  return wanted;
}

function facetOrder(index: FakeIndex, facet: string): 'alpha' | 'count' {
  const by = index.settings.faceting.sortFacetValuesBy;
  return by[facet] ?? by['*'] ?? 'alpha';
}

function facetResults(index: FakeIndex, facets: string[], matched: ArrayLike<number>) {
  const filterable = index.settings.filterableAttributes;
  const everyField = filterable.includes('*') ? Object.keys(index.fieldDistribution()) : filterable;
  const names = facets.includes('*') ? everyField : facets;
  const distribution: Record<string, Record<string, number>> = {};
  const stats: Record<string, { min: number; max: number }> = {};
  for (const name of names) {
    if (!index.isFilterable(name)) {
      const available = [...index.settings.filterableAttributes].sort().join(', ');
      throw badRequest(
        'invalid_search_facets',
        `Invalid facet distribution, attribute \`${name}\` is not filterable. The available filterable attributes are \`${available}\`.`,
      );
    }
    const result = index.facet(name)?.distribution(matched);
    const entries = [...(result?.counts ?? new Map<string, number>())];
    entries.sort(
      facetOrder(index, name) === 'count'
        ? (a, b) => b[1] - a[1] || compareText(a[0], b[0])
        : (a, b) => compareText(a[0], b[0]),
    );
    distribution[name] = Object.fromEntries(entries.slice(0, index.settings.faceting.maxValuesPerFacet));
    if (result?.stats) stats[name] = result.stats;
  }
  return { facetDistribution: distribution, facetStats: stats };
}

function compareText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

function queryTerms(q: string | null | undefined): string[] {
  if (!q) return [];
  return q
    .split(/[\s\p{P}]+/u)
    .map(processTerm)
    .filter((term) => term.length > 0);
}

/** Matched slots in relevance order (or slot order without a query), with their relevance. */
function matchDocuments(
  index: FakeIndex,
  request: SearchRequest,
  candidates: Bitset | null,
  only: string[] | null,
): TextMatch {
  const terms = queryTerms(request.q);
  if (terms.length > 0) return matchText(index, terms, candidates, request.matchingStrategy ?? 'last', only);
  const pool = candidates ?? index.liveSlots();
  const slots: number[] = [];
  pool.forEach((slot) => slots.push(slot));
  return { slots, relevance: null };
}

export function runSearch(index: FakeIndex, request: SearchRequest): Record<string, unknown> {
  const started = performance.now();
  const only = searchedAttributes(index, request);
  const candidates = evaluateFilter(index, request.filter);
  const rules = parseSort(index, request.sort);
  const matched = matchDocuments(index, request, candidates, only);
  const window = pageWindow(request);
  const reachable = Math.min(matched.slots.length, index.settings.pagination.maxTotalHits);
  const end = Math.min(window.start + window.size, reachable);
  const ordered =
    rules.length === 0
      ? matched.slots.slice(0, end)
      : topK(matched.slots, end, buildComparator(index, rules, matched.relevance));
  const hits = ordered
    .slice(window.start)
    .map((slot) => project(index.document(slot) as Document, request, index.settings.displayedAttributes));
  const facets = request.facets ? facetResults(index, request.facets, matched.slots) : {};
  // Totals count no further than the hits pagination can reach.
  const total = reachable;
  const hitsPerPage = request.hitsPerPage ?? 20;
  const paging = window.finite
    ? {
        hitsPerPage,
        page: request.page ?? 1,
        totalPages: hitsPerPage === 0 ? 0 : Math.ceil(total / hitsPerPage),
        totalHits: total,
      }
    : { limit: window.size, offset: window.start, estimatedTotalHits: total };
  return {
    hits,
    query: request.q ?? '',
    processingTimeMs: Math.round(performance.now() - started),
    ...paging,
    ...facets,
  };
}
