'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm, useWatch, type Control, type FieldPath } from 'react-hook-form';
import { toast } from 'sonner';
import { setServerErrors } from '@/components/form-errors';
import { FormSubmit, InputField } from '@/components/form-field';
import { fieldUnit, plainUnit, type FieldUnit } from '@/components/recipe-editor/field-units';
import { UnitNumberField } from '@/components/unit-number-field';
import { brewhouseKeys } from '@/hooks/use-brewhouse';
import { ION_NAMES } from '@/lib/brewing/constants';
import { DISPLAY_UNITS, type UnitSystem } from '@/lib/brewing/units';
import { ION_LABEL } from '@/lib/format';
import { brewhouseSchema, type BrewhouseInput } from '@/lib/community/brewhouse-schema';
import { requestJson } from '@/lib/http/client';

const EMPTY_REPORT: NonNullable<BrewhouseInput['waterReport']> = {
  name: '',
  calcium: 0,
  magnesium: 0,
  sodium: 0,
  chloride: 0,
  sulfate: 0,
  bicarbonate: 0,
};

type Path = FieldPath<BrewhouseInput>;

/** The losses "Fit to my brewhouse" uses, each in the member's unit for its quantity. */
const LOSSES = [
  { path: 'boilOffLPerHour', label: 'Boil-off rate', quantity: 'volumePerHour' },
  { path: 'trubLossL', label: 'Kettle trub loss', quantity: 'volume' },
  { path: 'grainAbsorptionLPerKg', label: 'Grain absorption', quantity: 'litresPerKg' },
  { path: 'mashWaterLPerKg', label: 'Mash thickness', quantity: 'litresPerKg' },
] as const;

function NumberSetting({
  control,
  path,
  label,
  unit,
  hint,
  error,
}: {
  control: Control<BrewhouseInput>;
  path: Path;
  label: string;
  unit: FieldUnit;
  hint?: string;
  error?: string;
}) {
  const id = `brewhouse-${path.replace(/\./g, '-')}`;
  return <UnitNumberField control={control} name={path} id={id} label={label} unit={unit} hint={hint} error={error} />;
}

/**
 * Losses and a water report, kept apart from the profile form: "Fit to my
 * brewhouse" takes the losses, and the recipe editor offers the water report
 * as a source water.
 */
export function BrewhouseSettings({ initial, units }: { initial: BrewhouseInput; units: UnitSystem }) {
  const queryClient = useQueryClient();
  const [formError, setFormError] = useState<string>();
  const { control, register, handleSubmit, setError, setValue, formState, getValues } = useForm<BrewhouseInput>({
    resolver: zodResolver(brewhouseSchema),
    defaultValues: initial,
  });
  const { errors, isSubmitting } = formState;
  const report = useWatch({ control, name: 'waterReport' });
  const [keptReport, setKeptReport] = useState(initial.waterReport ?? EMPTY_REPORT);

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    const result = await requestJson<{ brewhouse: BrewhouseInput }>('/api/me/brewhouse', 'PUT', values);
    if (!result.ok) {
      setServerErrors(setError, result.fields);
      setFormError(result.message);
      return;
    }
    toast.success('Brewhouse saved.');
    await queryClient.invalidateQueries({ queryKey: brewhouseKeys.all });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="mt-6" aria-labelledby="brewhouse-title">
      <fieldset className="kf-card">
        <legend id="brewhouse-title" className="px-1 text-lg font-semibold">
          Losses and water
        </legend>
        <p className="font-sans text-sm text-muted">
          “Fit to my brewhouse” uses these with your batch volume and efficiency. Leave a loss empty to keep the
          recipe’s own.
        </p>
        <div className="grid gap-x-4 sm:grid-cols-2">
          {LOSSES.map(({ path, label, quantity }) => (
            <NumberSetting
              key={path}
              control={control}
              path={path}
              label={label}
              unit={fieldUnit(quantity, units)}
              error={errors[path]?.message}
            />
          ))}
        </div>
        <div className="mt-6 flex items-center gap-2">
          <input
            id="brewhouse-has-report"
            type="checkbox"
            className="h-5 w-5 accent-copper"
            checked={report !== null}
            onChange={(event) => {
              if (!event.target.checked) setKeptReport(getValues('waterReport') ?? EMPTY_REPORT);
              setValue('waterReport', event.target.checked ? keptReport : null, { shouldDirty: true });
            }}
          />
          <label htmlFor="brewhouse-has-report" className="font-sans text-sm font-semibold">
            I have a report of my water
          </label>
        </div>
        {report !== null && (
          <div className="mt-2">
            <InputField
              id="brewhouse-report-name"
              label="Name of this water"
              error={errors.waterReport?.name?.message}
              hint="Shown in the recipe editor as a source water."
              registration={register('waterReport.name')}
            />
            <div className="grid grid-cols-2 gap-x-4 sm:grid-cols-3">
              {ION_NAMES.map((ion) => (
                <NumberSetting
                  key={ion}
                  control={control}
                  path={`waterReport.${ion}`}
                  label={ION_LABEL[ion]}
                  unit={plainUnit(DISPLAY_UNITS[units].concentration, 1)}
                  error={errors.waterReport?.[ion]?.message}
                />
              ))}
            </div>
          </div>
        )}
        <FormSubmit
          formError={formError}
          errorClassName="kf-field-error mt-4"
          submitting={isSubmitting}
          idle="Save losses and water"
          busy="Saving…"
          buttonClassName="kf-btn mt-4"
        />
      </fieldset>
    </form>
  );
}
