import { format } from 'date-fns';
import Link from 'next/link';
import { Markdown } from '@/components/markdown';
import { ViewerSwitch } from '@/components/viewer-gate';
import { COMMENT_EDIT_WINDOW_MIN, type CommentView } from '@/lib/community/comments';
import { CommentActions } from './comment-actions';
import { CommentForm } from './comment-form';

function countShown(list: CommentView[]): number {
  return list.reduce((n, c) => n + (c.body ? 1 : 0) + countShown(c.replies), 0);
}

function CommentBlock({
  comment,
  recipeId,
  threadId,
  open,
}: {
  comment: CommentView;
  recipeId: string;
  threadId: string;
  open: boolean;
}) {
  if (!comment.authorHandle) {
    return (
      <p className="font-sans text-sm italic text-muted">
        {comment.state === 'deleted' ? 'This comment was deleted.' : 'Moderators hid this comment.'}
      </p>
    );
  }
  return (
    <>
      <p className="font-sans text-sm text-muted">
        <Link href={`/members/${comment.authorHandle}`} className="font-semibold text-ink">
          {comment.authorName}
        </Link>{' '}
        · <time dateTime={comment.createdAt.toISOString()}>{format(comment.createdAt, 'd MMM yyyy, HH:mm')}</time>
        {comment.versionNumber && <> · on version {comment.versionNumber}</>}
        {comment.editedAt && <> · edited</>}
      </p>
      {comment.state === 'held' && (
        <p
          role="status"
          className="mt-1 rounded border border-caution/40 bg-caution/5 px-2 py-1 font-sans text-xs text-caution"
        >
          Waiting for a moderator: only you and the moderators can see it for now.
        </p>
      )}
      {comment.state === 'hidden' && (
        <p
          role="status"
          className="mt-1 rounded border border-danger/40 bg-danger/5 px-2 py-1 font-sans text-xs text-danger"
        >
          Moderators hid this comment{comment.hiddenReason ? `: ${comment.hiddenReason}` : '.'} Only you and the
          moderators can see it.
        </p>
      )}
      <Markdown source={comment.body} className="mt-1" />
      <CommentActions
        recipeId={recipeId}
        commentId={comment.id}
        threadId={threadId}
        body={comment.body}
        authorHandle={comment.authorHandle}
        state={comment.state === 'deleted' ? 'hidden' : comment.state}
        editableUntil={new Date(comment.createdAt.getTime() + COMMENT_EDIT_WINDOW_MIN * 60_000).toISOString()}
        open={open}
      />
    </>
  );
}

/** The comments under a recipe, with replies one level deep and the form to add one. */
export function RecipeComments({
  recipe,
  versionNumber,
  comments,
}: {
  recipe: { id: string; slug: string; hiddenAt: Date | null };
  versionNumber: number;
  comments: CommentView[];
}) {
  const open = !recipe.hiddenAt;
  return (
    <section aria-labelledby="comments-heading" className="mt-12 max-w-3xl">
      <h2 id="comments-heading" className="text-2xl font-semibold">
        Comments ({countShown(comments)})
      </h2>
      {comments.length === 0 && (
        <p className="mt-2 text-muted">No comments yet. Brewed it, or have a question? Say so here.</p>
      )}
      <ol className="mt-4 space-y-6">
        {comments.map((c) => (
          <li key={c.id} id={`comment-${c.id}`} className="border-l-2 border-line pl-4">
            <CommentBlock comment={c} recipeId={recipe.id} threadId={c.id} open={open} />
            {c.replies.length > 0 && (
              <ol className="mt-4 space-y-4 pl-4" aria-label="Replies">
                {c.replies.map((r) => (
                  <li key={r.id} id={`comment-${r.id}`} className="border-l-2 border-line/60 pl-4">
                    <CommentBlock comment={r} recipeId={recipe.id} threadId={c.id} open={open} />
                  </li>
                ))}
              </ol>
            )}
          </li>
        ))}
      </ol>
      <ViewerSwitch
        className="mt-6"
        signedIn={
          open ? (
            <div className="kf-card">
              <CommentForm recipeId={recipe.id} versionNumber={versionNumber} />
            </div>
          ) : (
            <p className="font-sans text-sm text-muted">
              Comments are closed while moderators have this recipe hidden.
            </p>
          )
        }
        signedOut={
          <p className="kf-card font-sans text-sm">
            <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/recipes/${recipe.slug}`)}`}>Sign in</Link> to join
            the conversation.
          </p>
        }
      />
    </section>
  );
}
