'use client';

import { useQuery } from '@tanstack/react-query';
import type { RecipeStanding } from '@/lib/community/recipe-standing';

export const recipeStandingKeys = { byRecipe: (recipeId: string) => ['me', 'recipes', recipeId] as const };

/** The signed-in member's star and follow on one recipe; asked only while `enabled` (someone is signed in). */
export function useRecipeStanding(recipeId: string, enabled: boolean) {
  return useQuery({
    queryKey: recipeStandingKeys.byRecipe(recipeId),
    enabled,
    queryFn: async (): Promise<RecipeStanding> => {
      const res = await fetch(`/api/me/recipes/${recipeId}`, { cache: 'no-store' });
      if (!res.ok) throw new Error('Could not load your star and follow.');
      return (await res.json()) as RecipeStanding;
    },
  });
}
