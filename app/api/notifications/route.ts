import { z } from 'zod';
import { route } from '@/lib/http/route';
import { listNotifications } from '@/lib/notifications/list';

const querySchema = z.object({
  page: z.coerce.number({ error: 'The page must be a number.' }).int().min(1).max(1000).default(1),
});

// GET /api/notifications – the signed-in member's notifications, newest first
export const GET = route({ access: 'user', query: querySchema }, ({ viewer, query }) =>
  listNotifications(viewer, { page: query.page }),
);

export const dynamic = 'force-dynamic';
