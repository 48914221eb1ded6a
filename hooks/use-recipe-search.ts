import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { RecipeSearchResponse } from '@/lib/search/client';
import { serializeSearchQuery, type RecipeSearchQueryInput } from '@/lib/search/schemas';

/** Keys by the search's own query string, so a shared URL and the cache agree. */
export const recipeSearchKeys = {
  all: ['recipe-search'] as const,
  results: (queryString: string) => ['recipe-search', 'results', queryString] as const,
};

export type RecipeSearchData = RecipeSearchResponse;

/** A refused or failed search, with the server's code, message and per-field messages. */
export class RecipeSearchError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Array<{ path: string; message: string }> = [],
  ) {
    super(message);
    this.name = 'RecipeSearchError';
  }

  get unavailable(): boolean {
    return this.code === 'unavailable';
  }
}

async function fetchRecipeSearch(queryString: string, signal?: AbortSignal): Promise<RecipeSearchData> {
  let res: Response;
  try {
    res = await fetch(`/api/search${queryString ? `?${queryString}` : ''}`, {
      signal,
      headers: { accept: 'application/json' },
    });
  } catch (err) {
    if (signal?.aborted) throw err;
    throw new RecipeSearchError(0, 'network', 'Kettlefork could not be reached. Check your connection and try again.');
  }
  const body = (await res.json().catch(() => null)) as
    (RecipeSearchData & { error?: { code: string; message: string; fields?: RecipeSearchError['fields'] } }) | null;
  if (!res.ok || !body) {
    throw new RecipeSearchError(
      res.status,
      body?.error?.code ?? 'internal',
      body?.error?.message ?? 'The search did not work this time.',
      body?.error?.fields,
    );
  }
  return body;
}

function worthRetrying(err: unknown): boolean {
  // A refused search is refused again, and an engine that is down stays down for a while.
  return err instanceof RecipeSearchError && (err.status === 0 || (err.status >= 500 && !err.unavailable));
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
