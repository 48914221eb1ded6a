'use client';

import { useQuery } from '@tanstack/react-query';
import { sendJson } from '@/lib/http/client';

export interface HistoryItem {
  id: string;
  number: number;
  message: string;
  authorName: string;
  authorHandle: string;
  coAuthorName: string | null;
  createdAt: string;
  og: number;
  fg: number;
  abv: number;
  ibu: number;
  srm: number;
  /** What moved against the version before, e.g. "Mashed 1 °C cooler → FG −0.001"; null for the first. */
  moved: string | null;
}

const recipeHistoryKeys = {
  all: ['recipe-history'] as const,
  byRecipe: (recipeId: string) => [...recipeHistoryKeys.all, recipeId] as const,
};

export function useRecipeHistory(recipeId: string, initialData?: HistoryItem[]) {
  return useQuery({
    queryKey: recipeHistoryKeys.byRecipe(recipeId),
    queryFn: async ({ signal }): Promise<HistoryItem[]> =>
      (await sendJson<{ versions: HistoryItem[] }>(`/api/recipes/${recipeId}/versions`, 'GET', undefined, { signal }))
        .versions,
    initialData,
  });
}
