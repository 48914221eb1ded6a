import 'server-only';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { getViewer } from '@/lib/auth/session';
import { getBrewDaysByBrewerId } from '@/lib/brew-days/brew-days';
import { listRecipes } from '@/lib/recipes/listing';
import { isFollowing } from './follows';
import { getMemberByHandle, getMemberCommunity } from './profile';

/** The member a page is about (404 for an unknown or suspended one); cached per request for the page and its metadata. */
export const loadMember = cache(async (handle: string) => {
  const member = await getMemberByHandle({ handle });
  if (!member) notFound();
  return member;
});

/** Everything a member page shows beside the member, read at once: recipes, community, follow and brew days. */
export async function loadMemberPage(handle: string) {
  const [member, viewer] = await Promise.all([loadMember(handle), getViewer()]);
  const [{ cards }, community, following, brewDays] = await Promise.all([
    listRecipes(viewer, { ownerHandle: member.handle }),
    getMemberCommunity(member.id, viewer),
    isFollowing(viewer, 'member', member.id),
    getBrewDaysByBrewerId({ brewerId: member.id, viewer }),
  ]);
  return { member, viewer, cards, community, following, brewDays };
}
