'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

export function StarButton({
  recipeId,
  starred,
  starCount,
  onChange,
}: {
  recipeId: string;
  starred: boolean;
  starCount: number;
  onChange?: (next: { starred: boolean; starCount: number }) => void;
}) {
  const router = useRouter();
  const [state, setState] = useState({ starred, starCount });
  const toggle = useMutation({
    mutationFn: () =>
      sendJson<{ starred: boolean; starCount: number }>(
        `/api/recipes/${recipeId}/star`,
        state.starred ? 'DELETE' : 'PUT',
      ),
    onSuccess: (next) => {
      setState(next);
      onChange?.(next);
      router.refresh();
    },
    onError: (err) => toast.error(err.message),
  });
  return (
    <button
      type="button"
      className="kf-btn-quiet"
      aria-pressed={state.starred}
      disabled={toggle.isPending}
      onClick={() => toggle.mutate()}
    >
      <span aria-hidden="true">{state.starred ? '★' : '☆'}</span> {state.starred ? 'Starred' : 'Star'}{' '}
      <span className="kf-data">({state.starCount})</span>
    </button>
  );
}
