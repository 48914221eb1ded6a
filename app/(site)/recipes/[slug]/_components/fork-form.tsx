'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { FitChanges, useBrewhouseFit } from '@/components/fit-to-brewhouse';
import { useVersionDocument } from '@/hooks/use-version-document';
import type { UnitSystem } from '@/lib/brewing/units';
import { requestJson, sendJson } from '@/lib/http/client';

interface Saved {
  recipe: { id: string; slug: string };
  version: { id: string; number: number };
}

const FIT_MESSAGE = 'Fitted to my brewhouse';

export function ForkForm({
  versionId,
  defaultTitle,
  number,
  units,
}: {
  versionId: string;
  defaultTitle: string;
  number: number;
  units: UnitSystem;
}) {
  const router = useRouter();
  const [title, setTitle] = useState(defaultTitle);
  const [visibility, setVisibility] = useState<'public' | 'unlisted' | 'private'>('public');
  const [error, setError] = useState<string>();
  const [fitting, setFitting] = useState(false);
  const source = useVersionDocument(versionId, fitting);
  const fit = useBrewhouseFit(source.data, fitting);
  const fitted = fitting && fit.state === 'ready' && fit.changes.length > 0 ? fit.fitted : null;
  const fork = useMutation({
    mutationFn: async () => {
      const saved = await sendJson<Saved>(`/api/versions/${versionId}/fork`, 'POST', { title, visibility });
      if (!fitted) return { saved, fitError: null };
      // The fork first copies the version as it is; the fit is its second version, so the history shows it.
      const result = await requestJson<Saved>(`/api/recipes/${saved.recipe.id}/versions`, 'POST', {
        document: fitted,
        baseVersionId: saved.version.id,
        message: FIT_MESSAGE,
      });
      return { saved, fitError: result.ok ? null : (result.fields[0]?.message ?? result.message) };
    },
    onSuccess: ({ saved, fitError }) => {
      if (fitError) {
        toast.error(`Forked, but the fit was not saved (${fitError}). Use “Fit to my brewhouse” in the editor.`);
      } else {
        toast.success(fitted ? 'Forked and fitted to your brewhouse.' : 'Forked. This recipe is yours to change.');
      }
      router.push(`/recipes/${saved.recipe.slug}/edit`);
    },
    onError: (err) => setError(err.message),
  });
  const waitingForFit = fitting && (fit.state === 'loading' || source.isLoading);
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
      <div className="mt-4 flex items-start gap-2">
        <input
          id="fork-fit"
          type="checkbox"
          className="mt-0.5 h-5 w-5 accent-copper"
          checked={fitting}
          onChange={(e) => setFitting(e.target.checked)}
          aria-describedby="fork-fit-hint"
        />
        <div>
          <label htmlFor="fork-fit" className="font-sans text-sm font-semibold">
            Fit to my brewhouse
          </label>
          <p id="fork-fit-hint" className="font-sans text-xs text-muted">
            Rescales to your batch volume, efficiency and losses from settings, as a second version of your fork.
          </p>
        </div>
      </div>
      {fitting && (
        <div className="mt-3 rounded-md border border-line p-3">
          {source.error ? (
            <p role="alert" className="kf-field-error">
              {source.error.message}
            </p>
          ) : (
            <FitChanges result={fit} units={units} />
          )}
        </div>
      )}
      {error && (
        <p role="alert" className="kf-field-error">
          {error}
        </p>
      )}
      <button
        type="submit"
        className="kf-btn mt-4 w-full"
        disabled={fork.isPending || waitingForFit || (fitting && fit.state === 'refused')}
      >
        {fork.isPending ? 'Forking…' : fitted ? 'Fork and fit this version' : 'Fork this version'}
      </button>
    </form>
  );
}
