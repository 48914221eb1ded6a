'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Controller, useForm, useWatch, type Control, type FieldErrors, type Path } from 'react-hook-form';
import { toast } from 'sonner';
import { z } from 'zod';
import { setServerErrors } from '@/components/form-errors';
import { FormSubmit } from '@/components/form-field';
import { fieldUnit, plainUnit, type FieldUnit } from '@/components/recipe-editor/field-units';
import { UnitNumberField } from '@/components/unit-number-field';
import { createBrewDaySchema, TYPICAL_KEG_RATING_KPA } from '@/lib/brew-days/schemas';
import { fromDisplayUnits, toDisplayUnits, type UnitSystem } from '@/lib/brewing/units';
import { requestJson } from '@/lib/http/client';
import { Caution, CAUTIONS } from './caution';
import { DateField } from './entry-form';

type FormInput = z.input<typeof createBrewDaySchema>;
type FormOutput = z.output<typeof createBrewDaySchema>;

const SG = plainUnit('SG', 3);
const PH = plainUnit('pH', 2);

function pressureUnit(units: UnitSystem): FieldUnit {
  return {
    label: units === 'metric' ? 'kPa' : 'psi',
    toDisplay: (kPa) => toDisplayUnits(kPa, 'pressure', units),
    fromDisplay: (typed) => fromDisplayUnits(typed, 'pressure', units),
    decimals: 1,
  };
}

/** The message for a dotted path in react-hook-form's nested errors. */
function errorAt(errors: FieldErrors<FormInput>, path: string): string | undefined {
  let node: unknown = errors;
  for (const part of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[part];
  return (node as { message?: string } | undefined)?.message;
}

function NumberField({
  control,
  name,
  label,
  unit,
  errors,
  hint,
}: {
  control: Control<FormInput>;
  name: Path<FormInput>;
  label: string;
  unit: FieldUnit;
  errors: FieldErrors<FormInput>;
  hint?: string;
}) {
  return (
    <UnitNumberField
      control={control}
      name={name}
      id={`bd-${name.replace(/\./g, '-')}`}
      label={label}
      unit={unit}
      error={errorAt(errors, name)}
      hint={hint}
      className=""
      mutedUnit
    />
  );
}

function GravityField({
  control,
  name,
  label,
  units,
  errors,
}: {
  control: Control<FormInput>;
  name: 'preBoilGravity' | 'og' | 'fg';
  label: string;
  units: UnitSystem;
  errors: FieldErrors<FormInput>;
}) {
  const method = useWatch({ control, name: `${name}.method` as Path<FormInput> }) as string | undefined;
  const id = `bd-${name}`;
  return (
    <fieldset className="rounded-md border border-line p-3">
      <legend className="px-1 font-sans text-sm font-semibold">{label}</legend>
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor={`${id}-method`} className="kf-label">
            Instrument
          </label>
          <Controller
            control={control}
            name={`${name}.method` as Path<FormInput>}
            render={({ field }) => (
              <select
                id={`${id}-method`}
                className="kf-input"
                value={String(field.value ?? 'hydrometer')}
                onChange={field.onChange}
                onBlur={field.onBlur}
              >
                <option value="hydrometer">Hydrometer (SG)</option>
                <option value="refractometer">Refractometer (°Brix)</option>
              </select>
            )}
          />
        </div>
        <NumberField
          control={control}
          name={`${name}.value` as Path<FormInput>}
          label="Reading"
          unit={method === 'refractometer' ? plainUnit('°Brix', 1) : SG}
          errors={errors}
        />
        {method !== 'refractometer' && (
          <NumberField
            control={control}
            name={`${name}.sampleTempC` as Path<FormInput>}
            label="Sample temperature"
            unit={fieldUnit('temperature', units)}
            errors={errors}
            hint="Corrected to the hydrometer's 15.6 °C (60 °F)."
          />
        )}
      </div>
    </fieldset>
  );
}

export interface BrewDayFormProps {
  units: UnitSystem;
  /** Create: the version brewed. Edit: the brew day changed. */
  mode: { kind: 'create'; versionId: string } | { kind: 'edit'; brewDayId: string };
  defaults: Partial<FormInput>;
  /** Where to go after saving; for a new brew day, its page. */
  predictedKegPressureKPa?: number | null;
}

/** The brew day as measured, in the member's units; the same schema checks it here and on the server. */
export function BrewDayForm({ units, mode, defaults }: BrewDayFormProps) {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const versionId = mode.kind === 'create' ? mode.versionId : '00000000-0000-4000-8000-000000000000';
  const {
    control,
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(createBrewDaySchema),
    // A hidden field (keg pressure once bottles are chosen, a refractometer's sample temperature) is not sent.
    shouldUnregister: true,
    defaultValues: {
      versionId,
      brewedOn: new Date().toISOString().slice(0, 10),
      notes: '',
      preBoilGravity: { method: 'hydrometer' },
      og: { method: 'hydrometer' },
      fg: { method: 'hydrometer' },
      ...defaults,
    } as FormInput,
  });
  const packaging = useWatch({ control, name: 'packaging' }) as string | null | undefined;
  const kegPressure = useWatch({ control, name: 'kegPressureKPa' }) as number | null | undefined;

  const onSubmit = async (values: FormOutput) => {
    setFormError(undefined);
    const { versionId: _version, ...fields } = values;
    const result =
      mode.kind === 'create'
        ? await requestJson<{ id: string }>('/api/brew-days', 'POST', { versionId: _version, ...fields })
        : await requestJson<{ id?: string }>(`/api/brew-days/${mode.brewDayId}`, 'PATCH', fields);
    if (!result.ok) {
      setServerErrors(setError, result.fields);
      setFormError(result.message);
      return;
    }
    toast.success(mode.kind === 'create' ? 'Brew day logged.' : 'Brew day saved.');
    router.push(`/brew-days/${result.data.id ?? (mode.kind === 'edit' ? mode.brewDayId : '')}`);
    router.refresh();
  };

  const temp = fieldUnit('temperature', units);
  const volume = fieldUnit('volume', units);
  const id = (name: string) => `bd-${name}`;
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-6" aria-label="Brew day">
      <input type="hidden" {...register('versionId')} />
      <section className="kf-card space-y-3">
        <h2 className="text-lg font-semibold">The day</h2>
        <DateField
          id={id('brewedOn')}
          label="Brew date"
          registration={register('brewedOn')}
          error={errors.brewedOn?.message}
          className="max-w-xs"
        />
      </section>

      <section className="kf-card">
        <h2 className="text-lg font-semibold">Mash</h2>
        <div className="mt-3 grid gap-3 sm:grid-cols-3">
          <NumberField control={control} name="strikeTempC" label="Strike water" unit={temp} errors={errors} />
          <NumberField control={control} name="mashTempC" label="Mash temperature" unit={temp} errors={errors} />
          <NumberField control={control} name="mashPh" label="Mash pH" unit={PH} errors={errors} />
        </div>
        <Caution>{CAUTIONS.hotLiquor}</Caution>
      </section>

      <section className="kf-card space-y-3">
        <h2 className="text-lg font-semibold">Boil</h2>
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField control={control} name="preBoilVolumeL" label="Pre-boil volume" unit={volume} errors={errors} />
          <NumberField
            control={control}
            name="postBoilVolumeL"
            label="Post-boil volume"
            unit={volume}
            errors={errors}
          />
        </div>
        <GravityField control={control} name="preBoilGravity" label="Pre-boil gravity" units={units} errors={errors} />
        <Caution>{CAUTIONS.boil}</Caution>
      </section>

      <section className="kf-card space-y-3">
        <h2 className="text-lg font-semibold">Into the fermenter</h2>
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField
            control={control}
            name="fermenterVolumeL"
            label="Volume into the fermenter"
            unit={volume}
            errors={errors}
            hint="Used for the efficiency figure."
          />
          <NumberField control={control} name="pitchTempC" label="Pitching temperature" unit={temp} errors={errors} />
        </div>
        <GravityField control={control} name="og" label="Original gravity (OG)" units={units} errors={errors} />
        <Caution>{CAUTIONS.glass}</Caution>
      </section>

      <section className="kf-card space-y-3">
        <h2 className="text-lg font-semibold">Finish and packaging</h2>
        <GravityField control={control} name="fg" label="Final gravity (FG)" units={units} errors={errors} />
        <div className="grid gap-3 sm:grid-cols-2">
          <DateField
            id={id('packagedOn')}
            label="Packaging date"
            registration={register('packagedOn')}
            error={errors.packagedOn?.message}
          />
          <div>
            <label htmlFor={id('packaging')} className="kf-label">
              Packaged in
            </label>
            <select id={id('packaging')} className="kf-input" {...register('packaging')}>
              <option value="">Not packaged yet</option>
              <option value="keg">Keg</option>
              <option value="bottles">Bottles</option>
            </select>
          </div>
          {packaging === 'keg' && (
            <NumberField
              control={control}
              name="kegPressureKPa"
              label="Keg pressure"
              unit={pressureUnit(units)}
              errors={errors}
              hint={`A typical keg is rated about ${TYPICAL_KEG_RATING_KPA} kPa (30 psi); check your keg's own rating.`}
            />
          )}
          {packaging === 'bottles' && (
            <NumberField
              control={control}
              name="primingSugarG"
              label="Priming sugar"
              unit={fieldUnit('hopMass', units)}
              errors={errors}
            />
          )}
        </div>
        {packaging === 'keg' && typeof kegPressure === 'number' && kegPressure > TYPICAL_KEG_RATING_KPA && (
          <p role="alert" className="rounded-md border border-danger/40 bg-danger/5 p-2 font-sans text-sm text-danger">
            That is above a typical keg rating of {TYPICAL_KEG_RATING_KPA} kPa (30 psi), by common practice. Stay within
            your keg maker&apos;s stated limits and local codes.
          </p>
        )}
        <Caution>{packaging === 'bottles' ? CAUTIONS.bottles : CAUTIONS.pressure}</Caution>
      </section>

      <section className="kf-card">
        <h2 className="text-lg font-semibold">Notes</h2>
        <label htmlFor={id('notes')} className="kf-label mt-2">
          What happened (Markdown)
        </label>
        <textarea
          id={id('notes')}
          rows={6}
          className="kf-input"
          {...register('notes')}
          aria-invalid={Boolean(errors.notes) || undefined}
        />
        {errors.notes && (
          <p role="alert" className="kf-field-error">
            {errors.notes.message}
          </p>
        )}
        <Caution>{CAUTIONS.chemicals}</Caution>
      </section>

      <FormSubmit
        formError={formError}
        errorClassName="font-sans text-sm text-danger"
        submitting={isSubmitting}
        idle={mode.kind === 'create' ? 'Log this brew day' : 'Save brew day'}
        busy="Saving…"
      />
    </form>
  );
}
