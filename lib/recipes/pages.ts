import 'server-only';
import { notFound } from 'next/navigation';
import { getViewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { getRecipe, getVersionByNumber, type VersionView } from './versions';

/** For pages: a missing or hidden-from-you row becomes the plain 404 page. */
export async function orNotFound<T>(load: () => Promise<T>): Promise<T> {
  try {
    return await load();
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound();
    throw err;
  }
}

/** The version a recipe page shows (the head when no number is given) and who is looking. */
export async function loadRecipePage(slug: string, number?: number) {
  const viewer = await getViewer();
  const view: VersionView = await orNotFound(async () => {
    const recipe = await getRecipe(viewer, { slug });
    return getVersionByNumber(viewer, recipe.id, number ?? recipe.headNumber);
  });
  return { viewer, ...view };
}
