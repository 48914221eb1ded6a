import 'server-only';
import type { Viewer } from '@/lib/auth/session';
import { getRecipe } from '@/lib/recipes/versions';
import { isFollowing } from './follows';
import { hasStarred } from './stars';

export interface RecipeStanding {
  starred: boolean;
  following: boolean;
  starCount: number;
}

/**
 * Whether the member stars and follows a recipe they can see (404 for one they cannot, as for a
 * missing one), with its current star count: what the recipe page's star and follow buttons show.
 */
export async function loadCommunityState(viewer: Viewer, recipeId: string): Promise<RecipeStanding> {
  const [recipe, starred, following] = await Promise.all([
    getRecipe(viewer, { id: recipeId }),
    hasStarred(viewer, recipeId),
    isFollowing(viewer, 'recipe', recipeId),
  ]);
  return { starred, following, starCount: recipe.starCount };
}
