'use client';

import { useRef } from 'react';
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { describedBy } from '@/components/form-field';
import { ION_NAMES } from '@/lib/brewing/schema';
import { DISPLAY_UNITS, type UnitSystem } from '@/lib/brewing/units';
import { ION_LABEL } from '@/lib/format';
import { EditorSection, NumberField, SelectField, fieldId, useErrorAt } from './editor-fields';
import { emptyNumber, newCarbonation, newWater, type EditorValues } from './editor-form';
import { fieldUnit, plainUnit } from './field-units';
import { RowList } from './row-list';
import { AcidPanel, SaltPlanPanel, SourceWaterPicker, TargetPicker } from './water-design';

const SALT_OPTIONS = [
  ['gypsum', 'Gypsum (calcium sulfate)'],
  ['calcium_chloride', 'Calcium chloride'],
  ['epsom', 'Epsom salt (magnesium sulfate)'],
  ['table_salt', 'Table salt (sodium chloride)'],
  ['baking_soda', 'Baking soda (sodium bicarbonate)'],
] as const;

type OptionalPart = 'document.water' | 'document.carbonation';
type PartValue = EditorValues['document']['water'] | EditorValues['document']['carbonation'];

/**
 * An optional part of the recipe behind a checkbox. Switching it off keeps
 * what was typed, so switching it on again brings it back.
 */
function usePartSwitch(path: OptionalPart, makeNew: () => PartValue) {
  const { setValue, getValues } = useFormContext<EditorValues>();
  const value = useWatch<EditorValues, OptionalPart>({ name: path });
  const kept = useRef<PartValue>(undefined);
  const on = value !== undefined;
  const toggle = (wanted: boolean) => {
    if (wanted === on) return;
    if (!wanted) kept.current = getValues(path);
    const next = wanted ? (kept.current ?? makeNew()) : undefined;
    // Each caller pairs a path with its own part's value; setValue cannot follow that through the union.
    setValue(path, next as never, { shouldDirty: true });
  };
  return { on, toggle };
}

function PartCheckbox({
  id,
  label,
  checked,
  onChange,
}: {
  id: string;
  label: string;
  checked: boolean;
  onChange: (on: boolean) => void;
}) {
  return (
    <div className="flex items-center gap-2">
      <input
        id={id}
        type="checkbox"
        className="h-5 w-5 accent-copper"
        checked={checked}
        onChange={(event) => onChange(event.target.checked)}
      />
      <label htmlFor={id} className="font-sans text-sm font-semibold">
        {label}
      </label>
    </div>
  );
}

export function WaterSection({ units }: { units: UnitSystem }) {
  const { on, toggle } = usePartSwitch('document.water', newWater);
  return (
    <EditorSection
      id="water"
      title="Water"
      description="Optional. Pick the water you start from and the water you want; Kettlefork proposes the salts."
    >
      <PartCheckbox id="kf-water-on" label="Include a water profile" checked={on} onChange={toggle} />
      {on && <WaterFields units={units} />}
    </EditorSection>
  );
}

function WaterFields({ units }: { units: UnitSystem }) {
  const { control } = useFormContext<EditorValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'document.water.salts' });
  const concentration = plainUnit(DISPLAY_UNITS[units].concentration, 1);
  return (
    <div className="mt-4 space-y-4">
      <NumberField
        path="document.water.volumeL"
        label="Water treated"
        unit={fieldUnit('volume', units)}
        hint="All the water the salts go into, mash and sparge together."
        className="max-w-xs"
      />
      <SourceWaterPicker />
      <fieldset>
        <legend className="kf-label">Source water</legend>
        <p className="font-sans text-xs text-muted">
          From your water report; all zero for distilled or reverse-osmosis water.
        </p>
        <div className="mt-2 grid grid-cols-2 gap-3 sm:grid-cols-3">
          {ION_NAMES.map((ion) => (
            <NumberField key={ion} path={`document.water.source.${ion}`} label={ION_LABEL[ion]} unit={concentration} />
          ))}
        </div>
      </fieldset>
      <TargetPicker units={units} />
      <SaltPlanPanel units={units} />
      <div>
        <h3 className="kf-label">Salts</h3>
        <RowList
          path="document.water.salts"
          noun="salt"
          keys={fields.map((field) => field.id)}
          maxRows={20}
          onAdd={() => append({ salt: 'gypsum', grams: emptyNumber() }, { shouldFocus: false })}
          onMove={move}
          onRemove={remove}
          emptyText="No salts added."
          renderRow={(i) => (
            <div className="grid grid-cols-2 gap-3">
              <SelectField path={`document.water.salts.${i}.salt`} label="Salt" options={SALT_OPTIONS} />
              <NumberField path={`document.water.salts.${i}.grams`} label="Amount" unit={plainUnit('g', 2)} />
            </div>
          )}
        />
      </div>
      <AcidPanel />
    </div>
  );
}

export function CarbonationSection({ units }: { units: UnitSystem }) {
  const { on, toggle } = usePartSwitch('document.carbonation', newCarbonation);
  return (
    <EditorSection
      id="carbonation"
      title="Carbonation"
      description="Optional. The numbers panel gives a keg pressure for it."
    >
      <PartCheckbox id="kf-carbonation-on" label="Include carbonation" checked={on} onChange={toggle} />
      {on && (
        <div className="mt-4 grid grid-cols-2 gap-3">
          <NumberField path="document.carbonation.volumesCO2" label="Carbonation" unit={plainUnit('volumes CO₂', 2)} />
          <NumberField
            path="document.carbonation.servingTempC"
            label="Serving temperature"
            unit={fieldUnit('temperature', units)}
          />
        </div>
      )}
    </EditorSection>
  );
}

export function NotesSection() {
  const { register } = useFormContext<EditorValues>();
  const error = useErrorAt('document.notes');
  const id = fieldId('document.notes');
  const hint = 'Markdown works: **bold**, *italic*, lists starting with "- ", links as [words](https://…).';
  return (
    <EditorSection id="notes" title="Notes">
      <label htmlFor={id} className="kf-label">
        Brewing notes
      </label>
      <textarea
        id={id}
        rows={8}
        className="kf-input font-serif"
        aria-invalid={Boolean(error) || undefined}
        aria-describedby={describedBy(id, error, hint)}
        {...register('document.notes')}
      />
      {error ? (
        <p id={`${id}-error`} className="kf-field-error">
          {error}
        </p>
      ) : (
        <p id={`${id}-hint`} className="mt-1 font-sans text-xs text-muted">
          {hint}
        </p>
      )}
    </EditorSection>
  );
}
