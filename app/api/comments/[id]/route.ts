import { deleteComment, editComment } from '@/lib/community/comments';
import { editCommentSchema } from '@/lib/community/schemas';
import { route } from '@/lib/http/route';

type Params = { id: string };

// PATCH /api/comments/[id] – its author edits a comment (within the edit window)
export const PATCH = route<typeof editCommentSchema, Params, 'user'>(
  { access: 'user', body: editCommentSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => editComment(viewer, params.id, body.body),
);

// DELETE /api/comments/[id] – its author or a moderator removes a comment
export const DELETE = route<undefined, Params, 'user'>({ access: 'user' }, async ({ viewer, params }) => {
  await deleteComment(viewer, params.id);
  return { ok: true };
});
