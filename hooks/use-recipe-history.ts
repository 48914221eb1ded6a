'use client';

import { useQuery } from '@tanstack/react-query';

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
    queryFn: async (): Promise<HistoryItem[]> => {
      const res = await fetch(`/api/recipes/${recipeId}/versions`);
      if (!res.ok) throw new Error('Could not load the history.');
      return ((await res.json()) as { versions: HistoryItem[] }).versions;
    },
    initialData,
  });
}
