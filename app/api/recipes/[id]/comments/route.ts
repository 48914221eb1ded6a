import { addComment, listComments } from '@/lib/community/comments';
import { newCommentSchema } from '@/lib/community/schemas';
import { route } from '@/lib/http/route';
import { idParam } from '@/lib/recipes/http';

type Params = { id: string };

// GET /api/recipes/[id]/comments – the comments the viewer can see, replies under their comment
export const GET = route<undefined, Params, 'public'>({ access: 'public' }, async ({ viewer, params }) => ({
  comments: await listComments(viewer, idParam(params.id, 'recipe')),
}));

// POST /api/recipes/[id]/comments – comment on a recipe, or reply to a comment
export const POST = route<typeof newCommentSchema, Params, 'user'>(
  { access: 'user', body: newCommentSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => addComment(viewer, idParam(params.id, 'recipe'), body),
);

export const dynamic = 'force-dynamic';
