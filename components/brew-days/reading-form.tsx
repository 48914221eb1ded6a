'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { setServerErrors } from '@/components/form-errors';
import { describedBy } from '@/components/form-field';
import { fieldUnit, plainUnit } from '@/components/recipe-editor/field-units';
import { UnitNumberInput } from '@/components/recipe-editor/unit-number-input';
import { readingSchema } from '@/lib/brew-days/schemas';
import type { UnitSystem } from '@/lib/brewing/units';
import { requestJson } from '@/lib/http/client';

type Input = z.input<typeof readingSchema>;
type Output = z.output<typeof readingSchema>;

/** The brewer adds a fermentation reading: gravity (hydrometer or refractometer), temperature, or both. */
export function ReadingForm({
  brewDayId,
  units,
  brewedOn,
}: {
  brewDayId: string;
  units: UnitSystem;
  brewedOn: string;
}) {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const { control, register, handleSubmit, setError, reset, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(readingSchema),
    shouldUnregister: true,
    defaultValues: { takenOn: new Date().toISOString().slice(0, 10), method: 'hydrometer', note: '' },
  });
  const method = useWatch({ control, name: 'method' });
  const errors = formState.errors as Record<string, { message?: string } | undefined>;
  const temp = fieldUnit('temperature', units);

  const onSubmit = async (values: Output) => {
    setFormError(undefined);
    const result = await requestJson(`/api/brew-days/${brewDayId}/readings`, 'POST', values);
    if (!result.ok) {
      setServerErrors(setError, result.fields);
      setFormError(result.message);
      return;
    }
    toast.success('Reading added.');
    reset();
    router.refresh();
  };

  const numberInput = (name: 'value' | 'sampleTempC' | 'beerTempC', label: string, unit = temp) => {
    const id = `reading-${name}`;
    const error = errors[name]?.message;
    return (
      <div>
        <label htmlFor={id} className="kf-label">
          {label} <span className="text-muted">({unit.label})</span>
        </label>
        <Controller
          control={control}
          name={name}
          render={({ field }) => (
            <UnitNumberInput
              id={id}
              name={name}
              value={typeof field.value === 'number' ? field.value : undefined}
              onChange={field.onChange}
              onBlur={field.onBlur}
              unit={unit}
              invalid={Boolean(error)}
              describedBy={describedBy(id, error)}
            />
          )}
        />
        {error && (
          <p id={`${id}-error`} role="alert" className="kf-field-error">
            {error}
          </p>
        )}
      </div>
    );
  };

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="kf-card" aria-labelledby="reading-form-title">
      <h3 id="reading-form-title" className="font-semibold">
        Add a reading
      </h3>
      <div className="mt-2 grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="reading-takenOn" className="kf-label">
            Date
          </label>
          <input
            id="reading-takenOn"
            type="date"
            min={brewedOn}
            className="kf-input"
            {...register('takenOn')}
            aria-invalid={Boolean(errors.takenOn) || undefined}
            aria-describedby={describedBy('reading-takenOn', errors.takenOn?.message)}
          />
          {errors.takenOn && (
            <p id="reading-takenOn-error" role="alert" className="kf-field-error">
              {errors.takenOn.message}
            </p>
          )}
        </div>
        <div>
          <label htmlFor="reading-method" className="kf-label">
            Instrument
          </label>
          <select id="reading-method" className="kf-input" {...register('method')}>
            <option value="hydrometer">Hydrometer (SG)</option>
            <option value="refractometer">Refractometer (°Brix)</option>
          </select>
        </div>
        {numberInput(
          'value',
          'Gravity reading',
          method === 'refractometer' ? plainUnit('°Brix', 1) : plainUnit('SG', 3),
        )}
        {method !== 'refractometer' && numberInput('sampleTempC', 'Sample temperature')}
        {numberInput('beerTempC', 'Beer temperature')}
        <div>
          <label htmlFor="reading-note" className="kf-label">
            Note
          </label>
          <input id="reading-note" className="kf-input" maxLength={300} {...register('note')} />
        </div>
      </div>
      {formError && (
        <p role="alert" className="mt-2 font-sans text-sm text-danger">
          {formError}
        </p>
      )}
      <button type="submit" className="kf-btn mt-3" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Adding…' : 'Add reading'}
      </button>
    </form>
  );
}
