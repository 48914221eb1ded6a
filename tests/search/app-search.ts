import type { RecipeSearchResponse } from '@/lib/search/client';
import type { TestClient } from '../helpers/http';
import type { FieldIssue } from '@/lib/errors';

export type SearchBody = RecipeSearchResponse & {
  error?: { code: string; message: string; fields: FieldIssue[] };
};

/** A word no other test's recipe holds, so searches for it see only this test's recipes. */
export function uniqueWord(prefix = 'zq'): string {
  return `${prefix}${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
}

export function searchVia(client: TestClient, params: Record<string, string | string[] | number>) {
  const query = new URLSearchParams();
  for (const [key, value] of Object.entries(params))
    for (const item of Array.isArray(value) ? value : [value]) query.append(key, String(item));
  return client.get<SearchBody>(`/api/search?${query}`);
}

/** Repeats a search until `done` holds (the index takes changes shortly after the commit), up to ~5 s. */
export async function waitForSearch(
  client: TestClient,
  params: Record<string, string | string[] | number>,
  done: (body: SearchBody) => boolean,
  timeoutMs = 5_000,
): Promise<SearchBody> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await searchVia(client, params);
    if (res.status === 200 && done(res.body)) return res.body;
    if (Date.now() > deadline)
      throw new Error(
        `search ${JSON.stringify(params)} did not settle: ${res.status} ${JSON.stringify(res.body).slice(0, 400)}`,
      );
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

export const ids = (body: SearchBody) => body.hits.map((hit) => hit.id);
