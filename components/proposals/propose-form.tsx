'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

export interface ProposeTarget {
  recipeId: string;
  title: string;
  ownerName: string;
}

/** The fork's owner offers this version back to a recipe it descends from. */
export function ProposeForm({
  versionId,
  number,
  targets,
}: {
  versionId: string;
  number: number;
  targets: ProposeTarget[];
}) {
  const id = useId();
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [sourceRecipeId, setSourceRecipeId] = useState(targets[0].recipeId);
  const [title, setTitle] = useState('');
  const [description, setDescription] = useState('');
  const [error, setError] = useState<string>();
  const send = useMutation({
    mutationFn: () =>
      sendJson<{ id: string }>('/api/proposals', 'POST', { versionId, sourceRecipeId, title, description }),
    onSuccess: (res) => {
      toast.success('Proposed. The owner has been told.');
      router.push(`/proposals/${res.id}`);
    },
    onError: (err) => setError(err.message),
  });
  return (
    <div className="font-sans text-sm">
      <button
        type="button"
        className="kf-btn"
        aria-expanded={open}
        aria-controls={`${id}-form`}
        onClick={() => setOpen(!open)}
      >
        Propose to the original
      </button>
      {open && (
        <form
          id={`${id}-form`}
          className="kf-card mt-3 max-w-xl"
          onSubmit={(e) => {
            e.preventDefault();
            setError(undefined);
            send.mutate();
          }}
        >
          <p className="text-muted">
            Offer version {number} back. The owner sees exactly what changed and can take it in, with you credited.
          </p>
          {targets.length > 1 ? (
            <>
              <label htmlFor={`${id}-target`} className="kf-label mt-3">
                Propose to
              </label>
              <select
                id={`${id}-target`}
                className="kf-input"
                value={sourceRecipeId}
                onChange={(e) => setSourceRecipeId(e.target.value)}
              >
                {targets.map((t) => (
                  <option key={t.recipeId} value={t.recipeId}>
                    {t.title} by {t.ownerName}
                  </option>
                ))}
              </select>
            </>
          ) : (
            <p className="mt-3">
              To <strong>{targets[0].title}</strong> by {targets[0].ownerName}
            </p>
          )}
          <label htmlFor={`${id}-title`} className="kf-label mt-3">
            Title
          </label>
          <input
            id={`${id}-title`}
            className="kf-input"
            value={title}
            onChange={(e) => setTitle(e.target.value)}
            maxLength={120}
            required
            placeholder="A hotter mash for more body"
          />
          <label htmlFor={`${id}-description`} className="kf-label mt-3">
            What changed and why
          </label>
          <textarea
            id={`${id}-description`}
            className="kf-input"
            rows={4}
            maxLength={5000}
            value={description}
            onChange={(e) => setDescription(e.target.value)}
          />
          <p className="mt-1 text-xs text-muted">Markdown works: **bold**, _italic_, lists and links.</p>
          {error && (
            <p role="alert" className="kf-field-error">
              {error}
            </p>
          )}
          <button type="submit" className="kf-btn mt-3" disabled={send.isPending || title.trim() === ''}>
            {send.isPending ? 'Sending…' : 'Send proposal'}
          </button>
        </form>
      )}
    </div>
  );
}
