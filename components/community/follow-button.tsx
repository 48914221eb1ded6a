'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

export function FollowButton({
  type,
  id,
  following,
  label,
  disabled = false,
  onChange,
}: {
  type: 'member' | 'recipe';
  id: string;
  following: boolean;
  label: string;
  /** While the member's own state is still on its way. */
  disabled?: boolean;
  onChange?: (following: boolean) => void;
}) {
  const [on, setOn] = useState(following);
  const toggle = useMutation({
    mutationFn: () => sendJson<{ following: boolean }>('/api/follows', on ? 'DELETE' : 'POST', { type, id }),
    onSuccess: (next) => {
      setOn(next.following);
      onChange?.(next.following);
      toast.success(next.following ? `Following ${label}.` : `No longer following ${label}.`);
    },
    onError: (err) => toast.error(err.message),
  });
  return (
    <button
      type="button"
      className="kf-btn-quiet"
      aria-pressed={on}
      disabled={disabled || toggle.isPending}
      onClick={() => toggle.mutate()}
    >
      {on ? 'Following' : 'Follow'}
      <span className="sr-only"> {label}</span>
    </button>
  );
}
