import 'server-only';
import { and, desc, eq, getTableColumns, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db, type Transaction } from '@/db';
import { recipeVersions, recipes, users, type Recipe, type RecipeVersion } from '@/db/schema';
import { computeStats, ENGINE_VERSION, recipeDocumentSchema, type RecipeDocument } from '@/lib/brewing';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { notifyRecipeCreated } from '@/lib/notifications/recipe-events';
import { canView, isOwner, listedForkCountSql } from './access';
import type { Visibility } from './schemas';
import { slugFor } from './slug';
import { afterRecipeCommit, recordListingChange, recordRecipeChange } from './events';
import { requireId } from '@/lib/validation/ids';

export interface SavedVersion {
  recipe: { id: string; slug: string };
  version: { id: string; number: number };
}

type VersionRow = typeof recipeVersions.$inferInsert;

/** The row for a new version: the document with its freshly computed numbers. */
function versionRow(
  doc: RecipeDocument,
  fields: {
    recipeId: string;
    number: number;
    parentVersionId: string | null;
    authorId: string;
    message: string;
    coAuthorId?: string | null;
  },
): VersionRow {
  const stats = computeStats(doc);
  return {
    ...fields,
    document: doc,
    stats,
    og: stats.og,
    fg: stats.fg,
    abv: stats.abv,
    ibu: stats.ibu,
    srm: stats.srm,
    styleCode: doc.style?.code ?? null,
    engineVersion: ENGINE_VERSION,
  };
}

/**
 * The recipe row under a fresh slug. Many recipes share a title, so a random tail can clash with
 * one already taken; the clash is skipped without aborting the transaction and another tail drawn.
 */
async function insertRecipeRow(
  tx: Transaction,
  opts: { ownerId: string; doc: RecipeDocument; visibility: Visibility; forkedFromVersionId: string | null },
): Promise<{ id: string; slug: string }> {
  for (let attempt = 0; attempt < 5; attempt++) {
    const [row] = await tx
      .insert(recipes)
      .values({
        slug: slugFor(opts.doc.title),
        ownerId: opts.ownerId,
        title: opts.doc.title,
        visibility: opts.visibility,
        forkedFromVersionId: opts.forkedFromVersionId,
      })
      .onConflictDoNothing({ target: recipes.slug })
      .returning({ id: recipes.id, slug: recipes.slug });
    if (row) return row;
  }
  throw new AppError('conflict', 'recipe', 'Could not find a free address for this recipe. Please try again.');
}

async function insertRecipeWithFirstVersion(
  tx: Transaction,
  opts: {
    ownerId: string;
    doc: RecipeDocument;
    visibility: Visibility;
    message: string;
    forkedFromVersionId: string | null;
  },
): Promise<SavedVersion> {
  const recipe = await insertRecipeRow(tx, opts);
  const [version] = await tx
    .insert(recipeVersions)
    .values(
      versionRow(opts.doc, {
        recipeId: recipe.id,
        number: 1,
        parentVersionId: opts.forkedFromVersionId,
        authorId: opts.ownerId,
        message: opts.message,
      }),
    )
    .returning({ id: recipeVersions.id, number: recipeVersions.number });
  await tx.update(recipes).set({ headVersionId: version.id, headNumber: 1 }).where(eq(recipes.id, recipe.id));
  await recordRecipeChange(tx, recipe.id);
  await notifyRecipeCreated(tx, {
    ...recipe,
    ownerId: opts.ownerId,
    visibility: opts.visibility,
    forkedFromVersionId: opts.forkedFromVersionId,
  });
  return { recipe, version };
}

/** A new recipe with its first version, in one transaction. */
export async function createRecipe(
  viewer: Viewer,
  input: { document: RecipeDocument; visibility: Visibility; message: string },
): Promise<SavedVersion> {
  const saved = await db.transaction((tx) =>
    insertRecipeWithFirstVersion(tx, {
      ownerId: viewer.id,
      doc: input.document,
      visibility: input.visibility,
      message: input.message || 'First version',
      forkedFromVersionId: null,
    }),
  );
  afterRecipeCommit();
  return saved;
}

interface HeadSummary {
  id: string;
  number: number;
  message: string;
  authorName: string;
  createdAt: Date;
  document: RecipeDocument;
}

async function headSummary(tx: Transaction | typeof db, versionId: string): Promise<HeadSummary> {
  const [row] = await tx
    .select({
      id: recipeVersions.id,
      number: recipeVersions.number,
      message: recipeVersions.message,
      authorName: users.name,
      createdAt: recipeVersions.createdAt,
      document: recipeVersions.document,
    })
    .from(recipeVersions)
    .innerJoin(users, eq(users.id, recipeVersions.authorId))
    .where(eq(recipeVersions.id, versionId));
  return { ...row, authorName: row.authorName ?? 'a brewer' };
}

/**
 * Appends a version to a recipe the viewer owns. The save names the version it was based on;
 * if the head has moved since, nothing is written and a 409 carries the newer head.
 * The row lock on the recipe makes concurrent saves take turns.
 */
export async function saveVersion(
  viewer: Viewer,
  recipeId: string,
  input: { document: RecipeDocument; baseVersionId: string; message: string; coAuthorId?: string | null },
): Promise<SavedVersion> {
  const saved = await db.transaction((tx) => saveVersionInTransaction(tx, viewer, recipeId, input));
  afterRecipeCommit();
  return saved;
}

/** saveVersion's work inside a caller's transaction (call afterRecipeCommit() after the commit). */
export async function saveVersionInTransaction(
  tx: Transaction,
  viewer: Viewer,
  recipeId: string,
  input: { document: RecipeDocument; baseVersionId: string; message: string; coAuthorId?: string | null },
): Promise<SavedVersion> {
  const [recipe] = await tx.select().from(recipes).where(eq(recipes.id, recipeId)).for('update');
  if (!recipe || !canView(recipe, viewer)) throw new AppError('not_found', 'recipe');
  if (!isOwner(recipe, viewer))
    throw new AppError(
      'forbidden',
      'recipe',
      'Only the owner can save versions of this recipe. Fork it to make your own.',
    );
  if (recipe.headVersionId !== input.baseVersionId) {
    const head = await headSummary(tx, recipe.headVersionId!);
    throw new AppError(
      'conflict',
      'recipe',
      `Version ${head.number} was saved after the version you started from. Your changes are kept; look at what changed, then save on top of it.`,
      [],
      { head },
    );
  }
  const number = recipe.headNumber + 1;
  const [version] = await tx
    .insert(recipeVersions)
    .values(
      versionRow(input.document, {
        recipeId,
        number,
        parentVersionId: recipe.headVersionId,
        authorId: viewer.id,
        coAuthorId: input.coAuthorId ?? null,
        message: input.message,
      }),
    )
    .returning({ id: recipeVersions.id, number: recipeVersions.number });
  await tx
    .update(recipes)
    .set({ headVersionId: version.id, headNumber: number, title: input.document.title, updatedAt: new Date() })
    .where(eq(recipes.id, recipeId));
  await recordRecipeChange(tx, recipeId);
  return { recipe: { id: recipe.id, slug: recipe.slug }, version };
}

/** Restoring makes a new version holding an older version's document; history is never rewritten. */
export async function restoreVersion(
  viewer: Viewer,
  recipeId: string,
  input: { versionId: string; baseVersionId: string; message?: string },
): Promise<SavedVersion> {
  const [old] = await db
    .select({ number: recipeVersions.number, document: recipeVersions.document })
    .from(recipeVersions)
    .where(and(eq(recipeVersions.id, input.versionId), eq(recipeVersions.recipeId, recipeId)));
  if (!old) throw new AppError('not_found', 'version');
  // Documents written by an older engine are re-checked (and given today's defaults) on the way in.
  const document = recipeDocumentSchema.parse(old.document);
  return saveVersion(viewer, recipeId, {
    document,
    baseVersionId: input.baseVersionId,
    message: input.message || `Restored version ${old.number}`,
  });
}

export interface VersionView {
  recipe: Recipe & { ownerName: string; ownerHandle: string };
  version: RecipeVersion & { authorName: string; authorHandle: string };
}

/**
 * Whether anything at all hangs off the recipe yet (before anyone's visibility rules are applied):
 * the recipe page reads these with the version and skips the lists that would come back empty.
 */
export interface RecipeActivity {
  brewDays: boolean;
  proposals: boolean;
  comments: boolean;
}

const owners = alias(users, 'owners');

type VersionKey = { versionId: string } | { recipeId: string; number: number } | { slug: string; number?: number };

function versionWhere(key: VersionKey) {
  if ('versionId' in key) return eq(recipeVersions.id, key.versionId);
  if ('recipeId' in key) return and(eq(recipeVersions.recipeId, key.recipeId), eq(recipeVersions.number, key.number));
  return and(eq(recipes.slug, key.slug), eq(recipeVersions.number, key.number ?? recipes.headNumber));
}

const activityColumns = {
  brewDays: sql<boolean>`exists (select 1 from brew_days where brew_days.recipe_id = ${recipes.id})`,
  proposals: sql<boolean>`exists (select 1 from proposals where proposals.source_recipe_id = ${recipes.id} or proposals.fork_recipe_id = ${recipes.id})`,
  comments: sql<boolean>`exists (select 1 from comments where comments.recipe_id = ${recipes.id})`,
};

/** The member a version credits beside its author (the proposer whose change it accepted), by name. */
const coAuthorNameSql = sql<
  string | null
>`(select coalesce(name, handle) from users c where c.id = ${recipeVersions.coAuthorId})`;

/** What the recipe page reads with its version: the activity flags and the co-author's name. */
const pageColumns = { ...activityColumns, coAuthorName: coAuthorNameSql };

/** One version with its recipe, author and owner, in a single query; 404 unless the viewer may see it. */
async function loadVersionView(viewer: Pick<Viewer, 'id' | 'role'> | null, key: VersionKey): Promise<VersionView> {
  return (await loadVersionRow(viewer, key, false)).view;
}

/** loadVersionView's query, with the recipe page's columns selected when asked for (all false and null otherwise). */
async function loadVersionRow(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  key: VersionKey,
  withActivity: boolean,
): Promise<{ view: VersionView; activity: RecipeActivity; coAuthorName: string | null }> {
  const [row] = await db
    .select({
      version: recipeVersions,
      recipe: { ...getTableColumns(recipes), forkCount: listedForkCountSql(viewer) },
      authorName: users.name,
      authorHandle: users.handle,
      ownerName: owners.name,
      ownerHandle: owners.handle,
      ...(withActivity ? pageColumns : {}),
    })
    .from(recipeVersions)
    .innerJoin(recipes, eq(recipes.id, recipeVersions.recipeId))
    .innerJoin(users, eq(users.id, recipeVersions.authorId))
    .innerJoin(owners, eq(owners.id, recipes.ownerId))
    .where(versionWhere(key))
    .limit(1);
  if (!row || !canView(row.recipe, viewer)) throw new AppError('not_found', 'version');
  const view: VersionView = {
    recipe: { ...row.recipe, ownerName: row.ownerName ?? row.ownerHandle, ownerHandle: row.ownerHandle },
    version: {
      ...row.version,
      authorName: row.authorName ?? row.authorHandle,
      authorHandle: row.authorHandle,
    },
  };
  const flags = row as Partial<RecipeActivity> & { coAuthorName?: string | null };
  return {
    view,
    coAuthorName: flags.coAuthorName ?? null,
    activity: {
      brewDays: Boolean(flags.brewDays),
      proposals: Boolean(flags.proposals),
      comments: Boolean(flags.comments),
    },
  };
}

/** One version and its recipe, if the viewer may see it (404 otherwise, never a hint that it exists). */
export function getVersionById(viewer: Pick<Viewer, 'id' | 'role'> | null, versionId: string): Promise<VersionView> {
  return loadVersionView(viewer, { versionId });
}

export function getVersionByNumber(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  recipeId: string,
  number: number,
): Promise<VersionView> {
  return loadVersionView(viewer, { recipeId, number });
}

/**
 * A recipe's version by the recipe's slug (the head when no number is given), in one query, plus
 * whether the recipe has any brew days, proposals or comments and the version's co-author.
 */
export async function getVersionWithActivityBySlug(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  slug: string,
  number?: number,
): Promise<VersionView & { activity: RecipeActivity; coAuthorName: string | null }> {
  const { view, activity, coAuthorName } = await loadVersionRow(viewer, { slug, number }, true);
  return { ...view, activity, coAuthorName };
}

export interface ForkSource {
  title: string;
  slug: string | null;
  number: number | null;
  ownerName: string | null;
}

/** Where a fork came from, in one light query; a source the viewer may not see is named only vaguely. */
export async function getForkSource(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  versionId: string,
): Promise<ForkSource> {
  const [row] = await db
    .select({
      recipe: {
        ownerId: recipes.ownerId,
        visibility: recipes.visibility,
        hiddenAt: recipes.hiddenAt,
        slug: recipes.slug,
        title: recipes.title,
      },
      number: recipeVersions.number,
      ownerName: users.name,
      ownerHandle: users.handle,
    })
    .from(recipeVersions)
    .innerJoin(recipes, eq(recipes.id, recipeVersions.recipeId))
    .innerJoin(users, eq(users.id, recipes.ownerId))
    .where(eq(recipeVersions.id, versionId));
  if (!row || !canView(row.recipe, viewer))
    return { title: 'a recipe you cannot see', slug: null, number: null, ownerName: null };
  return {
    title: row.recipe.title,
    slug: row.recipe.slug,
    number: row.number,
    ownerName: row.ownerName ?? row.ownerHandle,
  };
}

/** A recipe by slug or id, if the viewer may see it. */
export async function getRecipe(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  key: { slug?: string; id?: string },
): Promise<Recipe> {
  const where = key.id ? eq(recipes.id, key.id) : eq(recipes.slug, key.slug ?? '');
  if (key.id) requireId(key.id, 'recipe');
  const [recipe] = await db
    .select({ ...getTableColumns(recipes), forkCount: listedForkCountSql(viewer) })
    .from(recipes)
    .where(where);
  if (!recipe || !canView(recipe, viewer)) throw new AppError('not_found', 'recipe');
  return recipe;
}

export interface HistoryEntry {
  id: string;
  number: number;
  message: string;
  authorName: string;
  authorHandle: string;
  coAuthorName: string | null;
  createdAt: Date;
  og: number;
  fg: number;
  abv: number;
  ibu: number;
  srm: number;
}

/** Every version of a recipe, newest first, with the numbers the timeline shows. */
export async function getVersionsByRecipeId({ recipeId }: { recipeId: string }): Promise<HistoryEntry[]> {
  const rows = await db
    .select({
      id: recipeVersions.id,
      number: recipeVersions.number,
      message: recipeVersions.message,
      authorName: users.name,
      authorHandle: users.handle,
      coAuthorName: coAuthorNameSql,
      createdAt: recipeVersions.createdAt,
      og: recipeVersions.og,
      fg: recipeVersions.fg,
      abv: recipeVersions.abv,
      ibu: recipeVersions.ibu,
      srm: recipeVersions.srm,
    })
    .from(recipeVersions)
    .innerJoin(users, eq(users.id, recipeVersions.authorId))
    .where(eq(recipeVersions.recipeId, recipeId))
    .orderBy(desc(recipeVersions.number));
  return rows.map((r) => ({ ...r, authorName: r.authorName ?? r.authorHandle }));
}

/** Forks a version the viewer can see into a new recipe of theirs, remembering the exact source version. */
export async function forkRecipe(
  viewer: Viewer,
  versionId: string,
  input: { title: string; visibility: Visibility; fitted?: RecipeDocument },
): Promise<SavedVersion> {
  const source = await getVersionById(viewer, versionId);
  const document = recipeDocumentSchema.parse({ ...source.version.document, title: input.title });
  const saved = await db.transaction(async (tx) => {
    const created = await insertRecipeWithFirstVersion(tx, {
      ownerId: viewer.id,
      doc: document,
      visibility: input.visibility,
      message: `Forked from ${source.recipe.title} (version ${source.version.number})`,
      forkedFromVersionId: versionId,
    });
    await tx
      .update(recipes)
      .set({ forkCount: sql`${recipes.forkCount} + 1` })
      .where(eq(recipes.id, source.recipe.id));
    await recordRecipeChange(tx, source.recipe.id);
    if (!input.fitted) return created;
    // The fork first holds the version as it was, so its history shows what fitting changed.
    return saveVersionInTransaction(tx, viewer, created.recipe.id, {
      document: { ...input.fitted, title: input.title },
      baseVersionId: created.version.id,
      message: FITTED_MESSAGE,
    });
  });
  afterRecipeCommit();
  return saved;
}

const FITTED_MESSAGE = 'Fitted to my brewhouse';

/** The owner changes who can see a recipe. */
export async function setVisibility(viewer: Viewer, recipeId: string, visibility: Visibility): Promise<void> {
  const recipe = await getRecipe(viewer, { id: recipeId });
  if (!isOwner(recipe, viewer))
    throw new AppError('forbidden', 'recipe', 'Only the owner can change who sees this recipe.');
  await db.transaction(async (tx) => {
    await tx.update(recipes).set({ visibility, updatedAt: new Date() }).where(eq(recipes.id, recipeId));
    await recordListingChange(tx, recipeId);
  });
  afterRecipeCommit();
}
