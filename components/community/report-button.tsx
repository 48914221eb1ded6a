'use client';

import { useMutation } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { toast } from 'sonner';
import {
  REASON_LABELS,
  REPORT_REASONS,
  TARGET_LABELS,
  type ReportReason,
  type ReportTarget,
} from '@/lib/moderation/words';
import { sendJson } from '@/lib/http/client';

/** A small disclosure with a form that reports something to the moderators. */
export function ReportButton({
  targetType,
  targetId,
  compact = false,
}: {
  targetType: ReportTarget;
  targetId: string;
  compact?: boolean;
}) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState<ReportReason>('spam');
  const [note, setNote] = useState('');
  const [error, setError] = useState<string>();
  const [done, setDone] = useState(false);
  const send = useMutation({
    mutationFn: () => sendJson('/api/reports', 'POST', { targetType, targetId, reason, note }),
    onSuccess: () => {
      setDone(true);
      setOpen(false);
      toast.success('Thank you. A moderator will look at it.');
    },
    onError: (err) => setError(err.message),
  });
  const what = TARGET_LABELS[targetType];
  if (done) return <span className="font-sans text-sm text-muted">Reported</span>;
  return (
    <div className="font-sans text-sm">
      <button
        type="button"
        className={compact ? 'text-muted underline' : 'kf-btn-quiet'}
        aria-expanded={open}
        aria-controls={`${id}-form`}
        onClick={() => setOpen(!open)}
      >
        Report{compact ? '' : ` this ${what}`}
      </button>
      {open && (
        <form
          id={`${id}-form`}
          className="kf-card mt-2 max-w-sm"
          onSubmit={(e) => {
            e.preventDefault();
            setError(undefined);
            send.mutate();
          }}
        >
          <label htmlFor={`${id}-reason`} className="kf-label">
            Why are you reporting this {what}?
          </label>
          <select
            id={`${id}-reason`}
            className="kf-input"
            value={reason}
            onChange={(e) => setReason(e.target.value as ReportReason)}
          >
            {REPORT_REASONS.map((r) => (
              <option key={r} value={r}>
                {REASON_LABELS[r]}
              </option>
            ))}
          </select>
          <label htmlFor={`${id}-note`} className="kf-label mt-3">
            Anything the moderators should know (optional)
          </label>
          <textarea
            id={`${id}-note`}
            className="kf-input"
            rows={3}
            maxLength={1000}
            value={note}
            onChange={(e) => setNote(e.target.value)}
          />
          {error && (
            <p role="alert" className="kf-field-error">
              {error}
            </p>
          )}
          <div className="mt-3 flex gap-2">
            <button type="submit" className="kf-btn" disabled={send.isPending}>
              {send.isPending ? 'Sending…' : 'Send report'}
            </button>
            <button type="button" className="kf-btn-quiet" onClick={() => setOpen(false)}>
              Cancel
            </button>
          </div>
        </form>
      )}
    </div>
  );
}
