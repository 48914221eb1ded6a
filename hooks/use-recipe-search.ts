import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { ApiError, sendJson } from '@/lib/http/client';
import type { RecipeSearchResponse } from '@/lib/search/client';
import { serializeSearchQuery, type RecipeSearchQueryInput } from '@/lib/search/schemas';

/** Keys by the search's own query string, so a shared URL and the cache agree. */
export const recipeSearchKeys = {
  all: ['recipe-search'] as const,
  results: (queryString: string) => ['recipe-search', 'results', queryString] as const,
};

export type RecipeSearchData = RecipeSearchResponse;

function fetchRecipeSearch(queryString: string, signal?: AbortSignal): Promise<RecipeSearchData> {
  return sendJson<RecipeSearchData>(`/api/search${queryString ? `?${queryString}` : ''}`, 'GET', undefined, { signal });
}

/** True when the search engine is down: the page says so instead of showing a failure. */
export function searchUnavailable(err: unknown): boolean {
  return err instanceof ApiError && err.code === 'unavailable';
}

function worthRetrying(err: unknown): boolean {
  // A refused search is refused again, and an engine that is down stays down for a while.
  return err instanceof ApiError && (err.status === 0 || (err.status >= 500 && !searchUnavailable(err)));
}

/** Results for a search, keeping the previous results on screen while the next ones load. */
export function useRecipeSearch(query: RecipeSearchQueryInput, options: { enabled?: boolean } = {}) {
  const queryString = serializeSearchQuery(query);
  return useQuery({
    queryKey: recipeSearchKeys.results(queryString),
    queryFn: ({ signal }) => fetchRecipeSearch(queryString, signal),
    placeholderData: keepPreviousData,
    enabled: options.enabled ?? true,
    retry: (failures, err) => failures < 1 && worthRetrying(err),
  });
}
