import type { z } from 'zod';
import { formatIssues, type FieldIssue } from '@/lib/brewing/schema';

/** A message for one field of a request (`hops.2.alphaPct`); the API, the forms and the engine share it. */
export type { FieldIssue };

export type AppErrorCode =
  | 'bad_request'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'too_large'
  | 'rate_limited'
  | 'unavailable';

const statusByCode: Record<AppErrorCode, number> = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  rate_limited: 429,
  unavailable: 503,
};

const defaultMessage: Record<AppErrorCode, (subject: string) => string> = {
  bad_request: (s) => `The ${s} is not valid.`,
  unauthenticated: () => 'Please sign in first.',
  forbidden: (s) => `You may not change this ${s}.`,
  not_found: (s) => `No such ${s}.`,
  conflict: (s) => `The ${s} changed meanwhile.`,
  too_large: (s) => `The ${s} is too large.`,
  rate_limited: () => 'Too many attempts; please wait a little and try again.',
  unavailable: () => 'Kettlefork is briefly unavailable; please try again in a moment.',
};

/** The one error type the app throws on purpose; it maps to an HTTP status and a message for people. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: AppErrorCode,
    readonly subject = 'request',
    message?: string,
    readonly fields: FieldIssue[] = [],
    readonly details?: unknown,
  ) {
    super(message ?? defaultMessage[code](subject));
    this.name = 'AppError';
    this.status = statusByCode[code];
  }
}

export function invalidInput(error: z.ZodError, subject = 'request'): AppError {
  // A problem with the body as a whole has no field; the API names it `(root)`.
  const fields = formatIssues(error).map((f) => (f.path ? f : { ...f, path: '(root)' }));
  const summary = fields
    .slice(0, 3)
    .map((f) => `${f.path}: ${f.message}`)
    .join('; ');
  return new AppError(
    'bad_request',
    subject,
    `Please check these fields: ${summary}${fields.length > 3 ? ' …' : ''}`,
    fields,
  );
}
