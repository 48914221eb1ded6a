import { loadMemberStanding } from '@/lib/community/member-standing';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// GET /api/me/members/[id] – whether the signed-in member follows this member
export const GET = route({ access: 'user', params: idParams('member') }, ({ viewer, params }) =>
  loadMemberStanding(viewer, params.id),
);

export const dynamic = 'force-dynamic';
