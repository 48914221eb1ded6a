'use client';

import { useQueryClient } from '@tanstack/react-query';
import Link from 'next/link';
import { useMe } from '@/hooks/use-me';
import { recipeStandingKeys, useRecipeStanding } from '@/hooks/use-recipe-standing';
import type { RecipeStanding } from '@/lib/community/recipe-standing';
import { plural } from '@/lib/recipes/fields';
import { FollowButton } from './follow-button';
import { ReportButton } from './report-button';
import { StarButton } from './star-button';

interface Props {
  recipe: { id: string; slug: string; title: string; ownerHandle: string; starCount: number; hidden: boolean };
}

/**
 * Star, follow and report for a recipe page, as a client island: the server's HTML (shared by every
 * reader) has the signed-out star count, and a signed-in reader's own star and follow fill in from
 * /api/me/recipes/[id] in the same place.
 */
export function RecipeCommunityBar({ recipe }: Props) {
  const queryClient = useQueryClient();
  const { data: viewer } = useMe();
  const standing = useRecipeStanding(recipe.id, Boolean(viewer) && !recipe.hidden);
  const update = (next: Partial<RecipeStanding>) =>
    queryClient.setQueryData<RecipeStanding>(recipeStandingKeys.byRecipe(recipe.id), (old) =>
      old ? { ...old, ...next } : old,
    );
  if (!viewer) {
    return (
      <Link
        href={`/sign-in?callbackUrl=${encodeURIComponent(`/recipes/${recipe.slug}`)}`}
        className="kf-btn-quiet"
        aria-label={`${plural(recipe.starCount, 'star')}. Sign in to star this recipe.`}
      >
        <span aria-hidden="true">☆</span> Star <span className="kf-data">({recipe.starCount})</span>
      </Link>
    );
  }
  const own = viewer.handle === recipe.ownerHandle;
  const state = standing.data;
  return (
    <>
      {recipe.hidden ? (
        <span className="kf-btn-quiet" aria-label={plural(recipe.starCount, 'star')}>
          ★ <span className="kf-data">{recipe.starCount}</span>
        </span>
      ) : state ? (
        <StarButton recipeId={recipe.id} starred={state.starred} starCount={state.starCount} onChange={update} />
      ) : (
        <button type="button" className="kf-btn-quiet" disabled aria-busy="true">
          <span aria-hidden="true">☆</span> Star <span className="kf-data">({recipe.starCount})</span>
        </button>
      )}
      {!own && !recipe.hidden && (
        <FollowButton
          key={state ? 'known' : 'loading'}
          type="recipe"
          id={recipe.id}
          following={state?.following ?? false}
          disabled={!state}
          onChange={(following) => update({ following })}
          label={recipe.title}
        />
      )}
      {!own && <ReportButton targetType="recipe" targetId={recipe.id} />}
    </>
  );
}
