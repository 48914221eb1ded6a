import 'server-only';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import type { Recipe } from '@/db/schema';
import { getViewer, type Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { getProposalTargets, getProposalsByRecipeId } from '@/lib/proposals/proposals';
import { isOwner } from './access';
import { getVersionWithActivityBySlug } from './versions';

/** For pages: a missing or hidden-from-you row becomes the plain 404 page. */
export async function orNotFound<T>(load: () => Promise<T>): Promise<T> {
  try {
    return await load();
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound();
    throw err;
  }
}

/** A version number from a page address (`/v/3`); anything but a whole number from 1 is the 404 page. */
export function versionNumberFromPath(text: string): number {
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1) notFound();
  return n;
}

/**
 * The version a recipe page shows (the head when no number is given) and who is looking.
 * Cached per request, so the page and its metadata share one query.
 */
export const loadRecipePage = cache(async (slug: string, number?: number) => {
  const viewer = await getViewer();
  const view = await orNotFound(() => getVersionWithActivityBySlug(viewer, slug, number));
  return { viewer, ...view };
});

/**
 * The recipe page's proposals section: the proposals on this recipe the viewer may see (`any` says
 * whether it has any at all, so an empty list is not queried) and, for the owner of a fork, the
 * recipes upstream it may propose to.
 */
export async function loadRecipeProposals(viewer: Viewer | null, recipe: Recipe, any: boolean) {
  const owner = isOwner(recipe, viewer);
  const [items, targets] = await Promise.all([
    any ? getProposalsByRecipeId({ viewer, recipeId: recipe.id }) : Promise.resolve([]),
    owner && recipe.forkedFromVersionId && !recipe.hiddenAt
      ? getProposalTargets(viewer, recipe.id)
      : Promise.resolve([]),
  ]);
  return { items, targets };
}

export type RecipeProposalsSection = Awaited<ReturnType<typeof loadRecipeProposals>>;
