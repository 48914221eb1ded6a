import { changeRole } from '@/lib/auth/accounts';
import { roleChangeSchema } from '@/lib/auth/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// PUT /api/admin/users/[id]/role – an admin changes a member's role
export const PUT = route(
  { access: 'admin', params: idParams('member'), body: roleChangeSchema },
  async ({ viewer, body, params }) => ({ user: await changeRole(viewer, params.id, body.role) }),
);
