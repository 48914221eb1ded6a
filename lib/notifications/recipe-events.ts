import 'server-only';
import { eq } from 'drizzle-orm';
import type { Transaction } from '@/db';
import { recipeVersions, recipes } from '@/db/schema';
import { notify, notifyFollowers } from './notify';

/**
 * Called inside the transaction that creates a recipe (a new one or a fork): the source's owner
 * hears of a public fork, and the owner's followers of any new public recipe (in a fixed number of
 * statements, however many followers there are).
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
  await notifyFollowers(tx, { kind: 'new_recipe', actorId: recipe.ownerId, recipeId: recipe.id, url });
}
