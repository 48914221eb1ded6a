'use client';

import { useRef, useState, type ReactNode } from 'react';
import { Controller, useFieldArray, useFormContext, useFormState, useWatch } from 'react-hook-form';
import { describedBy } from '@/components/form-field';
import { findStyle, styleCategories } from '@/lib/brewing/styles';
import type { RecipeDocument } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import { yeastTemperatureFlags, type YeastTemperatureFlag } from '@/lib/brewing/yeast-temperature';
import { formatAmount } from '@/lib/format';
import { EditorSection, NumberField, TextField, errorMessageAt, fieldId } from './editor-fields';
import { newFermentationStep, newMashStep, newSpunding, type EditorValues } from './editor-form';
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

export function BatchSection({ units, children }: { units: UnitSystem; children?: ReactNode }) {
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
      {children}
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
      <YeastTemperatureNotes units={units} />
      <SpundingFields units={units} />
    </EditorSection>
  );
}

/** What a flag says: which step, which yeast, and what it means for the beer. */
function yeastFlagSentence(flag: YeastTemperatureFlag, units: UnitSystem): string {
  const at = formatAmount(flag.tempC, 'temperature', units);
  const limit = formatAmount(flag.limitC, 'temperature', units);
  return flag.side === 'below'
    ? `Step ${flag.stepIndex + 1} at ${at} is below ${flag.yeastName}’s lowest ${limit}: it may ferment slowly or stall.`
    : `Step ${flag.stepIndex + 1} at ${at} is above ${flag.yeastName}’s highest ${limit}: expect more fruity esters and harsh fusel alcohols.`;
}

function isNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

function YeastTemperatureNotes({ units }: { units: UnitSystem }) {
  const yeasts = useWatch<EditorValues, 'document.yeasts'>({ name: 'document.yeasts' }) ?? [];
  const steps = useWatch<EditorValues, 'document.fermentation.steps'>({ name: 'document.fermentation.steps' }) ?? [];
  const doc: Pick<RecipeDocument, 'yeasts' | 'fermentation'> = {
    yeasts: yeasts.map((yeast) => ({
      ...yeast,
      name: yeast.name?.trim() || 'the yeast',
      tempMinC: isNumber(yeast.tempMinC) ? yeast.tempMinC : undefined,
      tempMaxC: isNumber(yeast.tempMaxC) ? yeast.tempMaxC : undefined,
    })),
    // A step still being typed keeps its place, so the step numbers stay right; it cannot be flagged yet.
    fermentation: { steps: steps.map((step) => ({ tempC: isNumber(step.tempC) ? step.tempC : Number.NaN, days: 1 })) },
  };
  const flags = yeastTemperatureFlags(doc);
  if (flags.length === 0) return null;
  return (
    <div
      role="status"
      className="mt-3 rounded-md border border-caution p-3 font-sans text-sm"
      id="yeast-temperature-flags"
    >
      <p className="font-semibold text-caution">Outside the yeast’s temperature range</p>
      <ul className="mt-1 list-disc pl-5">
        {flags.map((flag) => (
          <li key={`${flag.stepIndex}-${flag.yeastName}`}>{yeastFlagSentence(flag, units)}</li>
        ))}
      </ul>
    </div>
  );
}

function SpundingFields({ units }: { units: UnitSystem }) {
  const { setValue, getValues } = useFormContext<EditorValues>();
  const spunding = useWatch<EditorValues, 'document.fermentation.spunding'>({ name: 'document.fermentation.spunding' });
  const kept = useRef(spunding);
  const on = spunding !== undefined;
  const toggle = (wanted: boolean) => {
    if (!wanted) kept.current = getValues('document.fermentation.spunding');
    setValue('document.fermentation.spunding', wanted ? (kept.current ?? newSpunding()) : undefined, {
      shouldDirty: true,
    });
  };
  return (
    <div className="mt-4 rounded-md border border-line p-3">
      <div className="flex items-center gap-2">
        <input
          id="kf-spunding-on"
          type="checkbox"
          className="h-5 w-5 accent-copper"
          checked={on}
          onChange={(event) => toggle(event.target.checked)}
        />
        <label htmlFor="kf-spunding-on" className="font-sans text-sm font-semibold">
          Spund: cap the fermenter with a pressure-relief valve near the end of fermentation
        </label>
      </div>
      {on && (
        <>
          <div className="mt-3 grid grid-cols-2 gap-3">
            <NumberField
              path="document.fermentation.spunding.pressureKPa"
              label="Valve setting"
              unit={fieldUnit('pressure', units)}
              hint="Gauge pressure."
            />
            <NumberField
              path="document.fermentation.spunding.tempC"
              label="Beer temperature"
              unit={fieldUnit('temperature', units)}
            />
          </div>
          <p className="mt-2 font-sans text-xs text-caution">
            Caution: only a vessel rated for pressure may be sealed. Keep the valve below the vessel maker’s rated
            pressure, fit a working pressure-relief valve, and never exceed the maker’s limit. The numbers panel shows
            the carbonation this setting gives.
          </p>
        </>
      )}
    </div>
  );
}
