import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import type { FieldIssue } from '@/lib/errors';

/**
 * Puts the server's field messages beside the form's own fields and returns the ones no field
 * shows, for the form's summary. `fieldFor` names the form field a server path belongs to
 * (undefined: none); without it every path is a field of the form.
 */
export function setServerErrors<T extends FieldValues>(
  setError: UseFormSetError<T>,
  fields: readonly FieldIssue[],
  fieldFor: (path: string) => string | undefined = (path) => path,
): FieldIssue[] {
  const unplaced: FieldIssue[] = [];
  for (const issue of fields) {
    const field = fieldFor(issue.path);
    if (field === undefined) unplaced.push(issue);
    else setError(field as Path<T>, { type: 'server', message: issue.message });
  }
  return unplaced;
}

/** A `fieldFor` that places exactly the named fields. */
export function onlyFields(...names: string[]): (path: string) => string | undefined {
  return (path) => (names.includes(path) ? path : undefined);
}

/**
 * Marks a refusal's field messages on the form and returns what the form itself should say: the
 * messages no field shows, or the refusal's own message when it named no field.
 */
export function showRefusal<T extends FieldValues>(
  setError: UseFormSetError<T>,
  failure: { message: string; fields: readonly FieldIssue[] },
  fieldFor?: (path: string) => string | undefined,
): string | undefined {
  const unplaced = setServerErrors(setError, failure.fields, fieldFor);
  if (unplaced.length > 0) return unplaced.map((issue) => issue.message).join(' ');
  return failure.fields.length === 0 ? failure.message : undefined;
}
