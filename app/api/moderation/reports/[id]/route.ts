import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { resolveReport } from '@/lib/moderation/reports';
import { resolveReportSchema } from '@/lib/moderation/schemas';

// POST /api/moderation/reports/[id] – a moderator hides the content, dismisses the report or suspends the member
export const POST = route(
  { access: 'moderator', params: idParams('report'), body: resolveReportSchema },
  async ({ viewer, params, body }) => Response.json(await resolveReport(viewer, params.id, body)),
);
