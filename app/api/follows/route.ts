import { setFollow } from '@/lib/community/follows';
import { followSchema } from '@/lib/community/schemas';
import { route } from '@/lib/http/route';

// POST /api/follows – follow a member or a recipe
export const POST = route({ access: 'user', body: followSchema }, ({ viewer, body }) => setFollow(viewer, body, true));

// DELETE /api/follows – stop following
export const DELETE = route({ access: 'user', body: followSchema }, async ({ viewer, body }) =>
  Response.json(await setFollow(viewer, body, false)),
);
