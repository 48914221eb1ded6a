'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

type Visibility = 'public' | 'unlisted' | 'private';

export function VisibilitySelect({ recipeId, visibility }: { recipeId: string; visibility: Visibility }) {
  const router = useRouter();
  const [value, setValue] = useState(visibility);
  const save = useMutation({
    mutationFn: (next: Visibility) => sendJson(`/api/recipes/${recipeId}`, 'PATCH', { visibility: next }),
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
