'use client';

import { useState } from 'react';
import { Controller, useFieldArray, useFormContext, useFormState } from 'react-hook-form';
import { describedBy } from '@/components/form-field';
import { findStyle, styleCategories } from '@/lib/brewing/styles';
import type { UnitSystem } from '@/lib/brewing/units';
import { EditorSection, NumberField, TextField, errorMessageAt, fieldId } from './editor-fields';
import { newFermentationStep, newMashStep, type EditorValues } from './editor-form';
import { fieldUnit, plainUnit } from './field-units';
import { RowList } from './row-list';

const STYLE_CATEGORIES = styleCategories();
const BREWHOUSE_FIELDS = ['boilOffLPerHour', 'trubLossL', 'grainAbsorptionLPerKg', 'mashWaterLPerKg'] as const;

export function StyleField() {
  const { control } = useFormContext<EditorValues>();
  const id = fieldId('document.style');
  const hint = 'The numbers panel shows how the recipe sits in the style’s ranges.';
  return (
    <Controller
      control={control}
      name="document.style"
      render={({ field, fieldState }) => {
        const code = field.value?.code ?? '';
        const unknownCode = code !== '' && !findStyle(code);
        const error =
          fieldState.error?.message ?? (fieldState.error as { code?: { message?: string } } | undefined)?.code?.message;
        return (
          <div>
            <label htmlFor={id} className="kf-label">
              Style
            </label>
            <select
              id={id}
              ref={field.ref}
              className="kf-input"
              value={code}
              aria-invalid={Boolean(error) || undefined}
              aria-describedby={describedBy(id, error, hint)}
              onBlur={field.onBlur}
              onChange={(event) => {
                const style = findStyle(event.target.value);
                field.onChange(style ? { code: style.code, name: style.name } : undefined);
              }}
            >
              <option value="">No style</option>
              {unknownCode && (
                <option value={code}>
                  {code} {field.value?.name}
                </option>
              )}
              {STYLE_CATEGORIES.map((category) => (
                <optgroup key={category.name} label={category.name}>
                  {category.styles.map((style) => (
                    <option key={style.code} value={style.code}>
                      {style.code} {style.name}
                    </option>
                  ))}
                </optgroup>
              ))}
            </select>
            {error ? (
              <p id={`${id}-error`} className="kf-field-error">
                {error}
              </p>
            ) : (
              <p id={`${id}-hint`} className="mt-1 font-sans text-xs text-muted">
                {hint}
              </p>
            )}
          </div>
        );
      }}
    />
  );
}

export function BatchSection({ units }: { units: UnitSystem }) {
  const { errors } = useFormState<EditorValues>({ name: 'document.batch' });
  const detailsHaveError = BREWHOUSE_FIELDS.some((name) => errorMessageAt(errors, `document.batch.${name}`));
  const [open, setOpen] = useState(false);
  const volume = fieldUnit('volume', units);
  const thickness = fieldUnit('litresPerKg', units);
  return (
    <EditorSection id="batch" title="Batch">
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        <NumberField path="document.batch.volumeL" label="Batch volume" unit={volume} hint="Into the fermenter." />
        <NumberField path="document.batch.boilTimeMin" label="Boil time" unit={plainUnit('min', 0)} />
        <NumberField path="document.batch.efficiencyPct" label="Brewhouse efficiency" unit={plainUnit('%', 1)} />
      </div>
      <details
        className="mt-4 rounded-md border border-line p-3"
        open={open || detailsHaveError}
        onToggle={(event) => setOpen(event.currentTarget.open)}
      >
        <summary className="cursor-pointer font-sans text-sm font-semibold">
          Brewhouse details: losses and mash thickness
        </summary>
        <div className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-4">
          <NumberField
            path="document.batch.boilOffLPerHour"
            label="Boil-off rate"
            unit={fieldUnit('volumePerHour', units)}
          />
          <NumberField path="document.batch.trubLossL" label="Kettle trub loss" unit={volume} />
          <NumberField path="document.batch.grainAbsorptionLPerKg" label="Grain absorption" unit={thickness} />
          <NumberField path="document.batch.mashWaterLPerKg" label="Mash thickness" unit={thickness} />
        </div>
      </details>
    </EditorSection>
  );
}

export function MashSection({ units }: { units: UnitSystem }) {
  const { control } = useFormContext<EditorValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'document.mash.steps' });
  return (
    <EditorSection
      id="mash"
      title="Mash"
      description="Rests between 60 and 72 °C (140–162 °F) set how fermentable the wort is."
    >
      <RowList
        path="document.mash.steps"
        noun="mash step"
        keys={fields.map((field) => field.id)}
        maxRows={20}
        namePath={(i) => `document.mash.steps.${i}.name`}
        onAdd={() => append(newMashStep(), { shouldFocus: false })}
        onMove={move}
        onRemove={remove}
        emptyText="No mash steps: fine for an extract brew."
        renderRow={(i) => (
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            <TextField
              path={`document.mash.steps.${i}.name`}
              label="Step name"
              hint="Optional"
              optional
              className="col-span-2 sm:col-span-1"
            />
            <NumberField
              path={`document.mash.steps.${i}.tempC`}
              label="Temperature"
              unit={fieldUnit('temperature', units)}
            />
            <NumberField path={`document.mash.steps.${i}.timeMin`} label="Time" unit={plainUnit('min', 0)} />
          </div>
        )}
      />
    </EditorSection>
  );
}

export function FermentationSection({ units }: { units: UnitSystem }) {
  const { control } = useFormContext<EditorValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'document.fermentation.steps' });
  return (
    <EditorSection
      id="fermentation"
      title="Fermentation"
      description="Each step holds the beer at one temperature for some days."
    >
      <RowList
        path="document.fermentation.steps"
        noun="fermentation step"
        keys={fields.map((field) => field.id)}
        maxRows={20}
        onAdd={() => append(newFermentationStep(), { shouldFocus: false })}
        onMove={move}
        onRemove={remove}
        emptyText="No fermentation steps yet."
        renderRow={(i) => (
          <div className="grid grid-cols-2 gap-3">
            <NumberField
              path={`document.fermentation.steps.${i}.tempC`}
              label="Temperature"
              unit={fieldUnit('temperature', units)}
            />
            <NumberField path={`document.fermentation.steps.${i}.days`} label="Days" unit={plainUnit('', 1)} />
          </div>
        )}
      />
    </EditorSection>
  );
}
