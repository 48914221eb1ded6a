import 'server-only';
import { eq } from 'drizzle-orm';
import type { Transaction } from '@/db';
import { recipes, recipeVersions, searchOutbox } from '@/db/schema';
import { processSearchOutbox } from '@/lib/search/sync';

/**
 * Records, inside the writing transaction, that a recipe's head, visibility, hidden flag or
 * counters changed, so the search index is brought up to date even if it is down right now.
 */
export async function recordRecipeChange(tx: Transaction, recipeId: string): Promise<void> {
  await tx.insert(searchOutbox).values({ recipeId });
}

/**
 * Records that a recipe's listing changed (its visibility or hidden flag): its own document and, when
 * it is a fork, its source's, whose public fork count (listedForkCountSql) follows its forks' listing.
 */
export async function recordListingChange(tx: Transaction, recipeId: string): Promise<void> {
  await recordRecipeChange(tx, recipeId);
  const [source] = await tx
    .select({ id: recipeVersions.recipeId })
    .from(recipes)
    .innerJoin(recipeVersions, eq(recipeVersions.id, recipes.forkedFromVersionId))
    .where(eq(recipes.id, recipeId));
  if (source) await recordRecipeChange(tx, source.id);
}

/** After the commit: hand pending changes to the search index without making the member wait. */
export function afterRecipeCommit(): void {
  void processSearchOutbox().catch((err: Error) => console.error('[search] outbox not processed yet:', err.message));
}
