/**
 * Builds the engine filter for a checked search query. Every string goes through
 * `quoteFilterValue`; numbers come from the schema; nothing the reader typed is
 * spliced into the expression as is.
 */
import { hasRole, type Role } from '../auth/roles';
import type { RecipeSearchQuery, SearchSort } from './schemas';

/** Who is searching (the signed-in viewer's id and role), or null for an anonymous reader. */
export type SearchViewer = { id: string; role: Role } | null;

/** A double-quoted filter literal with backslashes and double quotes escaped. */
function quoteFilterValue(value: string): string {
  return `"${value.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
}

function canModerate(viewer: SearchViewer): boolean {
  return viewer !== null && hasRole(viewer, 'moderator');
}

/**
 * Public, unhidden recipes for everyone; moderators also see hidden public ones;
 * a signed-in member also sees their own recipes whatever their visibility.
 * Unlisted and private recipes never show to anyone but their owner.
 */
function viewerFilter(viewer: SearchViewer): string {
  const publicClause = canModerate(viewer) ? 'visibility = "public"' : '(visibility = "public" AND hidden = false)';
  if (!viewer) return publicClause;
  return `(${publicClause} OR ownerId = ${quoteFilterValue(viewer.id)})`;
}

function allOf(attribute: string, values: string[]): string[] {
  return values.map((value) => `${attribute} = ${quoteFilterValue(value)}`);
}

function numericClauses(query: RecipeSearchQuery): string[] {
  const clauses: string[] = [];
  for (const field of ['abv', 'ibu', 'srm', 'og'] as const) {
    const min = query[`${field}Min`];
    const max = query[`${field}Max`];
    if (min !== undefined) clauses.push(`${field} >= ${min}`);
    if (max !== undefined) clauses.push(`${field} <= ${max}`);
  }
  return clauses;
}

/**
 * The filter as an array (the engine ANDs its elements): the viewer rule, any of the
 * chosen styles, every chosen hop and malt, every chosen yeast by name or kind, and the ranges.
 */
export function buildRecipeFilter(query: RecipeSearchQuery, viewer: SearchViewer): string[] {
  const clauses = [viewerFilter(viewer)];
  if (query.style.length > 0) clauses.push(`styleCode IN [${query.style.map(quoteFilterValue).join(', ')}]`);
  clauses.push(...allOf('hops', query.hop), ...allOf('fermentables', query.malt));
  for (const yeast of query.yeast)
    clauses.push(`(yeasts = ${quoteFilterValue(yeast)} OR yeastKinds = ${quoteFilterValue(yeast)})`);
  clauses.push(...numericClauses(query));
  return clauses;
}

const SORTS: Record<SearchSort, string[] | undefined> = {
  relevance: undefined,
  newest: ['createdAt:desc'],
  stars: ['stars:desc', 'createdAt:desc'],
  forks: ['forks:desc', 'createdAt:desc'],
};

export function sortFor(sort: SearchSort): string[] | undefined {
  return SORTS[sort];
}
