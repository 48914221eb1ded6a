import type { RecipeDocument } from '@/lib/brewing/schema';
import type { Visibility } from '@/lib/recipes/schemas';
import type { ServerFieldIssue } from './editor-form';

export interface SavedVersion {
  recipe: { id: string; slug: string };
  version: { id: string; number: number };
}

/** The version someone else saved while the member was editing. */
export interface HeadVersion {
  id: string;
  number: number;
  message: string;
  authorName: string;
  createdAt: string;
  document: RecipeDocument;
}

export interface ApiErrorBody {
  error?: {
    code?: string;
    message?: string;
    fields?: ServerFieldIssue[];
    details?: { head?: HeadVersion };
  };
}

/** A refused save; status 0 when the request never got an answer. */
export class SaveError extends Error {
  constructor(
    readonly status: number,
    readonly body: ApiErrorBody | null,
  ) {
    super(
      body?.error?.message ?? (status === 0 ? 'The network did not answer' : `Saving failed with status ${status}`),
    );
    this.name = 'SaveError';
  }
}

export type SaveRequest =
  | { mode: 'create'; body: { document: RecipeDocument; visibility: Visibility; message: string } }
  | { mode: 'edit'; recipeId: string; body: { document: RecipeDocument; baseVersionId: string; message: string } };

export async function saveRecipe(request: SaveRequest): Promise<SavedVersion> {
  const url =
    request.mode === 'create' ? '/api/recipes' : `/api/recipes/${encodeURIComponent(request.recipeId)}/versions`;
  let response: Response;
  try {
    response = await fetch(url, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(request.body),
    });
  } catch {
    throw new SaveError(0, null);
  }
  if (!response.ok)
    throw new SaveError(response.status, (await response.json().catch(() => null)) as ApiErrorBody | null);
  return (await response.json()) as SavedVersion;
}
