import { route } from '@/lib/http/route';
import { listModerationActions } from '@/lib/moderation/log';
import { actionLogQuerySchema } from '@/lib/moderation/schemas';

// GET /api/moderation/actions – the moderation log, for admins, with filters
export const GET = route({ access: 'admin', query: actionLogQuerySchema }, ({ query }) => listModerationActions(query));

export const dynamic = 'force-dynamic';
