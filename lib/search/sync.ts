/**
 * Keeps the search index in step with PostgreSQL. Every recipe change leaves a row in
 * `search_outbox` in its own transaction; this module sends those recipes to the index and
 * removes the rows, rebuilds the whole index when the engine starts empty, and runs a small
 * background loop that retries after an outage.
 */
import 'server-only';
import { asc, count, eq, gt, inArray, isNotNull, sql, type SQL } from 'drizzle-orm';
import type { EnqueuedTask, Meilisearch } from 'meilisearch';
import { db, readDatabase, type Database, type Transaction } from '@/db';
import { recipes, recipeVersions, searchOutbox, users } from '@/db/schema';
import {
  toSearchDocument,
  MAX_INDEXED_NOTES_CHARS,
  type IndexedDocumentParts,
  type RecipeIndexRow,
} from './build-document';
import {
  deleteRecipeDocuments,
  enqueueRecipeDocuments,
  ensureRecipeIndex,
  getSearchClient,
  isSearchAvailable,
  upsertRecipeDocuments,
  waitForRecipeTasks,
} from './client';
import { FILTERABLE_ATTRIBUTES, RECIPES_INDEX } from './document';
import { listedForkCountSql } from '@/lib/recipes/access';

type Executor = Database | Transaction;

const OUTBOX_BATCH = 200;
const REBUILD_BATCH = 1_000;
const LOOP_INTERVAL_MS = 5_000;
const MAX_ERROR_CHARS = 500;

// Only the parts of the document the index reads, so a rebuild moves little data.
const indexedParts = sql<IndexedDocumentParts>`jsonb_build_object(
  'style', ${recipeVersions.document} -> 'style',
  'fermentables', ${recipeVersions.document} -> 'fermentables',
  'hops', ${recipeVersions.document} -> 'hops',
  'yeasts', ${recipeVersions.document} -> 'yeasts',
  'notes', left(${recipeVersions.document} ->> 'notes', ${sql.raw(String(MAX_INDEXED_NOTES_CHARS))})
)`;

/** Recipes with their head version and owner, in id order. */
function selectIndexRows(executor: Executor, where: SQL | undefined, limit?: number): Promise<RecipeIndexRow[]> {
  const query = executor
    .select({
      id: recipes.id,
      slug: recipes.slug,
      title: recipes.title,
      ownerId: recipes.ownerId,
      ownerName: users.name,
      ownerHandle: users.handle,
      visibility: recipes.visibility,
      hiddenAt: recipes.hiddenAt,
      starCount: recipes.starCount,
      forkCount: listedForkCountSql(null),
      headNumber: recipes.headNumber,
      createdAt: recipes.createdAt,
      updatedAt: recipes.updatedAt,
      og: recipeVersions.og,
      fg: recipeVersions.fg,
      abv: recipeVersions.abv,
      ibu: recipeVersions.ibu,
      srm: recipeVersions.srm,
      styleCode: recipeVersions.styleCode,
      document: indexedParts,
    })
    .from(recipes)
    .innerJoin(recipeVersions, eq(recipeVersions.id, recipes.headVersionId))
    .innerJoin(users, eq(users.id, recipes.ownerId))
    .where(where)
    .orderBy(asc(recipes.id));
  return limit === undefined ? query : query.limit(limit);
}

function errorText(err: unknown): string {
  const message = err instanceof Error ? `${err.name}: ${err.message}` : String(err);
  return message.slice(0, MAX_ERROR_CHARS);
}

interface BatchOutcome {
  taken: number;
  error?: string;
}

/**
 * One batch, in one transaction: lock the oldest pending rows (skipping rows another instance
 * holds), send their recipes, then delete the rows, or on failure count the attempt and keep them.
 */
function sendOutboxBatch(client: Meilisearch, database: Executor): Promise<BatchOutcome> {
  return database.transaction(async (tx) => {
    const entries = await tx
      .select({ id: searchOutbox.id, recipeId: searchOutbox.recipeId })
      .from(searchOutbox)
      .orderBy(asc(searchOutbox.id))
      .limit(OUTBOX_BATCH)
      .for('update', { skipLocked: true });
    if (entries.length === 0) return { taken: 0 };
    const entryIds = entries.map((entry) => entry.id);
    const recipeIds = [...new Set(entries.map((entry) => entry.recipeId))];
    const docs = (await selectIndexRows(tx, inArray(recipes.id, recipeIds))).map(toSearchDocument);
    const indexed = new Set(docs.map((doc) => doc.id));
    const gone = recipeIds.filter((id) => !indexed.has(id));
    try {
      await upsertRecipeDocuments(docs, client);
      await deleteRecipeDocuments(gone, client);
    } catch (err) {
      const error = errorText(err);
      await tx
        .update(searchOutbox)
        .set({ attempts: sql`${searchOutbox.attempts} + 1`, lastError: error })
        .where(inArray(searchOutbox.id, entryIds));
      return { taken: entries.length, error };
    }
    await tx.delete(searchOutbox).where(inArray(searchOutbox.id, entryIds));
    return { taken: entries.length };
  });
}

interface SyncState {
  running: Promise<void> | null;
  again: boolean;
  failing: boolean;
  loop: NodeJS.Timeout | null;
}

// On globalThis: route handlers and instrumentation may load separate copies of this module in one process.
const state: SyncState = ((globalThis as { kfSearchSync?: SyncState }).kfSearchSync ??= {
  running: null,
  again: false,
  failing: false,
  loop: null,
});

async function drainOutbox(client: Meilisearch, database: Executor): Promise<void> {
  for (;;) {
    const outcome = await sendOutboxBatch(client, database);
    if (outcome.error) {
      // One line per outage, not one per attempt.
      if (!state.failing) console.error(`[search] index not reachable; changes wait in the outbox: ${outcome.error}`);
      state.failing = true;
      return;
    }
    if (state.failing && outcome.taken > 0) console.info('[search] index reachable again; outbox sent');
    state.failing = false;
    if (outcome.taken < OUTBOX_BATCH) return;
  }
}

/**
 * Sends pending search outbox entries to the index. Never throws: when the engine is down the
 * entries stay, with their attempts counted, for the next run. One run at a time per process;
 * a call during a run makes that run go round once more, so nothing committed meanwhile waits.
 */
export function processSearchOutbox(client: Meilisearch = getSearchClient(), database: Executor = db): Promise<void> {
  if (state.running) {
    state.again = true;
    return state.running;
  }
  state.running = (async () => {
    try {
      do {
        state.again = false;
        await drainOutbox(client, database);
      } while (state.again && !state.failing);
    } catch (err) {
      console.error('[search] outbox run failed:', errorText(err));
    } finally {
      state.running = null;
    }
  })();
  return state.running;
}

/**
 * Reindexes every recipe from PostgreSQL, 1,000 at a time in id order (keyset pagination). Each
 * batch is queued without waiting, so the engine indexes one batch while the next is read.
 */
export async function rebuildSearchIndex(
  client: Meilisearch = getSearchClient(),
  // A whole-index rebuild may lag the primary by a moment, so it reads from a replica when there is one.
  database: Executor = readDatabase(),
): Promise<{ count: number; ms: number }> {
  const started = performance.now();
  const tasks: EnqueuedTask[] = [];
  let total = 0;
  let after: string | null = null;
  for (;;) {
    const rows = await selectIndexRows(database, after === null ? undefined : gt(recipes.id, after), REBUILD_BATCH);
    if (rows.length === 0) break;
    total += rows.length;
    after = rows[rows.length - 1].id;
    tasks.push(await enqueueRecipeDocuments(rows.map(toSearchDocument), client));
    if (rows.length < REBUILD_BATCH) break;
  }
  await waitForRecipeTasks(tasks, client);
  return { count: total, ms: Math.round(performance.now() - started) };
}

async function countIndexableRecipes(database: Executor): Promise<number> {
  const [row] = await database.select({ n: count() }).from(recipes).where(isNotNull(recipes.headVersionId));
  return row?.n ?? 0;
}

/** An empty index while PostgreSQL has recipes means the engine started afresh: refill it. */
async function refillIfEmpty(documentCount: number, client: Meilisearch, database: Executor): Promise<void> {
  if (documentCount > 0 || (await countIndexableRecipes(database)) === 0) return;
  const { count: rebuilt, ms } = await rebuildSearchIndex(client, database);
  console.info(`[search] index was empty; rebuilt ${rebuilt} recipes from PostgreSQL in ${ms} ms`);
}

/** Creates the index with its settings; when it is empty but PostgreSQL has recipes, rebuilds it. */
export async function ensureSearchReady(
  client: Meilisearch = getSearchClient(),
  database: Executor = db,
  opts: { cameBackBare?: boolean } = {},
): Promise<void> {
  const { documentCount } = await ensureRecipeIndex(client);
  // An index that a write re-created without our settings means the engine lost everything:
  // whatever few documents it holds now, refill it whole.
  await refillIfEmpty(opts.cameBackBare ? 0 : documentCount, client, database);
}

/** Whether the index exists with our settings (a restarted engine may have had it created bare by a write), and its size. */
async function readIndexStatus(client: Meilisearch): Promise<{ configured: boolean; documentCount: number }> {
  try {
    const index = client.index(RECIPES_INDEX);
    const [settings, stats] = await Promise.all([index.getSettings(), index.getStats()]);
    const filterable = new Set(settings.filterableAttributes ?? []);
    return {
      configured: FILTERABLE_ATTRIBUTES.every((attribute) => filterable.has(attribute)),
      documentCount: stats.numberOfDocuments,
    };
  } catch {
    return { configured: false, documentCount: 0 };
  }
}

/**
 * Every few seconds: when the engine answers, make sure the index is set up (after each outage,
 * or when it has come back bare or empty) and send the outbox. Started once per server process.
 */
export function startSearchSyncLoop(intervalMs = LOOP_INTERVAL_MS): void {
  if (state.loop) return;
  let needsSetup = true;
  let ticking = false;
  let reportedDown = false;
  const tick = async () => {
    if (ticking) return;
    ticking = true;
    try {
      const client = getSearchClient();
      if (!(await isSearchAvailable(client))) {
        if (!reportedDown) console.error('[search] engine not answering; will keep trying');
        reportedDown = true;
        needsSetup = true;
        return;
      }
      reportedDown = false;
      const status = await readIndexStatus(client);
      if (needsSetup || !status.configured) {
        await ensureSearchReady(client, db, { cameBackBare: !status.configured && status.documentCount > 0 });
        needsSetup = false;
      } else {
        await refillIfEmpty(status.documentCount, client, db);
      }
      await processSearchOutbox(client);
    } catch (err) {
      console.error('[search] sync loop:', errorText(err));
    } finally {
      ticking = false;
    }
  };
  state.loop = setInterval(() => void tick(), intervalMs);
  state.loop.unref();
  void tick();
}
