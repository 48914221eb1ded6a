'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

interface Props {
  recipeId: string;
  versionNumber?: number;
  parentId?: string;
  /** For an edit: the comment being changed and its text. */
  edit?: { commentId: string; body: string };
  onDone?: () => void;
  label?: string;
}

/** Writes a new comment, a reply, or an edit; the server's message lands under the field. */
export function CommentForm({ recipeId, versionNumber, parentId, edit, onDone, label }: Props) {
  const id = useId();
  const router = useRouter();
  const [body, setBody] = useState(edit?.body ?? '');
  const [error, setError] = useState<string>();
  const send = useMutation({
    mutationFn: () =>
      edit
        ? sendJson<{ held: boolean }>(`/api/comments/${edit.commentId}`, 'PATCH', { body })
        : sendJson<{ held: boolean }>(`/api/recipes/${recipeId}/comments`, 'POST', { body, parentId, versionNumber }),
    onSuccess: (res) => {
      setBody('');
      toast.success(
        res.held
          ? 'Thanks! Your comment waits for a moderator, because it contains a link and your account is new.'
          : edit
            ? 'Comment updated.'
            : 'Comment posted.',
      );
      onDone?.();
      router.refresh();
    },
    onError: (err) => setError(err.message),
  });
  return (
    <form
      className="mt-3"
      onSubmit={(e) => {
        e.preventDefault();
        setError(undefined);
        send.mutate();
      }}
    >
      <label htmlFor={`${id}-body`} className="kf-label">
        {label ?? (edit ? 'Edit your comment' : parentId ? 'Your reply' : 'Add a comment')}
      </label>
      <textarea
        id={`${id}-body`}
        className="kf-input"
        rows={parentId || edit ? 3 : 4}
        maxLength={5000}
        value={body}
        onChange={(e) => setBody(e.target.value)}
        aria-invalid={Boolean(error)}
        aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
      />
      <p id={`${id}-hint`} className="mt-1 font-sans text-xs text-muted">
        Markdown works: **bold**, _italic_, lists and links.
      </p>
      {error && (
        <p id={`${id}-error`} role="alert" className="kf-field-error">
          {error}
        </p>
      )}
      <div className="mt-2 flex gap-2 font-sans text-sm">
        <button type="submit" className="kf-btn" disabled={send.isPending || body.trim() === ''}>
          {send.isPending ? 'Sending…' : edit ? 'Save' : parentId ? 'Reply' : 'Post comment'}
        </button>
        {onDone && (
          <button type="button" className="kf-btn-quiet" onClick={onDone}>
            Cancel
          </button>
        )}
      </div>
    </form>
  );
}
