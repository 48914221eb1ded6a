import { route } from '@/lib/http/route';
import { resolveReport } from '@/lib/moderation/reports';
import { resolveReportSchema } from '@/lib/moderation/schemas';

type Params = { id: string };

// POST /api/moderation/reports/[id] – a moderator hides the content, dismisses the report or suspends the member
export const POST = route<typeof resolveReportSchema, Params, 'moderator'>(
  { access: 'moderator', body: resolveReportSchema },
  async ({ viewer, params, body }) => Response.json(await resolveReport(viewer, params.id, body)),
);
