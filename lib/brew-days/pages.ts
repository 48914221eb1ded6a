import 'server-only';
import { cache } from 'react';
import { getViewer } from '@/lib/auth/session';
import { orNotFound } from '@/lib/recipes/pages';
import { getBrewDayById } from './brew-days';

/** A brew day page's data and who is looking; cached per request, so the page and its metadata share one load. */
export const loadBrewDayPage = cache(async (id: string) => {
  const viewer = await getViewer();
  const view = await orNotFound(() => getBrewDayById(viewer, id));
  return { viewer, view };
});
