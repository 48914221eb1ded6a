// Requests from the browser to our own API, with the server's refusals in a form a page can show.
import type { FieldIssue } from '@/lib/errors';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** A refusal, or a request that got no answer (`status` 0, `code` 'network'). */
export interface RequestFailure {
  ok: false;
  status: number;
  /** The server's `AppError` code (`bad_request`, `conflict`, `unavailable`…), or `network`/`http` without one. */
  code: string;
  message: string;
  fields: FieldIssue[];
  /** What the server sent beside the message, e.g. the newer head version of a refused save. */
  details: unknown;
}

export type JsonResult<T> = { ok: true; status: number; data: T } | RequestFailure;

export interface RequestOptions {
  signal?: AbortSignal;
  cache?: RequestCache;
}

const NETWORK_MESSAGE = 'Kettlefork could not be reached. Check your connection and try again.';

/** What to say when a refusal carries no message of its own (a proxy's page, an empty body). */
function messageForStatus(status: number): string {
  if (status === 401) return 'Please sign in first.';
  if (status === 403) return 'You may not do that.';
  if (status === 404) return 'That is no longer there, or no longer visible to you.';
  if (status === 409) return 'That changed meanwhile. Reload the page and try again.';
  if (status === 413) return 'That is too large to send.';
  if (status === 429) return 'Too many attempts; please wait a little and try again.';
  if (status >= 500) return 'Kettlefork could not answer just now; please try again in a moment.';
  return 'That did not work. Please try again.';
}

interface ErrorBody {
  error?: { code?: unknown; message?: unknown; fields?: unknown; details?: unknown };
}

function isFieldIssue(value: unknown): value is FieldIssue {
  const v = value as Partial<FieldIssue> | null;
  return typeof v?.path === 'string' && typeof v.message === 'string';
}

/** Reads a response body as `route()` writes it; anything else (HTML, nothing) falls back to plain words. */
function resultFrom<T>(status: number, text: string): JsonResult<T> {
  let data: unknown = {};
  try {
    if (text.trim() !== '') data = JSON.parse(text);
  } catch {
    data = {};
  }
  if (status >= 200 && status < 300) return { ok: true, status, data: data as T };
  const error = (data as ErrorBody | null)?.error;
  return {
    ok: false,
    status,
    code: typeof error?.code === 'string' ? error.code : 'http',
    message: typeof error?.message === 'string' && error.message ? error.message : messageForStatus(status),
    fields: Array.isArray(error?.fields) ? error.fields.filter(isFieldIssue) : [],
    details: error?.details,
  };
}

function networkFailure(): RequestFailure {
  return { ok: false, status: 0, code: 'network', message: NETWORK_MESSAGE, fields: [], details: undefined };
}

/**
 * Sends a request (a JSON body when one is given) and never throws for a refusal or a lost
 * connection: both come back as `ok: false`. An aborted request still throws, as fetch does.
 */
export async function requestJson<T = unknown>(
  url: string,
  method: Method,
  body?: unknown,
  options: RequestOptions = {},
): Promise<JsonResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      headers:
        body === undefined
          ? { accept: 'application/json' }
          : { accept: 'application/json', 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: options.signal,
      cache: options.cache,
    });
  } catch (err) {
    if (options.signal?.aborted) throw err;
    return networkFailure();
  }
  const text = await res.text().catch(() => '');
  return resultFrom<T>(res.status, text);
}

/** A refused request, thrown by `sendJson`; it keeps everything the server said. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  /** The server's message for the whole request; `message` is the first field's when there is one. */
  readonly summary: string;
  readonly fields: FieldIssue[];
  readonly details: unknown;
  constructor(failure: RequestFailure) {
    // A button has no fields to mark, so the first field's message says most.
    super(failure.fields[0]?.message ?? failure.message);
    this.name = 'ApiError';
    this.status = failure.status;
    this.code = failure.code;
    this.summary = failure.message;
    this.fields = failure.fields;
    this.details = failure.details;
  }
}

/** A request whose refusal throws an `ApiError`: for buttons, queries and mutations. */
export async function sendJson<T = unknown>(
  url: string,
  method: Method,
  body?: unknown,
  options?: RequestOptions,
): Promise<T> {
  const result = await requestJson<T>(url, method, body, options);
  if (!result.ok) throw new ApiError(result);
  return result.data;
}

export interface UploadProgress {
  /** Share of the body sent, 0–100. */
  onProgress?: (percent: number) => void;
  /** The whole body is sent; the server is still working on it. */
  onSent?: () => void;
}

/**
 * Posts a form with files. XMLHttpRequest rather than fetch, because only it reports upload
 * progress; the answer is read exactly as `requestJson` reads it.
 */
export function uploadForm<T = unknown>(
  url: string,
  form: FormData,
  { onProgress, onSent }: UploadProgress = {},
): Promise<JsonResult<T>> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(Math.round((e.loaded / e.total) * 100));
    };
    xhr.upload.onload = () => onSent?.();
    xhr.onload = () => resolve(resultFrom<T>(xhr.status, xhr.responseText));
    xhr.onerror = () => resolve(networkFailure());
    xhr.onabort = () => resolve(networkFailure());
    xhr.send(form);
  });
}
