/** The shape of one recipe in the search index, and the index's settings. */
import type { Settings } from 'meilisearch';

export type RecipeVisibility = 'public' | 'unlisted' | 'private';

export interface RecipeSearchDocument {
  /** Recipe uuid; the index's primary key. */
  id: string;
  slug: string;
  title: string;
  ownerId: string;
  authorName: string;
  authorHandle: string;
  styleCode: string;
  styleName: string;
  styleCategory: string;
  fermentables: string[];
  hops: string[];
  yeasts: string[];
  yeastKinds: string[];
  notes: string;
  og: number;
  fg: number;
  abv: number;
  ibu: number;
  srm: number;
  stars: number;
  forks: number;
  /** Epoch milliseconds. */
  createdAt: number;
  /** Epoch milliseconds. */
  updatedAt: number;
  visibility: RecipeVisibility;
  hidden: boolean;
  headVersion: number;
}

export const RECIPES_INDEX = 'recipes';
export const RECIPES_PRIMARY_KEY = 'id';

/** Earlier attributes weigh more in relevance. */
const SEARCHABLE_ATTRIBUTES = [
  'title',
  'styleName',
  'hops',
  'fermentables',
  'yeasts',
  'yeastKinds',
  'styleCategory',
  'authorName',
  'authorHandle',
  'notes',
] as const satisfies ReadonlyArray<keyof RecipeSearchDocument>;

export const FILTERABLE_ATTRIBUTES = [
  'styleCode',
  'styleCategory',
  'hops',
  'fermentables',
  'yeasts',
  'yeastKinds',
  'og',
  'fg',
  'abv',
  'ibu',
  'srm',
  'visibility',
  'hidden',
  'ownerId',
] as const satisfies ReadonlyArray<keyof RecipeSearchDocument>;

const SORTABLE_ATTRIBUTES = [
  'createdAt',
  'updatedAt',
  'stars',
  'forks',
  'abv',
  'ibu',
  'og',
] as const satisfies ReadonlyArray<keyof RecipeSearchDocument>;

/** Facets the search page shows counts for. */
export const FACET_ATTRIBUTES = [
  'styleCategory',
  'styleCode',
  'hops',
  'fermentables',
  'yeasts',
  'yeastKinds',
  'abv',
  'ibu',
  'srm',
  'og',
] as const;

export type RecipeFacet = (typeof FACET_ATTRIBUTES)[number];

/** Results reachable by paging: every page a reader may ask for. */
const MAX_TOTAL_HITS = 20_000;

export const RECIPE_INDEX_SETTINGS: Settings = {
  searchableAttributes: [...SEARCHABLE_ATTRIBUTES],
  filterableAttributes: [...FILTERABLE_ATTRIBUTES],
  sortableAttributes: [...SORTABLE_ATTRIBUTES],
  // "sort" first: a reader who picks "newest" or "stars" gets that order, relevance breaks ties.
  rankingRules: ['sort', 'words', 'typo', 'proximity', 'attribute', 'exactness'],
  typoTolerance: { enabled: true, minWordSizeForTypos: { oneTypo: 5, twoTypos: 9 } },
  faceting: { maxValuesPerFacet: 50, sortFacetValuesBy: { '*': 'count' } },
  pagination: { maxTotalHits: MAX_TOTAL_HITS },
};
