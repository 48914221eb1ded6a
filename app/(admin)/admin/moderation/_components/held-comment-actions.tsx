'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

export function HeldCommentActions({ commentId }: { commentId: string }) {
  const id = useId();
  const router = useRouter();
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  const act = useMutation({
    mutationFn: (action: 'approve' | 'hide') =>
      sendJson(`/api/moderation/comments/${commentId}`, 'POST', { action, reason }).then(() => action),
    onSuccess: (action) => {
      toast.success(action === 'approve' ? 'Published.' : 'Hidden.');
      router.refresh();
    },
    onError: (err) => setError(err.message),
  });
  return (
    <div className="mt-3 border-t border-line pt-3">
      <label htmlFor={`${id}-reason`} className="kf-label">
        Reason (needed to hide; the author sees it)
      </label>
      <input
        id={`${id}-reason`}
        className="kf-input"
        maxLength={500}
        value={reason}
        onChange={(e) => setReason(e.target.value)}
      />
      {error && (
        <p role="alert" className="kf-field-error">
          {error}
        </p>
      )}
      <div className="mt-3 flex gap-2 font-sans text-sm">
        <button type="button" className="kf-btn" disabled={act.isPending} onClick={() => act.mutate('approve')}>
          Publish
        </button>
        <button type="button" className="kf-btn-quiet" disabled={act.isPending} onClick={() => act.mutate('hide')}>
          Hide
        </button>
      </div>
    </div>
  );
}
