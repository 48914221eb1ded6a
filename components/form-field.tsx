import type { ReactNode } from 'react';

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
