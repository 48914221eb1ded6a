import { setSuspended } from '@/lib/auth/accounts';
import { suspendSchema } from '@/lib/auth/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// PUT /api/users/[id]/suspension – a moderator suspends or reinstates a member
export const PUT = route(
  { access: 'moderator', params: idParams('member'), body: suspendSchema },
  async ({ viewer, body, params }) => {
    await setSuspended(viewer, params.id, body.suspended, body.reason ?? '');
    return Response.json({ ok: true, suspended: body.suspended });
  },
);
