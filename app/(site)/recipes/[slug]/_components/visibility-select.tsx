'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';

type Visibility = 'public' | 'unlisted' | 'private';

export function VisibilitySelect({ recipeId, visibility }: { recipeId: string; visibility: Visibility }) {
  const router = useRouter();
  const [value, setValue] = useState(visibility);
  const save = useMutation({
    mutationFn: async (next: Visibility) => {
      const res = await fetch(`/api/recipes/${recipeId}`, {
        method: 'PATCH',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ visibility: next }),
      });
      if (!res.ok) throw new Error(((await res.json().catch(() => ({}))) as { error?: { message: string } }).error?.message ?? 'Could not change who sees it.');
    },
    onSuccess: () => {
      toast.success('Saved who can see this recipe.');
      router.refresh();
    },
    onError: (err) => {
      setValue(visibility);
      toast.error(err.message);
    },
  });
  return (
    <div className="kf-card">
      <label htmlFor="recipe-visibility" className="kf-label">
        Who can see this recipe
      </label>
      <select
        id="recipe-visibility"
        className="kf-input"
        value={value}
        disabled={save.isPending}
        onChange={(e) => {
          const next = e.target.value as Visibility;
          setValue(next);
          save.mutate(next);
        }}
      >
        <option value="public">Everyone (listed and searchable)</option>
        <option value="unlisted">Only people with the link</option>
        <option value="private">Only me</option>
      </select>
    </div>
  );
}
