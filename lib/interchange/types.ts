import type { RecipeDocument } from '@/lib/brewing/schema';

/** One recipe read from a file: our document, plus what was left out and what had to be assumed. */
export interface ImportedRecipe {
  document: RecipeDocument;
  /** Parts of the file Kettlefork does not model (kept in the notes where they carry meaning). */
  dropped: string[];
  /** Values the file did not give, or gave in a form we had to interpret. */
  guessed: string[];
}

export interface ImportResult {
  recipes: ImportedRecipe[];
}

export type InterchangeFormat = 'beerxml' | 'beerjson';

/**
 * A file we refuse: the message names the problem, `element` where in the file it is
 * (`RECIPE 1 › HOPS › HOP 2 (Cascade) › AMOUNT`, or a JSON path for BeerJSON).
 */
export class InterchangeError extends Error {
  constructor(
    message: string,
    readonly element: string,
    readonly kind: 'malformed' | 'unsafe' | 'too_large' | 'invalid' = 'invalid',
  ) {
    super(element ? `${element}: ${message}` : message);
    this.name = 'InterchangeError';
  }
}
