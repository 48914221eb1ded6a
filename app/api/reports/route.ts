import { route } from '@/lib/http/route';
import { createReport } from '@/lib/moderation/reports';
import { reportSchema } from '@/lib/moderation/schemas';

// POST /api/reports – report a recipe, version, comment, photo or member to the moderators
export const POST = route({ access: 'user', body: reportSchema, maxBodyBytes: 16 * 1024 }, ({ viewer, body }) =>
  createReport(viewer, body),
);
