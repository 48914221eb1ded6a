'use client';

import type { ReactNode } from 'react';
import { get, useFormContext, useFormState, type FieldErrors, type FieldPath } from 'react-hook-form';
import { FormField, describedBy } from '@/components/form-field';
import { UnitNumberField } from '@/components/unit-number-field';
import type { EditorValues } from './editor-form';
import type { FieldUnit } from './field-units';

export type EditorPath = FieldPath<EditorValues>;

/** One id per form path: `document.hops.2.alphaPct` → `kf-document-hops-2-alphaPct`. */
export function fieldId(path: string): string {
  return `kf-${path.replace(/\./g, '-')}`;
}

/** The message at a path; a list's own message sits at `root` when the list is a field array. */
export function errorMessageAt(errors: FieldErrors<EditorValues>, path: string): string | undefined {
  const error = get(errors, path) as { message?: unknown; root?: { message?: unknown } } | undefined;
  if (!error) return undefined;
  const message = error.root?.message ?? error.message;
  return typeof message === 'string' ? message : undefined;
}

export function useErrorAt(path: string): string | undefined {
  const { errors } = useFormState<EditorValues>({ name: path as EditorPath });
  return errorMessageAt(errors, path);
}

/** The editor's fields sit in grids (`min-w-0`) and leave their errors to be read with the field. */
function FieldShell({
  id,
  label,
  error,
  hint,
  className = '',
  children,
}: {
  id: string;
  label: string;
  error?: string;
  hint?: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <FormField id={id} label={label} error={error} hint={hint} className={`min-w-0 ${className}`} announce={false}>
      {children}
    </FormField>
  );
}

export function NumberField({
  path,
  label,
  unit,
  hint,
  className = '',
}: {
  path: EditorPath;
  label: string;
  unit: FieldUnit;
  hint?: string;
  className?: string;
}) {
  const { control } = useFormContext<EditorValues>();
  const error = useErrorAt(path);
  return (
    <UnitNumberField
      control={control}
      name={path}
      id={fieldId(path)}
      label={label}
      unit={unit}
      error={error}
      hint={hint}
      className={`min-w-0 ${className}`}
      announce={false}
    />
  );
}

/** Empty text is "not given" for optional names (a mash step's), not an empty name. */
function blankAsUndefined(value: unknown): unknown {
  return typeof value === 'string' && value.trim() === '' ? undefined : value;
}

export function TextField({
  path,
  label,
  hint,
  className,
  suggestions,
  optional = false,
  onPicked,
}: {
  path: EditorPath;
  label: string;
  hint?: string;
  className?: string;
  /** Id of a `<datalist>` offering names. */
  suggestions?: string;
  optional?: boolean;
  /** Called with each new text, so a catalogue name can fill its typical values. */
  onPicked?: (text: string) => void;
}) {
  const { register } = useFormContext<EditorValues>();
  const error = useErrorAt(path);
  const id = fieldId(path);
  return (
    <FieldShell id={id} label={label} error={error} hint={hint} className={className}>
      <input
        id={id}
        type="text"
        list={suggestions}
        autoComplete="off"
        className="kf-input"
        aria-invalid={Boolean(error) || undefined}
        aria-describedby={describedBy(id, error, hint)}
        {...register(path, {
          setValueAs: optional ? blankAsUndefined : undefined,
          onChange: onPicked ? (event) => onPicked(event.target.value) : undefined,
        })}
      />
    </FieldShell>
  );
}

export function SelectField({
  path,
  label,
  options,
  className,
  onChosen,
}: {
  path: EditorPath;
  label: string;
  options: readonly (readonly [value: string, words: string])[];
  className?: string;
  onChosen?: (value: string) => void;
}) {
  const { register } = useFormContext<EditorValues>();
  const error = useErrorAt(path);
  const id = fieldId(path);
  return (
    <FieldShell id={id} label={label} error={error} className={className}>
      <select
        id={id}
        className="kf-input"
        aria-invalid={Boolean(error) || undefined}
        aria-describedby={describedBy(id, error)}
        {...register(path, { onChange: onChosen ? (event) => onChosen(event.target.value) : undefined })}
      >
        {options.map(([value, words]) => (
          <option key={value} value={value}>
            {words}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}

/** A list's own message (too many fermentables, salts over the limit). */
export function ListError({ path }: { path: EditorPath }) {
  const error = useErrorAt(path);
  if (!error) return null;
  return (
    <p id={`${fieldId(path)}-error`} className="kf-field-error">
      {error}
    </p>
  );
}

export function SuggestionList({ id, names }: { id: string; names: readonly string[] }) {
  return (
    <datalist id={id}>
      {names.map((name) => (
        <option key={name} value={name} />
      ))}
    </datalist>
  );
}

export function EditorSection({
  id,
  title,
  description,
  children,
}: {
  id: string;
  title: string;
  description?: string;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={`${id}-title`} className="kf-card">
      <h2 id={`${id}-title`} className="text-xl font-semibold">
        {title}
      </h2>
      {description && <p className="mt-1 font-sans text-sm text-muted">{description}</p>}
      <div className="mt-3">{children}</div>
    </section>
  );
}
