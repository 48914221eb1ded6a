'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { tastingSchema } from '@/lib/brew-days/schemas';
import { DateField, EntryCard, useAddToBrewDay } from './entry-form';

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
  const { register, handleSubmit, setError, reset, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(tastingSchema),
    defaultValues: { tastedOn: new Date().toISOString().slice(0, 10), rating: 3 },
  });
  const errors = formState.errors as Record<string, { message?: string } | undefined>;
  const { formError, onSubmit } = useAddToBrewDay<Input, Output>({
    url: `/api/brew-days/${brewDayId}/tastings`,
    added: 'Tasting added.',
    setError,
    reset,
  });
  return (
    <EntryCard
      name="tasting-form"
      title="Add your tasting"
      onSubmit={handleSubmit(onSubmit)}
      formError={formError}
      submitting={formState.isSubmitting}
      idle="Add tasting"
    >
      <DateField
        id="tasting-tastedOn"
        label="Date"
        registration={register('tastedOn')}
        error={errors.tastedOn?.message}
      />
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
    </EntryCard>
  );
}
