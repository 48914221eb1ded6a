import Link from 'next/link';
import type { Viewer } from '@/lib/auth/session';
import { isFollowing } from '@/lib/community/follows';
import { hasStarred } from '@/lib/community/stars';
import { FollowButton } from './follow-button';
import { ReportButton } from './report-button';
import { StarButton } from './star-button';
import { plural } from '@/lib/recipes/fields';

/** Star, follow and report for a recipe page; signed-out readers see the star count. */
export async function loadCommunityState(
  viewer: Viewer | null,
  recipeId: string,
): Promise<{ starred: boolean; following: boolean }> {
  if (!viewer) return { starred: false, following: false };
  const [starred, following] = await Promise.all([
    hasStarred(viewer, recipeId),
    isFollowing(viewer, 'recipe', recipeId),
  ]);
  return { starred, following };
}

export function RecipeCommunityBar({
  viewer,
  recipe,
  state: { starred, following },
}: {
  viewer: Viewer | null;
  recipe: { id: string; slug: string; title: string; ownerId: string; starCount: number; hiddenAt: Date | null };
  state: { starred: boolean; following: boolean };
}) {
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
  const own = viewer.id === recipe.ownerId;
  return (
    <>
      {recipe.hiddenAt ? (
        <span className="kf-btn-quiet" aria-label={plural(recipe.starCount, 'star')}>
          ★ <span className="kf-data">{recipe.starCount}</span>
        </span>
      ) : (
        <StarButton recipeId={recipe.id} starred={starred} starCount={recipe.starCount} />
      )}
      {!own && !recipe.hiddenAt && (
        <FollowButton type="recipe" id={recipe.id} following={following} label={recipe.title} />
      )}
      {!own && <ReportButton targetType="recipe" targetId={recipe.id} />}
    </>
  );
}
