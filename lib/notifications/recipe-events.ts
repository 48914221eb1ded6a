import 'server-only';
import { eq } from 'drizzle-orm';
import type { Transaction } from '@/db';
import { memberFollows, recipeVersions, recipes } from '@/db/schema';
import { notify } from './notify';

/**
 * Called inside the transaction that creates a recipe (a new one or a fork): the source's owner
 * hears of a public fork, and the owner's followers of any new public recipe.
 */
export async function notifyRecipeCreated(
  tx: Transaction,
  recipe: { id: string; slug: string; ownerId: string; visibility: string; forkedFromVersionId: string | null },
): Promise<void> {
  if (recipe.visibility !== 'public') return;
  const url = `/recipes/${recipe.slug}`;
  if (recipe.forkedFromVersionId) {
    const [source] = await tx
      .select({ id: recipes.id, ownerId: recipes.ownerId })
      .from(recipeVersions)
      .innerJoin(recipes, eq(recipes.id, recipeVersions.recipeId))
      .where(eq(recipeVersions.id, recipe.forkedFromVersionId));
    if (source)
      await notify(tx, { userId: source.ownerId, kind: 'fork', actorId: recipe.ownerId, recipeId: source.id, url });
  }
  const followers = await tx
    .select({ id: memberFollows.followerId })
    .from(memberFollows)
    .where(eq(memberFollows.followeeId, recipe.ownerId));
  for (const f of followers) {
    await notify(tx, { userId: f.id, kind: 'new_recipe', actorId: recipe.ownerId, recipeId: recipe.id, url });
  }
}
