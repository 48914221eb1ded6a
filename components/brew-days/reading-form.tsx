'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { fieldUnit, plainUnit } from '@/components/recipe-editor/field-units';
import { UnitNumberField } from '@/components/unit-number-field';
import { readingSchema } from '@/lib/brew-days/schemas';
import type { UnitSystem } from '@/lib/brewing/units';
import { DateField, EntryCard, useAddToBrewDay } from './entry-form';

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
  const { control, register, handleSubmit, setError, reset, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(readingSchema),
    shouldUnregister: true,
    defaultValues: { takenOn: new Date().toISOString().slice(0, 10), method: 'hydrometer', note: '' },
  });
  const { formError, onSubmit } = useAddToBrewDay<Input, Output>({
    url: `/api/brew-days/${brewDayId}/readings`,
    added: 'Reading added.',
    setError,
    reset,
  });
  const method = useWatch({ control, name: 'method' });
  const errors = formState.errors as Record<string, { message?: string } | undefined>;
  const temp = fieldUnit('temperature', units);

  const numberInput = (name: 'value' | 'sampleTempC' | 'beerTempC', label: string, unit = temp) => (
    <UnitNumberField
      control={control}
      name={name}
      id={`reading-${name}`}
      label={label}
      unit={unit}
      error={errors[name]?.message}
      className=""
      mutedUnit
    />
  );

  return (
    <EntryCard
      name="reading-form"
      title="Add a reading"
      onSubmit={handleSubmit(onSubmit)}
      formError={formError}
      submitting={formState.isSubmitting}
      idle="Add reading"
    >
      <DateField
        id="reading-takenOn"
        label="Date"
        min={brewedOn}
        registration={register('takenOn')}
        error={errors.takenOn?.message}
      />
      <div>
        <label htmlFor="reading-method" className="kf-label">
          Instrument
        </label>
        <select id="reading-method" className="kf-input" {...register('method')}>
          <option value="hydrometer">Hydrometer (SG)</option>
          <option value="refractometer">Refractometer (°Brix)</option>
        </select>
      </div>
      {numberInput('value', 'Gravity reading', method === 'refractometer' ? plainUnit('°Brix', 1) : plainUnit('SG', 3))}
      {method !== 'refractometer' && numberInput('sampleTempC', 'Sample temperature')}
      {numberInput('beerTempC', 'Beer temperature')}
      <div>
        <label htmlFor="reading-note" className="kf-label">
          Note
        </label>
        <input id="reading-note" className="kf-input" maxLength={300} {...register('note')} />
      </div>
    </EntryCard>
  );
}
