'use client';

import type { ReactNode } from 'react';
import { Controller, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { FormField, describedBy } from '@/components/form-field';
import type { FieldUnit } from '@/components/recipe-editor/field-units';
import { UnitNumberInput } from '@/components/recipe-editor/unit-number-input';

/** "Boil-off rate (L/h)", the unit greyed when `muted`; a unit with no label adds nothing. */
function labelWithUnit(label: string, unit: FieldUnit, muted: boolean): ReactNode {
  if (!unit.label) return label;
  if (!muted) return `${label} (${unit.label})`;
  return (
    <>
      {label} <span className="text-muted">({unit.label})</span>
    </>
  );
}

/**
 * A labelled number field of a react-hook-form form that shows the member's unit and stores
 * metric: the recipe editor's numbers and the brewhouse settings use it alike.
 */
export function UnitNumberField<T extends FieldValues>({
  control,
  name,
  id,
  label,
  unit,
  error,
  hint,
  className,
  announce,
  mutedUnit = false,
}: {
  control: Control<T>;
  name: FieldPath<T>;
  id: string;
  label: string;
  unit: FieldUnit;
  error?: string;
  hint?: string;
  className?: string;
  announce?: boolean;
  /** Greys the unit after the label, as the brew-day forms show it. */
  mutedUnit?: boolean;
}) {
  return (
    <FormField
      id={id}
      label={labelWithUnit(label, unit, mutedUnit)}
      error={error}
      hint={hint}
      className={className}
      announce={announce}
    >
      <Controller
        control={control}
        name={name}
        render={({ field }) => (
          <UnitNumberInput
            id={id}
            name={field.name}
            value={field.value as number | null | undefined}
            onChange={field.onChange}
            onBlur={field.onBlur}
            inputRef={field.ref}
            unit={unit}
            invalid={Boolean(error)}
            describedBy={describedBy(id, error, hint)}
          />
        )}
      />
    </FormField>
  );
}
