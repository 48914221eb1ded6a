import { z } from 'zod';
import { route } from '@/lib/http/route';
import { markRead } from '@/lib/notifications/list';
import { idOf } from '@/lib/validation/ids';

const bodySchema = z.object({
  ids: z
    .array(idOf('Each id must be a notification id.'), { error: 'Give a list of notification ids.' })
    .max(200, 'Mark at most 200 at once.')
    .optional(),
});

// POST /api/notifications/read – mark some (or, without ids, all) notifications read
export const POST = route({ access: 'user', body: bodySchema }, async ({ viewer, body }) =>
  Response.json({ marked: await markRead(viewer, body.ids) }),
);
