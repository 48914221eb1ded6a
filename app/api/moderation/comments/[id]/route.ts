import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { reviewHeldComment } from '@/lib/moderation/reports';
import { reviewCommentSchema } from '@/lib/moderation/schemas';

// POST /api/moderation/comments/[id] – a moderator publishes or hides a comment held for review
export const POST = route(
  { access: 'moderator', params: idParams('comment'), body: reviewCommentSchema },
  async ({ viewer, params, body }) => Response.json(await reviewHeldComment(viewer, params.id, body)),
);
