'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { CommentForm } from './comment-form';
import { ReportButton } from './report-button';
import { sendJson } from '@/lib/http/client';

interface Props {
  recipeId: string;
  commentId: string;
  /** The thread a reply joins (the comment itself, or its parent for a reply). */
  threadId: string;
  body: string;
  canReply: boolean;
  canEdit: boolean;
  canDelete: boolean;
  canReport: boolean;
}

export function CommentActions({
  recipeId,
  commentId,
  threadId,
  body,
  canReply,
  canEdit,
  canDelete,
  canReport,
}: Props) {
  const router = useRouter();
  const [mode, setMode] = useState<'idle' | 'reply' | 'edit' | 'confirm-delete'>('idle');
  const remove = useMutation({
    mutationFn: () => sendJson(`/api/comments/${commentId}`, 'DELETE'),
    onSuccess: () => {
      toast.success('Comment deleted.');
      router.refresh();
    },
    onError: (err) => toast.error(err.message),
  });
  return (
    <div className="mt-1">
      <div className="flex flex-wrap items-center gap-3 font-sans text-sm">
        {canReply && (
          <button
            type="button"
            className="text-muted underline"
            onClick={() => setMode(mode === 'reply' ? 'idle' : 'reply')}
          >
            Reply
          </button>
        )}
        {canEdit && (
          <button
            type="button"
            className="text-muted underline"
            onClick={() => setMode(mode === 'edit' ? 'idle' : 'edit')}
          >
            Edit
          </button>
        )}
        {canDelete &&
          (mode === 'confirm-delete' ? (
            <>
              <button
                type="button"
                className="text-danger underline"
                disabled={remove.isPending}
                onClick={() => remove.mutate()}
              >
                Yes, delete it
              </button>
              <button type="button" className="text-muted underline" onClick={() => setMode('idle')}>
                Keep it
              </button>
            </>
          ) : (
            <button type="button" className="text-muted underline" onClick={() => setMode('confirm-delete')}>
              Delete
            </button>
          ))}
        {canReport && <ReportButton targetType="comment" targetId={commentId} compact />}
      </div>
      {mode === 'reply' && <CommentForm recipeId={recipeId} parentId={threadId} onDone={() => setMode('idle')} />}
      {mode === 'edit' && <CommentForm recipeId={recipeId} edit={{ commentId, body }} onDone={() => setMode('idle')} />}
    </div>
  );
}
