/** A JSON request from the browser; a refused one throws with the server's message (first field message when there is one). */
export async function sendJson<T = unknown>(url: string, method: 'POST' | 'PUT' | 'PATCH' | 'DELETE', body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      headers: body === undefined ? undefined : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new Error('Kettlefork could not be reached. Check your connection and try again.');
  }
  const data = (await res.json().catch(() => ({}))) as T & { error?: { message: string; fields?: { path: string; message: string }[] } };
  if (!res.ok) throw new Error(data.error?.fields?.[0]?.message ?? data.error?.message ?? 'That did not work. Please try again.');
  return data;
}
