'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { FitChanges, useBrewhouseFit } from '@/components/fit-to-brewhouse';
import { onlyFields, showRefusal } from '@/components/form-errors';
import { describedBy } from '@/components/form-field';
import { useVersionDocument } from '@/hooks/use-version-document';
import type { UnitSystem } from '@/lib/brewing/units';
import { requestJson } from '@/lib/http/client';
import { forkSchema } from '@/lib/recipes/schemas';

type Input = z.input<typeof forkSchema>;
type Output = z.output<typeof forkSchema>;

interface Saved {
  recipe: { id: string; slug: string };
  version: { id: string; number: number };
}

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
  const [formError, setFormError] = useState<string>();
  const [fitting, setFitting] = useState(false);
  const source = useVersionDocument(versionId, fitting);
  const fit = useBrewhouseFit(source.data, fitting);
  const fitted = fitting && fit.state === 'ready' && fit.changes.length > 0 ? fit.fitted : null;
  const waitingForFit = fitting && (fit.state === 'loading' || source.isLoading);
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(forkSchema),
    defaultValues: { title: defaultTitle, visibility: 'public' },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    // The fork and its fitted second version are saved together, or neither is.
    const body = fitted ? { ...values, fitted } : values;
    const result = await requestJson<Saved>(`/api/versions/${versionId}/fork`, 'POST', body);
    if (!result.ok) {
      setFormError(showRefusal(setError, result, onlyFields('title', 'visibility')));
      return;
    }
    toast.success(fitted ? 'Forked and fitted to your brewhouse.' : 'Forked. This recipe is yours to change.');
    router.push(`/recipes/${result.data.recipe.slug}/edit`);
  });

  return (
    <form className="kf-card" noValidate onSubmit={onSubmit}>
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
        maxLength={120}
        required
        aria-invalid={Boolean(errors.title) || undefined}
        aria-describedby={describedBy('fork-title', errors.title?.message)}
        {...register('title')}
      />
      {errors.title && (
        <p id="fork-title-error" role="alert" className="kf-field-error">
          {errors.title.message}
        </p>
      )}
      <label htmlFor="fork-visibility" className="kf-label mt-3">
        Who can see it
      </label>
      <select
        id="fork-visibility"
        className="kf-input"
        aria-invalid={Boolean(errors.visibility) || undefined}
        aria-describedby={describedBy('fork-visibility', errors.visibility?.message)}
        {...register('visibility')}
      >
        <option value="public">Everyone</option>
        <option value="unlisted">Only people with the link</option>
        <option value="private">Only me</option>
      </select>
      {errors.visibility && (
        <p id="fork-visibility-error" role="alert" className="kf-field-error">
          {errors.visibility.message}
        </p>
      )}
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
      {formError && (
        <p role="alert" className="kf-field-error">
          {formError}
        </p>
      )}
      <button
        type="submit"
        className="kf-btn mt-4 w-full"
        disabled={isSubmitting || waitingForFit || (fitting && fit.state === 'refused')}
      >
        {isSubmitting ? 'Forking…' : fitted ? 'Fork and fit this version' : 'Fork this version'}
      </button>
    </form>
  );
}
