'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { CommentForm } from './comment-form';
import { ReportButton } from './report-button';
import { useMe } from '@/hooks/use-me';
import { hasRole } from '@/lib/auth/roles';
import { sendJson } from '@/lib/http/client';

interface Props {
  recipeId: string;
  commentId: string;
  /** The thread a reply joins (the comment itself, or its parent for a reply). */
  threadId: string;
  body: string;
  authorHandle: string;
  state: 'published' | 'held' | 'hidden';
  /** When the author's edit window closes (ISO time). */
  editableUntil: string;
  /** Whether the recipe takes comments (moderators have not hidden it). */
  open: boolean;
}

/**
 * Reply, edit, delete and report under a comment, as a client island: the recipe page's HTML is
 * shared by every reader, so what this reader may do is worked out here from /api/me (the server
 * checks each action again). The row keeps its height while that answer is on its way.
 */
export function CommentActions({
  recipeId,
  commentId,
  threadId,
  body,
  authorHandle,
  state,
  editableUntil,
  open,
}: Props) {
  const { data: viewer } = useMe();
  const router = useRouter();
  const [mode, setMode] = useState<'idle' | 'reply' | 'edit' | 'confirm-delete'>('idle');
  // The edit window as of when the page was opened; the server refuses a late edit with its own message.
  const [openedAt] = useState(() => Date.now());
  const remove = useMutation({
    mutationFn: () => sendJson(`/api/comments/${commentId}`, 'DELETE'),
    onSuccess: () => {
      toast.success('Comment deleted.');
      router.refresh();
    },
    onError: (err) => toast.error(err.message),
  });
  if (!viewer) return <div className="mt-1 min-h-5" />;
  const own = viewer.handle === authorHandle;
  const canReply = open && state === 'published';
  const canEdit = own && state !== 'hidden' && openedAt < Date.parse(editableUntil);
  const canDelete = own || hasRole(viewer, 'moderator');
  const canReport = !own && state === 'published';
  return (
    <div className="mt-1 min-h-5">
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
