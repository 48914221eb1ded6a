'use client';

import { useQueryClient } from '@tanstack/react-query';
import Link from 'next/link';
import { memberStandingKeys, useMemberStanding } from '@/hooks/use-member-standing';
import { useMe } from '@/hooks/use-me';
import type { MemberStanding } from '@/lib/community/member-standing';
import { FollowButton } from './follow-button';
import { ReportButton } from './report-button';

/**
 * Follow and report on a member page, or the member's own link to their settings, as a client
 * island: the server's HTML is the same for every reader, and a signed-in reader's own follow fills
 * in from /api/me/members/[id] in the same place.
 */
export function MemberCommunityBar({ member }: { member: { id: string; name: string | null; handle: string } }) {
  const queryClient = useQueryClient();
  const { data: viewer } = useMe();
  const own = viewer?.handle === member.handle;
  const standing = useMemberStanding(member.id, Boolean(viewer) && !own);
  if (!viewer) return null;
  if (own) {
    return (
      <Link href="/settings" className="kf-btn-quiet">
        Edit profile and settings
      </Link>
    );
  }
  const state = standing.data;
  return (
    <>
      <FollowButton
        key={state ? 'known' : 'loading'}
        type="member"
        id={member.id}
        following={state?.following ?? false}
        disabled={!state}
        onChange={(following) =>
          queryClient.setQueryData<MemberStanding>(memberStandingKeys.byMember(member.id), { following })
        }
        label={member.name ?? member.handle}
      />
      <ReportButton targetType="member" targetId={member.id} />
    </>
  );
}
