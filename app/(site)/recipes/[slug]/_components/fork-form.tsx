'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { onlyFields, showRefusal } from '@/components/form-errors';
import { describedBy } from '@/components/form-field';
import { requestJson } from '@/lib/http/client';
import { forkSchema } from '@/lib/recipes/schemas';

type Input = z.input<typeof forkSchema>;
type Output = z.output<typeof forkSchema>;

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
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(forkSchema),
    defaultValues: { title: defaultTitle, visibility: 'public' },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    const result = await requestJson<Saved>(`/api/versions/${versionId}/fork`, 'POST', values);
    if (!result.ok) {
      setFormError(showRefusal(setError, result, onlyFields('title', 'visibility')));
      return;
    }
    toast.success('Forked. This recipe is yours to change.');
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
      {formError && (
        <p role="alert" className="kf-field-error">
          {formError}
        </p>
      )}
      <button type="submit" className="kf-btn mt-4 w-full" disabled={isSubmitting}>
        {isSubmitting ? 'Forking…' : 'Fork this version'}
      </button>
    </form>
  );
}
