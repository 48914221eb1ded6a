import { route } from '@/lib/http/route';
import { restoreHidden } from '@/lib/moderation/reports';
import { restoreSchema } from '@/lib/moderation/schemas';

// POST /api/moderation/restore – a moderator makes hidden content visible again
export const POST = route({ access: 'moderator', body: restoreSchema }, async ({ viewer, body }) => {
  await restoreHidden(viewer, body);
  return Response.json({ ok: true });
});
