import 'server-only';
import { and, eq, sql } from 'drizzle-orm';
import { db } from '@/db';
import { recipes, stars } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { notify } from '@/lib/notifications/notify';
import { consumeOrThrow, REACTION_PER_MEMBER } from '@/lib/rate-limit';
import { afterRecipeCommit, recordRecipeChange } from '@/lib/recipes/events';
import { getRecipe } from '@/lib/recipes/versions';

export interface StarState {
  starred: boolean;
  starCount: number;
}

/**
 * Stars or unstars a recipe the viewer can see. The star row, the recipe's star_count and the
 * search outbox change in one transaction; starring twice (or unstarring twice) changes nothing.
 */
export async function setStar(viewer: Viewer, recipeId: string, starred: boolean): Promise<StarState> {
  const recipe = await getRecipe(viewer, { id: recipeId });
  if (starred && recipe.hiddenAt)
    throw new AppError('forbidden', 'recipe', 'Moderators hid this recipe, so it cannot be starred.');
  await consumeOrThrow(REACTION_PER_MEMBER, viewer.id);
  const state = await db.transaction(async (tx) => {
    const changed = starred
      ? await tx
          .insert(stars)
          .values({ userId: viewer.id, recipeId })
          .onConflictDoNothing()
          .returning({ recipeId: stars.recipeId })
      : await tx
          .delete(stars)
          .where(and(eq(stars.userId, viewer.id), eq(stars.recipeId, recipeId)))
          .returning({ recipeId: stars.recipeId });
    if (!changed.length) {
      const [row] = await tx.select({ starCount: recipes.starCount }).from(recipes).where(eq(recipes.id, recipeId));
      return { starred, starCount: row.starCount, changed: false };
    }
    const [row] = await tx
      .update(recipes)
      .set({ starCount: starred ? sql`${recipes.starCount} + 1` : sql`greatest(${recipes.starCount} - 1, 0)` })
      .where(eq(recipes.id, recipeId))
      .returning({ starCount: recipes.starCount });
    await recordRecipeChange(tx, recipeId);
    if (starred)
      await notify(tx, {
        userId: recipe.ownerId,
        kind: 'star',
        actorId: viewer.id,
        recipeId,
        url: `/recipes/${recipe.slug}`,
      });
    return { starred, starCount: row.starCount, changed: true };
  });
  if (state.changed) afterRecipeCommit();
  return { starred: state.starred, starCount: state.starCount };
}

export async function hasStarred(viewer: Pick<Viewer, 'id'> | null, recipeId: string): Promise<boolean> {
  if (!viewer) return false;
  const [row] = await db
    .select({ recipeId: stars.recipeId })
    .from(stars)
    .where(and(eq(stars.userId, viewer.id), eq(stars.recipeId, recipeId)));
  return Boolean(row);
}
