import type { Recipe } from '@/db/schema';
import { hasRole } from '@/lib/auth/roles';
import type { Viewer } from '@/lib/auth/session';

type Gate = Pick<Recipe, 'ownerId' | 'visibility' | 'hiddenAt'>;
type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;

export function isOwner(recipe: Pick<Recipe, 'ownerId'>, viewer: MaybeViewer): boolean {
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
