import type { Viewer } from '@/lib/auth/session';

/** What each part of the demo world's seed can build on. */
export interface SeedContext {
  /** Demo members by handle. */
  people: Map<string, Viewer>;
  /** Demo recipes by their key in db/seed/recipes.ts (forks included), as recipe ids. */
  recipes: Map<string, string>;
}
