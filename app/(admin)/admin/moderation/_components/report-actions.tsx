'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';
import type { ReportTarget } from '@/lib/moderation/words';

type Action = 'hide' | 'dismiss' | 'suspend';

const DONE: Record<Action, string> = {
  hide: 'Hidden.',
  dismiss: 'Report dismissed.',
  suspend: 'Member suspended and content hidden.',
};

export function ReportActions({
  reportId,
  targetType,
  canSuspend,
}: {
  reportId: string;
  targetType: ReportTarget;
  canSuspend: boolean;
}) {
  const id = useId();
  const router = useRouter();
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  const act = useMutation({
    mutationFn: (action: Action) =>
      sendJson(`/api/moderation/reports/${reportId}`, 'POST', { action, reason }).then(() => action),
    onSuccess: (action) => {
      toast.success(DONE[action]);
      router.refresh();
    },
    onError: (err) => {
      setError(err.message);
      router.refresh();
    },
  });
  return (
    <div className="mt-4 border-t border-line pt-3">
      <label htmlFor={`${id}-reason`} className="kf-label">
        Reason (shown to the owner when you hide or suspend)
      </label>
      <input
        id={`${id}-reason`}
        className="kf-input"
        maxLength={500}
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        placeholder="e.g. Advertising unrelated to brewing"
      />
      {error && (
        <p role="alert" className="kf-field-error">
          {error}
        </p>
      )}
      <div className="mt-3 flex flex-wrap gap-2 font-sans text-sm">
        {targetType !== 'member' && (
          <button type="button" className="kf-btn" disabled={act.isPending} onClick={() => act.mutate('hide')}>
            Hide it
          </button>
        )}
        <button type="button" className="kf-btn-quiet" disabled={act.isPending} onClick={() => act.mutate('dismiss')}>
          Dismiss report
        </button>
        {canSuspend && (
          <button
            type="button"
            className="kf-btn-quiet text-danger"
            disabled={act.isPending}
            onClick={() => act.mutate('suspend')}
          >
            {targetType === 'member' ? 'Suspend member' : 'Hide and suspend its owner'}
          </button>
        )}
      </div>
    </div>
  );
}
