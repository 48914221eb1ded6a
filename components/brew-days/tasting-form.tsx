'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { setServerErrors } from '@/components/form-errors';
import { tastingSchema } from '@/lib/brew-days/schemas';
import { requestJson } from '@/lib/http/client';

type Input = z.input<typeof tastingSchema>;
type Output = z.output<typeof tastingSchema>;

const NOTES = [
  ['appearance', 'Appearance'],
  ['aroma', 'Aroma'],
  ['flavour', 'Flavour'],
  ['mouthfeel', 'Mouthfeel'],
  ['overall', 'Overall'],
] as const;

/** Anyone signed in who can see the brew day adds their tasting notes. */
export function TastingForm({ brewDayId }: { brewDayId: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, reset, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(tastingSchema),
    defaultValues: { tastedOn: new Date().toISOString().slice(0, 10), rating: 3 },
  });
  const errors = formState.errors as Record<string, { message?: string } | undefined>;
  const onSubmit = async (values: Output) => {
    setFormError(undefined);
    const result = await requestJson(`/api/brew-days/${brewDayId}/tastings`, 'POST', values);
    if (!result.ok) {
      setServerErrors(setError, result.fields);
      setFormError(result.message);
      return;
    }
    toast.success('Tasting added.');
    reset();
    router.refresh();
  };
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="kf-card" aria-labelledby="tasting-form-title">
      <h3 id="tasting-form-title" className="font-semibold">
        Add your tasting
      </h3>
      <div className="mt-2 grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="tasting-tastedOn" className="kf-label">
            Date
          </label>
          <input
            id="tasting-tastedOn"
            type="date"
            className="kf-input"
            {...register('tastedOn')}
            aria-invalid={Boolean(errors.tastedOn) || undefined}
          />
          {errors.tastedOn && (
            <p role="alert" className="kf-field-error">
              {errors.tastedOn.message}
            </p>
          )}
        </div>
        <div>
          <label htmlFor="tasting-rating" className="kf-label">
            Rating (1 to 5)
          </label>
          <select id="tasting-rating" className="kf-input" {...register('rating', { valueAsNumber: true })}>
            {[1, 2, 3, 4, 5].map((n) => (
              <option key={n} value={n}>
                {n} {n === 1 ? '(poor)' : n === 5 ? '(excellent)' : ''}
              </option>
            ))}
          </select>
          {errors.rating && (
            <p role="alert" className="kf-field-error">
              {errors.rating.message}
            </p>
          )}
        </div>
        {NOTES.map(([name, label]) => (
          <div key={name} className={name === 'overall' ? 'sm:col-span-2' : ''}>
            <label htmlFor={`tasting-${name}`} className="kf-label">
              {label}
            </label>
            <textarea
              id={`tasting-${name}`}
              rows={2}
              className="kf-input"
              maxLength={2000}
              {...register(name)}
              aria-invalid={Boolean(errors[name]) || undefined}
            />
            {errors[name] && (
              <p role="alert" className="kf-field-error">
                {errors[name]?.message}
              </p>
            )}
          </div>
        ))}
      </div>
      {formError && (
        <p role="alert" className="mt-2 font-sans text-sm text-danger">
          {formError}
        </p>
      )}
      <button type="submit" className="kf-btn mt-3" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Adding…' : 'Add tasting'}
      </button>
    </form>
  );
}
