import type { RecipeDocument } from '@/lib/brewing/schema';
import { ApiError, sendJson } from '@/lib/http/client';
import type { Visibility } from '@/lib/recipes/schemas';

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

export type SaveRequest =
  | { mode: 'create'; body: { document: RecipeDocument; visibility: Visibility; message: string } }
  | { mode: 'edit'; recipeId: string; body: { document: RecipeDocument; baseVersionId: string; message: string } };

/** Saves a new recipe or version; a refusal throws an `ApiError` (status 0 when nothing answered). */
export function saveRecipe(request: SaveRequest): Promise<SavedVersion> {
  const url =
    request.mode === 'create' ? '/api/recipes' : `/api/recipes/${encodeURIComponent(request.recipeId)}/versions`;
  return sendJson<SavedVersion>(url, 'POST', request.body);
}

/** The head a refused save (409) names: the version saved meanwhile, which the editor compares against. */
export function conflictingHead(error: ApiError): HeadVersion | undefined {
  if (error.status !== 409) return undefined;
  const head = (error.details as { head?: HeadVersion } | null | undefined)?.head;
  return head && typeof head.id === 'string' ? head : undefined;
}
