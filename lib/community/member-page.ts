import 'server-only';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { getViewer } from '@/lib/auth/session';
import { getBrewDaysByBrewerId } from '@/lib/brew-days/brew-days';
import { listRecipes } from '@/lib/recipes/listing';
import { getMemberByHandle, getMemberCommunity } from './profile';

/** The member a page is about (404 for an unknown or suspended one); cached per request for the page and its metadata. */
export const loadMember = cache(async (handle: string) => {
  const member = await getMemberByHandle({ handle });
  if (!member) notFound();
  return member;
});

/**
 * Everything a member page shows beside the member, read at once: recipes, community and brew days.
 * The reader's own follow is a client island (components/community/member-community-bar.tsx).
 */
export async function loadMemberPage(handle: string) {
  const [member, viewer] = await Promise.all([loadMember(handle), getViewer()]);
  const [{ cards }, community, brewDays] = await Promise.all([
    listRecipes(viewer, { ownerHandle: member.handle }),
    getMemberCommunity(member.id, viewer),
    getBrewDaysByBrewerId({ brewerId: member.id, viewer }),
  ]);
  return { member, viewer, cards, community, brewDays };
}
