import type { InputHTMLAttributes, ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

/**
 * A labelled control with its hint and error, wired for screen readers. A form of few fields
 * announces each error as it appears (`announce`); a long one such as the recipe editor leaves
 * them to be read with the field, so a save does not read out a dozen at once.
 */
export function FormField({
  id,
  label,
  error,
  hint,
  className = 'mt-4',
  announce = true,
  children,
}: {
  id: string;
  label: ReactNode;
  error?: string;
  hint?: string;
  className?: string;
  announce?: boolean;
  children: ReactNode;
}) {
  return (
    <div className={className}>
      <label htmlFor={id} className="kf-label">
        {label}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="mt-1 font-sans text-xs text-muted">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} role={announce ? 'alert' : undefined} className="kf-field-error">
          {error}
        </p>
      )}
    </div>
  );
}

export function describedBy(id: string, error?: string, hint?: string): string | undefined {
  return error ? `${id}-error` : hint ? `${id}-hint` : undefined;
}

/**
 * A labelled input of a react-hook-form form: its error and hint beside it, and the input marked
 * invalid and described by whichever shows. Other input attributes (type, autoComplete…) pass on.
 */
export function InputField({
  id,
  label,
  error,
  hint,
  registration,
  ...input
}: {
  id: string;
  label: ReactNode;
  error?: string;
  hint?: string;
  registration: UseFormRegisterReturn;
} & Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'className' | keyof UseFormRegisterReturn>) {
  return (
    <FormField id={id} label={label} error={error} hint={hint}>
      <input
        id={id}
        className="kf-input"
        {...input}
        aria-invalid={Boolean(error)}
        aria-describedby={describedBy(id, error, hint)}
        {...registration}
      />
    </FormField>
  );
}

/**
 * A form's own message (a refusal no field shows), then its submit button, which says `busy`
 * and is disabled while the form is sent (or while `disabled`).
 */
export function FormSubmit({
  formError,
  errorId,
  errorClassName = 'kf-field-error',
  submitting,
  disabled = false,
  idle,
  busy,
  buttonClassName = 'kf-btn',
}: {
  formError?: string;
  errorId?: string;
  errorClassName?: string;
  submitting: boolean;
  disabled?: boolean;
  idle: string;
  busy: string;
  buttonClassName?: string;
}) {
  return (
    <>
      {formError && (
        <p id={errorId} role="alert" className={errorClassName}>
          {formError}
        </p>
      )}
      <button type="submit" className={buttonClassName} disabled={submitting || disabled}>
        {submitting ? busy : idle}
      </button>
    </>
  );
}
