'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { toast } from 'sonner';
import { z } from 'zod';
import { showRefusal } from '@/components/form-errors';
import { describedBy, FormField, FormSubmit, InputField } from '@/components/form-field';
import { meKeys } from '@/hooks/use-me';
import { gallonsToLitres, litresToGallons } from '@/lib/brewing/units';
import { requestJson } from '@/lib/http/client';
import { settingsSchema, type SettingsInput } from '@/lib/community/schemas';
import { KIND_LABELS, NOTIFICATION_KINDS } from '@/lib/notifications/kinds';

// The form shows the batch volume in the member's chosen units; the server keeps litres.
const formSchema = settingsSchema.omit({ defaultBatchVolumeL: true }).extend({
  batchVolume: z
    .number({ error: 'Give the batch volume as a number.' })
    .positive('The batch volume must be more than zero.'),
});
type FormValues = z.infer<typeof formSchema>;

/** The input that shows a server message; the rest (the e-mail choices) go above the button. */
function settingsFieldFor(path: string): string | undefined {
  if (path === 'defaultBatchVolumeL') return 'batchVolume';
  return ['name', 'bio', 'units', 'defaultEfficiencyPct'].includes(path) ? path : undefined;
}

const round = (n: number, places = 2) => Math.round(n * 10 ** places) / 10 ** places;

export function SettingsForm({ initial }: { initial: SettingsInput }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, control, getValues, setValue, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: {
      name: initial.name,
      bio: initial.bio,
      units: initial.units,
      batchVolume: round(
        initial.units === 'us' ? litresToGallons(initial.defaultBatchVolumeL) : initial.defaultBatchVolumeL,
      ),
      defaultEfficiencyPct: initial.defaultEfficiencyPct,
      emailChoices: initial.emailChoices,
    },
  });
  const { errors, isSubmitting } = formState;
  const units = useWatch({ control, name: 'units' });
  const volumeUnit = units === 'us' ? 'gal' : 'L';

  const onSubmit = handleSubmit(async ({ batchVolume, ...values }) => {
    setFormError(undefined);
    const body: SettingsInput = {
      ...values,
      defaultBatchVolumeL: round(values.units === 'us' ? gallonsToLitres(batchVolume) : batchVolume, 3),
    };
    const result = await requestJson('/api/me/settings', 'PUT', body);
    if (!result.ok) {
      setFormError(showRefusal(setError, result, settingsFieldFor));
      return;
    }
    toast.success('Settings saved.');
    await queryClient.invalidateQueries({ queryKey: meKeys.all });
    router.refresh();
  });

  const text = (name: 'name' | 'bio', label: string, hint?: string) => (
    <FormField id={`settings-${name}`} label={label} error={errors[name]?.message} hint={hint}>
      {name === 'bio' ? (
        <textarea
          id="settings-bio"
          rows={5}
          className="kf-input"
          aria-invalid={Boolean(errors.bio)}
          aria-describedby={describedBy('settings-bio', errors.bio?.message, hint)}
          {...register('bio')}
        />
      ) : (
        <input
          id="settings-name"
          className="kf-input"
          autoComplete="nickname"
          aria-invalid={Boolean(errors.name)}
          aria-describedby={describedBy('settings-name', errors.name?.message, hint)}
          {...register('name')}
        />
      )}
    </FormField>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="mt-4">
      <fieldset className="kf-card">
        <legend className="px-1 text-lg font-semibold">Profile</legend>
        {text('name', 'Display name')}
        {text(
          'bio',
          'A few words about your brewing',
          'Shown on your member page. Markdown works; pictures show as links.',
        )}
      </fieldset>

      <fieldset className="kf-card mt-6">
        <legend className="px-1 text-lg font-semibold">Units and brewhouse</legend>
        <FormField id="settings-units" label="Units" error={errors.units?.message}>
          <select
            id="settings-units"
            className="kf-input"
            {...register('units', {
              onChange: (e: { target: { value: string } }) => {
                const v = getValues('batchVolume');
                if (Number.isFinite(v))
                  setValue('batchVolume', round(e.target.value === 'us' ? litresToGallons(v) : gallonsToLitres(v)));
              },
            })}
          >
            <option value="metric">Metric (kg, L, °C)</option>
            <option value="us">US (lb, gal, °F)</option>
          </select>
        </FormField>
        <InputField
          id="settings-volume"
          label={`Usual batch volume (${volumeUnit})`}
          type="number"
          step="any"
          inputMode="decimal"
          error={errors.batchVolume?.message}
          hint="New recipes start from this volume."
          registration={register('batchVolume', { valueAsNumber: true })}
        />
        <InputField
          id="settings-efficiency"
          label="Brewhouse efficiency (%)"
          type="number"
          step="any"
          inputMode="decimal"
          error={errors.defaultEfficiencyPct?.message}
          registration={register('defaultEfficiencyPct', { valueAsNumber: true })}
        />
      </fieldset>

      <fieldset className="kf-card mt-6">
        <legend className="px-1 text-lg font-semibold">E-mail me when…</legend>
        <p className="font-sans text-sm text-muted">
          Several notices close together arrive as one e-mail. You always see them under the bell.
        </p>
        <ul className="mt-3 space-y-2 font-sans text-sm">
          {NOTIFICATION_KINDS.map((kind) => (
            <li key={kind}>
              <label className="flex items-center gap-2">
                <input type="checkbox" {...register(`emailChoices.${kind}`)} />
                {KIND_LABELS[kind]}
              </label>
            </li>
          ))}
        </ul>
      </fieldset>

      <FormSubmit
        formError={formError}
        errorClassName="kf-field-error mt-4"
        submitting={isSubmitting}
        idle="Save settings"
        busy="Saving…"
        buttonClassName="kf-btn mt-6"
      />
    </form>
  );
}
