'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { sendJson } from '@/lib/http/client';

/** Undo for an unsubscribe link followed by mistake. */
export function ResubscribeButton({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const undo = useMutation({
    mutationFn: () => sendJson(`/api/unsubscribe?token=${encodeURIComponent(token)}&resubscribe=1`, 'POST'),
    onSuccess: () => setDone(true),
  });
  if (done)
    return (
      <p role="status" className="mt-4 font-sans text-sm text-bine">
        Done: these e-mails are back on.
      </p>
    );
  return (
    <div className="mt-4">
      <button
        type="button"
        className="kf-btn-quiet font-sans text-sm"
        disabled={undo.isPending}
        onClick={() => undo.mutate()}
      >
        That was a mistake: keep e-mailing me
      </button>
      {undo.error && (
        <p role="alert" className="kf-field-error">
          {undo.error.message}
        </p>
      )}
    </div>
  );
}
