'use client';

import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { DEFAULT_HOP_STAND_TEMP_C } from '@/lib/brewing/bitterness';
import type { HopUse } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import {
  FERMENTABLE_SUGGESTIONS,
  HOP_SUGGESTIONS,
  YEAST_SUGGESTIONS,
  fermentableFill,
  hopFill,
  yeastFill,
} from './catalogue-fill';
import { EditorSection, NumberField, SelectField, SuggestionList, TextField } from './editor-fields';
import { emptyNumber, newFermentable, newHop, newYeast, type EditorValues } from './editor-form';
import { DAYS_FROM_MINUTES, fieldUnit, formatForInput, plainUnit } from './field-units';
import { RowList } from './row-list';

const PICK_HINT =
  'Names suggest from a starter list as you type; picking one fills in typical values. Any other name works too.';

const FERMENTABLE_KIND_OPTIONS = [
  ['grain', 'Grain'],
  ['extract', 'Extract'],
  ['sugar', 'Sugar'],
  ['adjunct', 'Adjunct'],
] as const;

const HOP_USE_OPTIONS = [
  ['boil', 'Boil'],
  ['first_wort', 'First wort'],
  ['mash', 'Mash'],
  ['whirlpool', 'Whirlpool (hop stand)'],
  ['dry_hop', 'Dry hop'],
] as const;

const HOP_FORM_OPTIONS = [
  ['pellet', 'Pellets'],
  ['leaf', 'Whole leaf'],
] as const;

const YEAST_KIND_OPTIONS = [
  ['ale', 'Ale'],
  ['lager', 'Lager'],
  ['kveik', 'Kveik'],
  ['wheat', 'Wheat'],
  ['wild', 'Wild'],
  ['other', 'Other'],
] as const;

const TIME_LABEL: Record<HopUse, string> = {
  boil: 'Boil time',
  first_wort: 'Boil time',
  mash: 'Mash time',
  whirlpool: 'Stand time',
  dry_hop: 'Contact time',
};

const FILL_OPTIONS = { shouldDirty: true, shouldValidate: true } as const;
const WIDE_GRID = 'grid grid-cols-2 gap-3 sm:grid-cols-6';
const GRID = 'grid grid-cols-2 gap-3 sm:grid-cols-4';
const NAME_SPAN = 'col-span-2';

export function FermentablesSection({ units }: { units: UnitSystem }) {
  const { control, setValue } = useFormContext<EditorValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'document.fermentables' });
  const potential = plainUnit('ppg', 1);
  return (
    <EditorSection
      id="fermentables"
      title="Fermentables"
      description={`Malts, extracts, sugars and adjuncts. ${PICK_HINT}`}
    >
      <SuggestionList id="kf-fermentable-names" names={FERMENTABLE_SUGGESTIONS} />
      <RowList
        path="document.fermentables"
        noun="fermentable"
        keys={fields.map((field) => field.id)}
        maxRows={50}
        namePath={(i) => `document.fermentables.${i}.name`}
        onAdd={() => append(newFermentable(), { shouldFocus: false })}
        onMove={move}
        onRemove={remove}
        emptyText="No fermentables yet. A recipe needs at least one."
        renderRow={(i) => (
          <div className={WIDE_GRID}>
            <TextField
              path={`document.fermentables.${i}.name`}
              label="Name"
              suggestions="kf-fermentable-names"
              className={NAME_SPAN}
              onPicked={(name) => {
                const fill = fermentableFill(name);
                if (!fill) return;
                setValue(`document.fermentables.${i}.potentialPpg`, fill.potentialPpg, FILL_OPTIONS);
                setValue(`document.fermentables.${i}.colorLovibond`, fill.colorLovibond, FILL_OPTIONS);
                setValue(`document.fermentables.${i}.kind`, fill.kind, FILL_OPTIONS);
              }}
            />
            <NumberField path={`document.fermentables.${i}.amountKg`} label="Amount" unit={fieldUnit('mass', units)} />
            <NumberField path={`document.fermentables.${i}.potentialPpg`} label="Potential" unit={potential} />
            <NumberField path={`document.fermentables.${i}.colorLovibond`} label="Colour" unit={plainUnit('°L', 1)} />
            <SelectField path={`document.fermentables.${i}.kind`} label="Kind" options={FERMENTABLE_KIND_OPTIONS} />
          </div>
        )}
      />
    </EditorSection>
  );
}

export function HopsSection({ units }: { units: UnitSystem }) {
  const { control } = useFormContext<EditorValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'document.hops' });
  return (
    <EditorSection
      id="hops"
      title="Hops"
      description={`Every addition is its own row, even when the variety repeats. ${PICK_HINT}`}
    >
      <SuggestionList id="kf-hop-names" names={HOP_SUGGESTIONS} />
      <RowList
        path="document.hops"
        noun="hop"
        keys={fields.map((field) => field.id)}
        maxRows={50}
        namePath={(i) => `document.hops.${i}.name`}
        onAdd={() => append(newHop(), { shouldFocus: false })}
        onMove={move}
        onRemove={remove}
        emptyText="No hops yet."
        renderRow={(i) => <HopRow index={i} units={units} />}
      />
    </EditorSection>
  );
}

function HopRow({ index, units }: { index: number; units: UnitSystem }) {
  const { setValue } = useFormContext<EditorValues>();
  const use = useWatch<EditorValues, `document.hops.${number}.use`>({ name: `document.hops.${index}.use` });
  const timeUnit = use === 'dry_hop' ? DAYS_FROM_MINUTES : plainUnit('min', 1);
  const temperature = fieldUnit('temperature', units);
  return (
    <div className={GRID}>
      <TextField
        path={`document.hops.${index}.name`}
        label="Name"
        suggestions="kf-hop-names"
        className={NAME_SPAN}
        onPicked={(name) => {
          const fill = hopFill(name);
          if (fill) setValue(`document.hops.${index}.alphaPct`, fill.alphaPct, FILL_OPTIONS);
        }}
      />
      <NumberField path={`document.hops.${index}.amountG`} label="Amount" unit={fieldUnit('hopMass', units)} />
      <NumberField path={`document.hops.${index}.alphaPct`} label="Alpha acid" unit={plainUnit('%', 1)} />
      <SelectField
        path={`document.hops.${index}.use`}
        label="Use"
        options={HOP_USE_OPTIONS}
        onChosen={(chosen) => {
          if (chosen !== 'whirlpool') setValue(`document.hops.${index}.tempC`, emptyNumber(), { shouldDirty: true });
        }}
      />
      <NumberField
        key={timeUnit.label}
        path={`document.hops.${index}.timeMin`}
        label={TIME_LABEL[use] ?? 'Time'}
        unit={timeUnit}
      />
      <SelectField path={`document.hops.${index}.form`} label="Form" options={HOP_FORM_OPTIONS} />
      {use === 'whirlpool' && (
        <NumberField
          path={`document.hops.${index}.tempC`}
          label="Stand temperature"
          unit={temperature}
          hint={`Leave empty for ${formatForInput(DEFAULT_HOP_STAND_TEMP_C, temperature)} ${temperature.label}.`}
        />
      )}
    </div>
  );
}

export function YeastsSection({ units }: { units: UnitSystem }) {
  const { control, setValue } = useFormContext<EditorValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'document.yeasts' });
  const temperature = fieldUnit('temperature', units);
  return (
    <EditorSection
      id="yeasts"
      title="Yeast"
      description={`With more than one yeast, the most attenuative sets the final gravity. ${PICK_HINT}`}
    >
      <SuggestionList id="kf-yeast-names" names={YEAST_SUGGESTIONS} />
      <RowList
        path="document.yeasts"
        noun="yeast"
        keys={fields.map((field) => field.id)}
        maxRows={10}
        namePath={(i) => `document.yeasts.${i}.name`}
        onAdd={() => append(newYeast(), { shouldFocus: false })}
        onMove={move}
        onRemove={remove}
        emptyText="No yeast yet. A recipe needs at least one."
        renderRow={(i) => (
          <div className={GRID}>
            <TextField
              path={`document.yeasts.${i}.name`}
              label="Name"
              suggestions="kf-yeast-names"
              className={NAME_SPAN}
              onPicked={(name) => {
                const fill = yeastFill(name);
                if (!fill) return;
                setValue(`document.yeasts.${i}.kind`, fill.kind, FILL_OPTIONS);
                setValue(`document.yeasts.${i}.attenuationPct`, fill.attenuationPct, FILL_OPTIONS);
                setValue(`document.yeasts.${i}.tempMinC`, fill.tempMinC, FILL_OPTIONS);
                setValue(`document.yeasts.${i}.tempMaxC`, fill.tempMaxC, FILL_OPTIONS);
              }}
            />
            <SelectField path={`document.yeasts.${i}.kind`} label="Kind" options={YEAST_KIND_OPTIONS} />
            <NumberField path={`document.yeasts.${i}.attenuationPct`} label="Attenuation" unit={plainUnit('%', 1)} />
            <NumberField
              path={`document.yeasts.${i}.tempMinC`}
              label="Lowest temperature"
              unit={temperature}
              hint="Optional"
            />
            <NumberField
              path={`document.yeasts.${i}.tempMaxC`}
              label="Highest temperature"
              unit={temperature}
              hint="Optional"
            />
          </div>
        )}
      />
    </EditorSection>
  );
}
