import { route } from '@/lib/http/route';
import { listHeldComments, listOpenReports } from '@/lib/moderation/reports';

// GET /api/moderation/queue – open reports grouped by target, and comments held for review
export const GET = route({ access: 'moderator' }, async () => ({
  reports: await listOpenReports(),
  heldComments: await listHeldComments(),
}));

export const dynamic = 'force-dynamic';
