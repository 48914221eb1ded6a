import {
  serializeSearchQuery,
  type RecipeSearchQuery,
  type RecipeSearchQueryInput,
  type SearchQueryField,
} from '@/lib/search/schemas';

/** The search page's address for a query. */
export function searchHref(query: RecipeSearchQueryInput): string {
  const queryString = serializeSearchQuery(query);
  return queryString ? `/search?${queryString}` : '/search';
}

/**
 * Writes the search into the address bar. Next.js follows native history calls (useSearchParams
 * updates) without asking the server to render the page again, so typing stays quick; each
 * filter or page change is its own history entry, so Back undoes it.
 */
export function writeSearchToUrl(query: RecipeSearchQueryInput, mode: 'push' | 'replace'): void {
  const href = searchHref(query);
  if (`${window.location.pathname}${window.location.search}` === href) return;
  if (mode === 'push') window.history.pushState(null, '', href);
  else window.history.replaceState(null, '', href);
}

/** How many filters narrow the search (the words and the sort are not filters). */
export function activeFilterCount(query: RecipeSearchQuery): number {
  const lists = query.style.length + query.hop.length + query.malt.length + query.yeast.length;
  const ranges = (['abv', 'ibu', 'srm', 'og'] as const).filter(
    (field) => query[`${field}Min`] !== undefined || query[`${field}Max`] !== undefined,
  ).length;
  return lists + ranges;
}

/** The same search with no filters, words kept. */
export function withoutFilters(query: RecipeSearchQuery): RecipeSearchQuery {
  return {
    ...query,
    style: [],
    hop: [],
    malt: [],
    yeast: [],
    abvMin: undefined,
    abvMax: undefined,
    ibuMin: undefined,
    ibuMax: undefined,
    srmMin: undefined,
    srmMax: undefined,
    ogMin: undefined,
    ogMax: undefined,
    page: 1,
  };
}

/** Names for the parts of a search address, as a brewer would say them. */
export const FIELD_WORDS: Record<SearchQueryField, string> = {
  q: 'the search words',
  style: 'the styles',
  hop: 'the hops',
  malt: 'the malts',
  yeast: 'the yeasts',
  abvMin: 'the ABV range',
  abvMax: 'the ABV range',
  ibuMin: 'the IBU range',
  ibuMax: 'the IBU range',
  srmMin: 'the colour range',
  srmMax: 'the colour range',
  ogMin: 'the OG range',
  ogMax: 'the OG range',
  sort: 'the sort order',
  page: 'the page number',
};

const RANGE_NAMES = { abv: 'ABV', ibu: 'IBU', srm: 'colour', og: 'OG' } as const;

/** A schema message in a brewer's words: "abvMin must not be greater than abvMax" → "Lowest ABV must not be greater than highest ABV". */
export function readableMessage(message: string): string {
  const text = message
    .replace(
      /\b(abv|ibu|srm|og)(Min|Max)\b/g,
      (_, field: keyof typeof RANGE_NAMES, end: string) =>
        `${end === 'Min' ? 'lowest' : 'highest'} ${RANGE_NAMES[field]}`,
    )
    .replace(/^q\b/, 'the search words')
    .replace(/^(sort|page)\b/, (field) => (field === 'sort' ? 'the sort order' : 'the page number'))
    .replace(/^(style|hop|malt|yeast)\b/, (field) => `the ${field}`);
  return text.charAt(0).toUpperCase() + text.slice(1);
}
