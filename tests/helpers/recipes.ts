import { readFileSync } from 'node:fs';
import type { RecipeDocumentInput } from '@/lib/brewing';
import type { TestClient } from './http';

const example = JSON.parse(
  readFileSync(new URL('../../lib/brewing/examples/pale-ale.json', import.meta.url), 'utf8'),
) as RecipeDocumentInput;

/** A fresh copy of the invented example pale ale, with optional changes on top. */
export function paleAle(changes: Partial<RecipeDocumentInput> = {}): RecipeDocumentInput {
  return { ...structuredClone(example), ...changes };
}

export interface Saved {
  recipe: { id: string; slug: string };
  version: { id: string; number: number };
}

export async function createRecipeVia(
  client: TestClient,
  opts: { document?: RecipeDocumentInput; visibility?: 'public' | 'unlisted' | 'private'; message?: string } = {},
): Promise<Saved> {
  const res = await client.post<Saved>('/api/recipes', {
    document: opts.document ?? paleAle(),
    visibility: opts.visibility ?? 'public',
    message: opts.message ?? 'First brew',
  });
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

export async function saveVia(
  client: TestClient,
  recipeId: string,
  baseVersionId: string,
  document: RecipeDocumentInput,
  message = 'A change',
) {
  return client.post<Saved & { error?: { code: string; details?: { head: { id: string; number: number } } } }>(
    `/api/recipes/${recipeId}/versions`,
    {
      document,
      baseVersionId,
      message,
    },
  );
}
