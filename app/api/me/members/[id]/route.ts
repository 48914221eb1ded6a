import { z } from 'zod';
import { loadMemberStanding } from '@/lib/community/member-standing';
import { route } from '@/lib/http/route';

// GET /api/me/members/[id] – whether the signed-in member follows this member
export const GET = route(
  { access: 'user', params: z.object({ id: z.string().min(1, 'No such member.').max(64, 'No such member.') }) },
  ({ viewer, params }) => loadMemberStanding(viewer, params.id),
);

export const dynamic = 'force-dynamic';
