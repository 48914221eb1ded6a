import 'server-only';
import { notFound } from 'next/navigation';
import { getViewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { cache } from 'react';
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
