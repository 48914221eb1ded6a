/** Recipe search through the search engine's official client, configured by MEILI_HOST and MEILI_KEY. */
import 'server-only';
import { Meilisearch, type EnqueuedTask, type SearchParams, type Task } from 'meilisearch';
import { env } from '../env';
import {
  FACET_ATTRIBUTES,
  RECIPE_INDEX_SETTINGS,
  RECIPES_INDEX,
  RECIPES_PRIMARY_KEY,
  type RecipeFacet,
  type RecipeSearchDocument,
} from './document';
import { buildRecipeFilter, sortFor, type SearchViewer } from './filters';
import { SEARCH_PAGE_SIZE, type RecipeSearchQuery } from './schemas';

export type { SearchViewer } from './filters';

let cachedClient: Meilisearch | null = null;

export function getSearchClient(): Meilisearch {
  if (!cachedClient) {
    const { MEILI_HOST, MEILI_KEY } = env();
    cachedClient = new Meilisearch({ host: MEILI_HOST, apiKey: MEILI_KEY || undefined, timeout: 5_000 });
  }
  return cachedClient;
}

const WRITE_WAIT = { timeout: 30_000, interval: 25 };

class SearchTaskError extends Error {
  constructor(readonly task: Task) {
    super(`Search task ${task.uid} (${task.type}) ${task.status}: ${task.error?.message ?? 'no error message'}`);
    this.name = 'SearchTaskError';
  }
}

function assertSucceeded(task: Task): Task {
  if (task.status !== 'succeeded') throw new SearchTaskError(task);
  return task;
}

/** Creates the recipes index if missing and applies its settings; returns how many documents it holds. */
export async function ensureRecipeIndex(client: Meilisearch = getSearchClient()): Promise<{ documentCount: number }> {
  const created = await client.createIndex(RECIPES_INDEX, { primaryKey: RECIPES_PRIMARY_KEY }).waitTask(WRITE_WAIT);
  if (created.status !== 'succeeded' && created.error?.code !== 'index_already_exists')
    throw new SearchTaskError(created);
  const index = client.index(RECIPES_INDEX);
  assertSucceeded(await index.updateSettings(RECIPE_INDEX_SETTINGS).waitTask(WRITE_WAIT));
  const stats = await index.getStats();
  return { documentCount: stats.numberOfDocuments };
}

const UPSERT_BATCH_SIZE = 1_000;

/** Adds or replaces recipes; resolves once the index holds them, so the next search sees them. */
export async function upsertRecipeDocuments(
  docs: RecipeSearchDocument[],
  client: Meilisearch = getSearchClient(),
): Promise<void> {
  const index = client.index<RecipeSearchDocument>(RECIPES_INDEX);
  for (let start = 0; start < docs.length; start += UPSERT_BATCH_SIZE) {
    const batch = docs.slice(start, start + UPSERT_BATCH_SIZE);
    assertSucceeded(await index.addDocuments(batch, { primaryKey: RECIPES_PRIMARY_KEY }).waitTask(WRITE_WAIT));
  }
}

/**
 * Queues a batch of recipes without waiting for the engine to take it: for bulk loads, where the
 * engine works through queued batches while the next one is read. Hand every task to
 * `waitForRecipeTasks` before relying on the documents.
 */
export async function enqueueRecipeDocuments(
  docs: RecipeSearchDocument[],
  client: Meilisearch = getSearchClient(),
): Promise<EnqueuedTask> {
  return client.index<RecipeSearchDocument>(RECIPES_INDEX).addDocuments(docs, { primaryKey: RECIPES_PRIMARY_KEY });
}

/** Resolves once every queued task has succeeded; throws on the first that failed. */
export async function waitForRecipeTasks(
  tasks: EnqueuedTask[],
  client: Meilisearch = getSearchClient(),
): Promise<void> {
  if (tasks.length === 0) return;
  const done = await client.tasks.waitForTasks(tasks, { timeout: 120_000, interval: 50 });
  done.forEach(assertSucceeded);
}

/** Removes recipes by id; resolves once they are gone from results. */
export async function deleteRecipeDocuments(ids: string[], client: Meilisearch = getSearchClient()): Promise<void> {
  if (ids.length === 0) return;
  assertSucceeded(await client.index(RECIPES_INDEX).deleteDocuments(ids).waitTask(WRITE_WAIT));
}

/**
 * What a hit carries: what the results show and what the viewer rules need, nothing more. A kept
 * search page is filed under the engine's whole answer (lib/page-cache.ts), so a field nobody shows
 * (the time of the last save, say) would only make every save of a listed recipe a fresh render.
 */
const RECIPE_HIT_FIELDS = [
  'id',
  'slug',
  'title',
  'authorName',
  'authorHandle',
  'styleCode',
  'styleName',
  'styleCategory',
  'og',
  'fg',
  'abv',
  'ibu',
  'srm',
  'forks',
  'stars',
  'hidden',
  'visibility',
] as const satisfies ReadonlyArray<keyof RecipeSearchDocument>;

export type RecipeSearchHit = Pick<RecipeSearchDocument, (typeof RECIPE_HIT_FIELDS)[number]>;

/** Facets that come back as value → count; the numeric ones come back as min/max only. */
const DISTRIBUTION_FACETS = ['styleCategory', 'styleCode', 'hops', 'fermentables', 'yeasts', 'yeastKinds'] as const;
type DistributionFacet = (typeof DISTRIBUTION_FACETS)[number];

export interface RecipeSearchResult {
  hits: RecipeSearchHit[];
  total: number;
  page: number;
  pageCount: number;
  pageSize: number;
  facetDistribution: Record<DistributionFacet, Record<string, number>>;
  facetStats: Partial<Record<'abv' | 'ibu' | 'srm' | 'og', { min: number; max: number }>>;
  processingTimeMs: number;
}

interface SearchOptions {
  hitsPerPage?: number;
  facets?: readonly RecipeFacet[];
}

async function runRecipeSearch(
  query: RecipeSearchQuery,
  viewer: SearchViewer,
  client: Meilisearch,
  { hitsPerPage = SEARCH_PAGE_SIZE, facets = FACET_ATTRIBUTES }: SearchOptions = {},
): Promise<RecipeSearchResult> {
  const params = {
    filter: buildRecipeFilter(query, viewer),
    sort: sortFor(query.sort),
    page: query.page,
    hitsPerPage,
    attributesToRetrieve: [...RECIPE_HIT_FIELDS],
    facets: facets.length > 0 ? [...facets] : undefined,
  } satisfies SearchParams;
  const response = await client.index(RECIPES_INDEX).search<RecipeSearchHit, typeof params>(query.q, params);
  const distribution = response.facetDistribution ?? {};
  return {
    hits: response.hits.map((hit) => ({ ...hit, hidden: hit.hidden === true })),
    total: response.totalHits,
    page: response.page,
    pageCount: response.totalPages,
    pageSize: hitsPerPage,
    facetDistribution: Object.fromEntries(
      DISTRIBUTION_FACETS.map((facet) => [facet, distribution[facet] ?? {}]),
    ) as RecipeSearchResult['facetDistribution'],
    facetStats: response.facetStats ?? {},
    processingTimeMs: response.processingTimeMs,
  };
}

const STYLE_FACETS = ['styleCategory', 'styleCode'] as const;

/**
 * One page of recipes the viewer may see, with facet counts over the whole result. Chosen styles
 * are alternatives (any of them), so style counts are taken as if no style were chosen: a reader
 * sees how many recipes each further style would add.
 */
export async function searchRecipes(
  query: RecipeSearchQuery,
  viewer: SearchViewer,
  client: Meilisearch = getSearchClient(),
): Promise<RecipeSearchResult> {
  if (query.style.length === 0) return runRecipeSearch(query, viewer, client);
  const [result, withoutStyle] = await Promise.all([
    runRecipeSearch(query, viewer, client),
    runRecipeSearch({ ...query, style: [], page: 1 }, viewer, client, { hitsPerPage: 0, facets: STYLE_FACETS }),
  ]);
  for (const facet of STYLE_FACETS) result.facetDistribution[facet] = withoutStyle.facetDistribution[facet];
  return result;
}

/** One way to widen an empty search: drop `field` (or just `value` from it) and `total` recipes match. */
export interface LooseningSuggestion {
  field: 'q' | 'style' | 'hop' | 'malt' | 'yeast' | 'abv' | 'ibu' | 'srm' | 'og';
  value?: string;
  total: number;
}

function loosenedQueries(
  query: RecipeSearchQuery,
): Array<{ suggestion: Omit<LooseningSuggestion, 'total'>; query: RecipeSearchQuery }> {
  const variants: Array<{ suggestion: Omit<LooseningSuggestion, 'total'>; query: RecipeSearchQuery }> = [];
  if (query.q !== '') variants.push({ suggestion: { field: 'q' }, query: { ...query, q: '' } });
  for (const field of ['style', 'hop', 'malt', 'yeast'] as const) {
    for (const value of query[field]) {
      variants.push({
        suggestion: { field, value },
        query: { ...query, [field]: query[field].filter((v) => v !== value) },
      });
    }
  }
  for (const field of ['abv', 'ibu', 'srm', 'og'] as const) {
    if (query[`${field}Min`] !== undefined || query[`${field}Max`] !== undefined) {
      variants.push({
        suggestion: { field },
        query: { ...query, [`${field}Min`]: undefined, [`${field}Max`]: undefined },
      });
    }
  }
  return variants.map((variant) => ({ ...variant, query: { ...variant.query, page: 1 } }));
}

/**
 * For a search with no results: re-runs it without each filter in turn and returns
 * the ones whose removal would give results, most results first.
 */
export async function suggestLoosening(
  query: RecipeSearchQuery,
  viewer: SearchViewer,
  client: Meilisearch = getSearchClient(),
): Promise<LooseningSuggestion[]> {
  const variants = loosenedQueries(query);
  const totals = await Promise.all(
    variants.map((variant) =>
      runRecipeSearch(variant.query, viewer, client, { hitsPerPage: 0, facets: [] }).then((result) => result.total),
    ),
  );
  return variants
    .map((variant, i) => ({ ...variant.suggestion, total: totals[i] }))
    .filter((suggestion) => suggestion.total > 0)
    .sort((a, b) => b.total - a.total);
}

/** True when the search engine answers its health check within a short time. */
export async function isSearchAvailable(client: Meilisearch = getSearchClient()): Promise<boolean> {
  const giveUp = new Promise<boolean>((resolve) => setTimeout(() => resolve(false), 1_500).unref());
  return Promise.race([client.isHealthy(), giveUp]);
}

export interface RecipeSearchResponse extends RecipeSearchResult {
  /** Ways to widen a search that found nothing; empty when it found something. */
  suggestions: LooseningSuggestion[];
}

/** What the search page and the search API answer: results, and hints when there are none. */
export async function searchRecipesWithHints(
  query: RecipeSearchQuery,
  viewer: SearchViewer,
  client: Meilisearch = getSearchClient(),
): Promise<RecipeSearchResponse> {
  const result = await searchRecipes(query, viewer, client);
  const suggestions = result.total === 0 ? await suggestLoosening(query, viewer, client) : [];
  return { ...result, suggestions };
}
