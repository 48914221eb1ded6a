import { setSuspended } from '@/lib/auth/accounts';
import { suspendSchema } from '@/lib/auth/schemas';
import { route } from '@/lib/http/route';

// PUT /api/users/[id]/suspension – a moderator suspends or reinstates a member
export const PUT = route<typeof suspendSchema, { id: string }, 'moderator'>(
  { access: 'moderator', body: suspendSchema },
  async ({ viewer, body, params }) => {
    await setSuspended(viewer, params.id, body.suspended, body.reason ?? '');
    return Response.json({ ok: true, suspended: body.suspended });
  },
);
