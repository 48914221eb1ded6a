import 'server-only';
import type { Transaction } from '@/db';
import { searchOutbox } from '@/db/schema';
import { processSearchOutbox } from '@/lib/search/sync';

/**
 * Records, inside the writing transaction, that a recipe's head, visibility, hidden flag or
 * counters changed, so the search index is brought up to date even if it is down right now.
 */
export async function recordRecipeChange(tx: Transaction, recipeId: string): Promise<void> {
  await tx.insert(searchOutbox).values({ recipeId });
}

/** After the commit: hand pending changes to the search index without making the member wait. */
export function afterRecipeCommit(): void {
  void processSearchOutbox().catch((err: Error) => console.error('[search] outbox not processed yet:', err.message));
}
