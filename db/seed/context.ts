import type { Viewer } from '@/lib/auth/session';
import type { VersionPlan } from './timeline';

/** What each part of the demo world's seed can build on. */
export interface SeedContext {
  /** Demo members by handle. */
  people: Map<string, Viewer>;
  /** Demo recipes by their key in db/seed/recipes.ts (forks included), as recipe ids. */
  recipes: Map<string, string>;
  /** When each demo version is dated (db/seed/timeline.ts), by recipe key; index 0 is version 1. */
  versionDates: VersionPlan;
}
