// JSON requests from the browser to our own API, with the server's refusals in a form a page can show.

interface FieldMessage {
  path: string;
  message: string;
}

export type JsonResult<T> =
  { ok: true; status: number; data: T } | { ok: false; status: number; message: string; fields: FieldMessage[] };

/** Sends a JSON request and never throws: a refusal or a lost connection comes back as `ok: false`. */
export async function requestJson<T = unknown>(
  url: string,
  method: 'POST' | 'PUT' | 'PATCH' | 'DELETE',
  body?: unknown,
): Promise<JsonResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      headers: body === undefined ? undefined : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    return {
      ok: false,
      status: 0,
      message: 'Kettlefork could not be reached. Check your connection and try again.',
      fields: [],
    };
  }
  const data = (await res.json().catch(() => ({}))) as T & { error?: { message?: string; fields?: FieldMessage[] } };
  if (res.ok) return { ok: true, status: res.status, data };
  return {
    ok: false,
    status: res.status,
    message: data.error?.message ?? 'That did not work. Please try again.',
    fields: data.error?.fields ?? [],
  };
}

/** A JSON request from the browser; a refused one throws with the server's message (first field message when there is one). */
export async function sendJson<T = unknown>(
  url: string,
  method: 'POST' | 'PUT' | 'PATCH' | 'DELETE',
  body?: unknown,
): Promise<T> {
  const result = await requestJson<T>(url, method, body);
  if (!result.ok) throw new Error(result.fields[0]?.message ?? result.message);
  return result.data;
}
