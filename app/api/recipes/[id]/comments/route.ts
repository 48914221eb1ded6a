import { addComment, listComments } from '@/lib/community/comments';
import { newCommentSchema } from '@/lib/community/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// GET /api/recipes/[id]/comments – the comments the viewer can see, replies under their comment
export const GET = route({ access: 'public', params: idParams('recipe') }, async ({ viewer, params }) => ({
  comments: await listComments(viewer, params.id),
}));

// POST /api/recipes/[id]/comments – comment on a recipe, or reply to a comment
export const POST = route(
  { access: 'user', params: idParams('recipe'), body: newCommentSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => addComment(viewer, params.id, body),
);

export const dynamic = 'force-dynamic';
