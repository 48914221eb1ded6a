'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

interface Saved {
  recipe: { slug: string };
}

export function ForkForm({
  versionId,
  defaultTitle,
  number,
}: {
  versionId: string;
  defaultTitle: string;
  number: number;
}) {
  const router = useRouter();
  const [title, setTitle] = useState(defaultTitle);
  const [visibility, setVisibility] = useState<'public' | 'unlisted' | 'private'>('public');
  const [error, setError] = useState<string>();
  const fork = useMutation({
    mutationFn: () => sendJson<Saved>(`/api/versions/${versionId}/fork`, 'POST', { title, visibility }),
    onSuccess: (saved) => {
      toast.success('Forked. This recipe is yours to change.');
      router.push(`/recipes/${saved.recipe.slug}/edit`);
    },
    onError: (err) => setError(err.message),
  });
  return (
    <form
      className="kf-card"
      onSubmit={(e) => {
        e.preventDefault();
        setError(undefined);
        fork.mutate();
      }}
    >
      <h2 className="text-lg font-semibold">Brew it your way</h2>
      <p className="mt-1 font-sans text-sm text-muted">
        Forking copies version {number} into a recipe of your own that remembers where it came from.
      </p>
      <label htmlFor="fork-title" className="kf-label mt-3">
        Title of your fork
      </label>
      <input
        id="fork-title"
        className="kf-input"
        value={title}
        onChange={(e) => setTitle(e.target.value)}
        maxLength={120}
        required
      />
      <label htmlFor="fork-visibility" className="kf-label mt-3">
        Who can see it
      </label>
      <select
        id="fork-visibility"
        className="kf-input"
        value={visibility}
        onChange={(e) => setVisibility(e.target.value as typeof visibility)}
      >
        <option value="public">Everyone</option>
        <option value="unlisted">Only people with the link</option>
        <option value="private">Only me</option>
      </select>
      {error && (
        <p role="alert" className="kf-field-error">
          {error}
        </p>
      )}
      <button type="submit" className="kf-btn mt-4 w-full" disabled={fork.isPending}>
        {fork.isPending ? 'Forking…' : 'Fork this version'}
      </button>
    </form>
  );
}
