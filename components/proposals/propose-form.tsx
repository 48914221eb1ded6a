'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { onlyFields, showRefusal } from '@/components/form-errors';
import { FormSubmit, describedBy } from '@/components/form-field';
import { requestJson } from '@/lib/http/client';
import { openProposalSchema } from '@/lib/proposals/schemas';

type Input = z.input<typeof openProposalSchema>;
type Output = z.output<typeof openProposalSchema>;

const MARKDOWN_HINT = 'Markdown works: **bold**, _italic_, lists and links.';

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
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, control, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(openProposalSchema),
    defaultValues: { versionId, sourceRecipeId: targets[0].recipeId, title: '', description: '' },
  });
  const { errors, isSubmitting } = formState;
  const title = useWatch({ control, name: 'title' });
  const placeable = targets.length > 1 ? ['sourceRecipeId', 'title', 'description'] : ['title', 'description'];

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    const result = await requestJson<{ id: string }>('/api/proposals', 'POST', values);
    if (!result.ok) {
      setFormError(showRefusal(setError, result, onlyFields(...placeable)));
      return;
    }
    toast.success('Proposed. The owner has been told.');
    router.push(`/proposals/${result.data.id}`);
  });

  const fieldError = (name: 'sourceRecipeId' | 'title' | 'description') =>
    errors[name] && (
      <p id={`${id}-${name}-error`} role="alert" className="kf-field-error">
        {errors[name].message}
      </p>
    );

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
        <form id={`${id}-form`} className="kf-card mt-3 max-w-xl" noValidate onSubmit={onSubmit}>
          <p className="text-muted">
            Offer version {number} back. The owner sees exactly what changed and can take it in, with you credited.
          </p>
          {targets.length > 1 ? (
            <>
              <label htmlFor={`${id}-sourceRecipeId`} className="kf-label mt-3">
                Propose to
              </label>
              <select
                id={`${id}-sourceRecipeId`}
                className="kf-input"
                aria-invalid={Boolean(errors.sourceRecipeId) || undefined}
                aria-describedby={describedBy(`${id}-sourceRecipeId`, errors.sourceRecipeId?.message)}
                {...register('sourceRecipeId')}
              >
                {targets.map((t) => (
                  <option key={t.recipeId} value={t.recipeId}>
                    {t.title} by {t.ownerName}
                  </option>
                ))}
              </select>
              {fieldError('sourceRecipeId')}
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
            maxLength={120}
            required
            placeholder="A hotter mash for more body"
            aria-invalid={Boolean(errors.title) || undefined}
            aria-describedby={describedBy(`${id}-title`, errors.title?.message)}
            {...register('title')}
          />
          {fieldError('title')}
          <label htmlFor={`${id}-description`} className="kf-label mt-3">
            What changed and why
          </label>
          <textarea
            id={`${id}-description`}
            className="kf-input"
            rows={4}
            maxLength={5000}
            aria-invalid={Boolean(errors.description) || undefined}
            aria-describedby={describedBy(`${id}-description`, errors.description?.message, MARKDOWN_HINT)}
            {...register('description')}
          />
          <p id={`${id}-description-hint`} className="mt-1 text-xs text-muted">
            {MARKDOWN_HINT}
          </p>
          {fieldError('description')}
          <FormSubmit
            formError={formError}
            submitting={isSubmitting}
            disabled={!title || title.trim() === ''}
            idle="Send proposal"
            busy="Sending…"
            buttonClassName="kf-btn mt-3"
          />
        </form>
      )}
    </div>
  );
}
