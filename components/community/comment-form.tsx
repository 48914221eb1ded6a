'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { onlyFields, showRefusal } from '@/components/form-errors';
import { editCommentSchema, newCommentSchema } from '@/lib/community/schemas';
import { requestJson } from '@/lib/http/client';

type Input = z.input<typeof newCommentSchema>;
type Output = z.output<typeof newCommentSchema>;

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
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, reset, control, formState } = useForm<Input, unknown, Output>({
    // An edit changes the text only (its schema is the body alone); a new comment also says what it answers.
    resolver: edit
      ? (zodResolver(editCommentSchema) as Resolver<Input, unknown, Output>)
      : zodResolver(newCommentSchema),
    defaultValues: { body: edit?.body ?? '', parentId, versionNumber },
  });
  const { errors, isSubmitting } = formState;
  const body = useWatch({ control, name: 'body' });
  const error = errors.body?.message ?? formError;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    const result = edit
      ? await requestJson<{ held: boolean }>(`/api/comments/${edit.commentId}`, 'PATCH', { body: values.body })
      : await requestJson<{ held: boolean }>(`/api/recipes/${recipeId}/comments`, 'POST', values);
    if (!result.ok) {
      setFormError(showRefusal(setError, result, onlyFields('body')));
      return;
    }
    reset({ body: '', parentId, versionNumber });
    toast.success(
      result.data.held
        ? 'Thanks! Your comment waits for a moderator, because it contains a link and your account is new.'
        : edit
          ? 'Comment updated.'
          : 'Comment posted.',
    );
    onDone?.();
    router.refresh();
  });

  return (
    <form className="mt-3" noValidate onSubmit={onSubmit}>
      <label htmlFor={`${id}-body`} className="kf-label">
        {label ?? (edit ? 'Edit your comment' : parentId ? 'Your reply' : 'Add a comment')}
      </label>
      <textarea
        id={`${id}-body`}
        className="kf-input"
        rows={parentId || edit ? 3 : 4}
        maxLength={5000}
        aria-invalid={Boolean(errors.body) || undefined}
        aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
        {...register('body')}
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
        <button type="submit" className="kf-btn" disabled={isSubmitting || !body || body.trim() === ''}>
          {isSubmitting ? 'Sending…' : edit ? 'Save' : parentId ? 'Reply' : 'Post comment'}
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
