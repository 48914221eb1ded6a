import { route } from '@/lib/http/route';
import { reviewHeldComment } from '@/lib/moderation/reports';
import { reviewCommentSchema } from '@/lib/moderation/schemas';

type Params = { id: string };

// POST /api/moderation/comments/[id] – a moderator publishes or hides a comment held for review
export const POST = route<typeof reviewCommentSchema, Params, 'moderator'>(
  { access: 'moderator', body: reviewCommentSchema },
  async ({ viewer, params, body }) => Response.json(await reviewHeldComment(viewer, params.id, body)),
);
