import { deleteComment, editComment } from '@/lib/community/comments';
import { editCommentSchema } from '@/lib/community/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// PATCH /api/comments/[id] – its author edits a comment (within the edit window)
export const PATCH = route(
  { access: 'user', params: idParams('comment'), body: editCommentSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => editComment(viewer, params.id, body.body),
);

// DELETE /api/comments/[id] – its author or a moderator removes a comment
export const DELETE = route({ access: 'user', params: idParams('comment') }, async ({ viewer, params }) => {
  await deleteComment(viewer, params.id);
  return { ok: true };
});
