'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEventHandler, type ReactNode } from 'react';
import type { FieldValues, UseFormRegisterReturn, UseFormSetError } from 'react-hook-form';
import { toast } from 'sonner';
import { setServerErrors } from '@/components/form-errors';
import { FormField, FormSubmit, describedBy } from '@/components/form-field';
import { requestJson } from '@/lib/http/client';

/**
 * Sends a form that adds an entry to a brew day (a reading, a tasting): the server's field
 * messages go beside their fields and its message above the button; once added, the form is
 * cleared and the page read again.
 */
export function useAddToBrewDay<T extends FieldValues, Output>({
  url,
  added,
  setError,
  reset,
}: {
  url: string;
  /** Said once the entry is saved, e.g. "Reading added." */
  added: string;
  setError: UseFormSetError<T>;
  reset: () => void;
}): { formError: string | undefined; onSubmit: (values: Output) => Promise<void> } {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const onSubmit = async (values: Output) => {
    setFormError(undefined);
    const result = await requestJson(url, 'POST', values);
    if (!result.ok) {
      setServerErrors(setError, result.fields);
      setFormError(result.message);
      return;
    }
    toast.success(added);
    reset();
    router.refresh();
  };
  return { formError, onSubmit };
}

/** A date of a brew-day form, with its message beside it. */
export function DateField({
  id,
  label,
  registration,
  error,
  min,
  className = '',
}: {
  id: string;
  label: string;
  registration: UseFormRegisterReturn;
  error?: string;
  min?: string;
  className?: string;
}) {
  return (
    <FormField id={id} label={label} error={error} className={className}>
      <input
        id={id}
        type="date"
        min={min}
        className="kf-input"
        {...registration}
        aria-invalid={Boolean(error) || undefined}
        aria-describedby={describedBy(id, error)}
      />
    </FormField>
  );
}

/** The card a brew-day entry is added with: its heading, its fields in two columns, its button. */
export function EntryCard({
  name,
  title,
  onSubmit,
  formError,
  submitting,
  idle,
  children,
}: {
  /** Names the form's heading id: `${name}-title`. */
  name: string;
  title: string;
  onSubmit: FormEventHandler<HTMLFormElement>;
  formError?: string;
  submitting: boolean;
  idle: string;
  children: ReactNode;
}) {
  return (
    <form onSubmit={onSubmit} noValidate className="kf-card" aria-labelledby={`${name}-title`}>
      <h3 id={`${name}-title`} className="font-semibold">
        {title}
      </h3>
      <div className="mt-2 grid gap-3 sm:grid-cols-2">{children}</div>
      <FormSubmit
        formError={formError}
        errorClassName="mt-2 font-sans text-sm text-danger"
        submitting={submitting}
        idle={idle}
        busy="Adding…"
        buttonClassName="kf-btn mt-3"
      />
    </form>
  );
}
