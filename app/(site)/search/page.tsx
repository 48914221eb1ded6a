import { dehydrate, HydrationBoundary } from '@tanstack/react-query';
import type { Metadata } from 'next';
import { recipeSearchKeys } from '@/hooks/use-recipe-search';
import { getViewer } from '@/lib/auth/session';
import { styleCategories } from '@/lib/brewing/styles';
import { makeQueryClient } from '@/lib/query-client';
import { searchRecipesWithHints } from '@/lib/search/client';
import { parseSearchParamsLeniently, serializeSearchQuery } from '@/lib/search/schemas';
import { RecipeSearch } from './_components/recipe-search';

export const metadata: Metadata = {
  title: 'Find recipes',
  description: 'Find homebrew recipes by style, hop, malt, yeast, strength, bitterness and colour.',
};

type SearchParamsRecord = Record<string, string | string[] | undefined>;

function toUrlSearchParams(record: SearchParamsRecord): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(record)) {
    for (const item of Array.isArray(value) ? value : value === undefined ? [] : [value]) params.append(key, item);
  }
  return params;
}

export default async function SearchPage({ searchParams }: { searchParams: Promise<SearchParamsRecord> }) {
  const { query } = parseSearchParamsLeniently(toUrlSearchParams(await searchParams));
  const viewer = await getViewer();
  const queryClient = makeQueryClient();
  let unavailable = false;
  try {
    const response = await searchRecipesWithHints(query, viewer && { id: viewer.id, role: viewer.role });
    queryClient.setQueryData(recipeSearchKeys.results(serializeSearchQuery(query)), { query, ...response });
  } catch (err) {
    console.error('[search] page query failed:', err instanceof Error ? err.message : err);
    unavailable = true;
  }
  const categories = styleCategories();

  return (
    <div>
      <h1 className="text-3xl font-semibold">Find recipes</h1>
      <p className="mt-2 max-w-2xl text-muted">
        Search by name, style, hop, malt or yeast, then narrow by strength, bitterness and colour.
      </p>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <RecipeSearch categories={categories} unavailableAtFirst={unavailable} />
      </HydrationBoundary>
    </div>
  );
}
