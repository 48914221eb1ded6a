import 'server-only';
import { and, eq, isNull } from 'drizzle-orm';
import { db } from '@/db';
import { users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { isFollowing } from './follows';

export interface MemberStanding {
  following: boolean;
}

/**
 * Whether the signed-in member follows another member (404 for an unknown or suspended one, as
 * their page is): what the member page's follow button shows once it knows who is reading.
 */
export async function loadMemberStanding(viewer: Viewer, memberId: string): Promise<MemberStanding> {
  const [[member], following] = await Promise.all([
    db
      .select({ id: users.id })
      .from(users)
      .where(and(eq(users.id, memberId), isNull(users.suspendedAt))),
    isFollowing(viewer, 'member', memberId),
  ]);
  if (!member) throw new AppError('not_found', 'member');
  return { following };
}
