'use client';

import { useQuery } from '@tanstack/react-query';
import type { MemberStanding } from '@/lib/community/member-standing';
import { sendJson } from '@/lib/http/client';

export const memberStandingKeys = { byMember: (memberId: string) => ['me', 'members', memberId] as const };

/** Whether the signed-in member follows this member; asked only while `enabled` (someone else is signed in). */
export function useMemberStanding(memberId: string, enabled: boolean) {
  return useQuery({
    queryKey: memberStandingKeys.byMember(memberId),
    enabled,
    queryFn: ({ signal }) =>
      sendJson<MemberStanding>(`/api/me/members/${encodeURIComponent(memberId)}`, 'GET', undefined, {
        signal,
        cache: 'no-store',
      }),
  });
}
