import { route } from '@/lib/http/route';
import { countUnread } from '@/lib/notifications/list';

// GET /api/notifications/unread – how many notifications the member has not read (the bell)
export const GET = route({ access: 'user' }, async ({ viewer }) => ({ unread: await countUnread(viewer) }));

export const dynamic = 'force-dynamic';
