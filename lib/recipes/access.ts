import { and, eq, isNull, or, sql, type SQL } from 'drizzle-orm';
import { alias, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { recipes, recipeVersions, type Recipe } from '@/db/schema';
import { hasRole } from '@/lib/auth/roles';
import type { Viewer } from '@/lib/auth/session';

type Gate = Pick<Recipe, 'ownerId' | 'visibility' | 'hiddenAt'>;
type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;

export function isOwner(recipe: Pick<Recipe, 'ownerId'>, viewer: Pick<Viewer, 'id'> | null): boolean {
  return Boolean(viewer && viewer.id === recipe.ownerId);
}

/**
 * Who may see a recipe: public and unlisted (by link) ones anyone; private ones only the owner.
 * Hidden ones only the owner (with the reason) and moderators.
 */
export function canView(recipe: Gate, viewer: MaybeViewer): boolean {
  if (isOwner(recipe, viewer)) return true;
  if (recipe.hiddenAt && !(viewer && hasRole(viewer, 'moderator'))) return false;
  return recipe.visibility !== 'private';
}

/** Listed in browse pages and lineage pictures for others: public and not hidden. */
export function isListed(recipe: Gate): boolean {
  return recipe.visibility === 'public' && !recipe.hiddenAt;
}

/** Listed for this viewer: their own recipes, and everyone's public unhidden ones. */
export function isListedFor(recipe: Gate, viewer: Pick<Viewer, 'id'> | null): boolean {
  return isOwner(recipe, viewer) || isListed(recipe);
}

/** The recipes table or any alias of it. */
type RecipeColumns = { ownerId: AnyPgColumn; visibility: AnyPgColumn; hiddenAt: AnyPgColumn };

/**
 * The SQL twin of isListedFor (isListed with no viewer), for any query over `table` (recipes or
 * an alias of it), so lists, member pages, the feed and fork counts share the one rule above.
 * tests/recipes/visibility-rule.test.ts holds the two to the same answer for every case.
 */
export function listedRecipeSql(viewer: Pick<Viewer, 'id'> | null, table: RecipeColumns = recipes): SQL {
  const listed = and(eq(table.visibility, 'public'), isNull(table.hiddenAt))!;
  return viewer ? or(eq(table.ownerId, viewer.id), listed)! : listed;
}

const forks = alias(recipes, 'fork');

/**
 * How many forks of `source` this viewer would find listed (public and unhidden ones, and their
 * own): a private or hidden fork is nobody else's business, not even as a number. With no viewer
 * this is the public count the search index shows. For queries over the recipes table itself
 * (qualified by name: a one-table select leaves its own columns unqualified).
 */
export function listedForkCountSql(viewer: Pick<Viewer, 'id'> | null): SQL<number> {
  return sql<number>`(select count(*)::int from ${recipes} as fork
    join ${recipeVersions} as fv on fv.id = fork.forked_from_version_id
    where fv.recipe_id = "recipes"."id" and ${listedRecipeSql(viewer, forks)})`;
}
