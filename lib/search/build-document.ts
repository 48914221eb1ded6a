/**
 * Turns one recipe as PostgreSQL holds it (the recipe, its head version and its owner) into the
 * document the search index keeps. Pure: no I/O, so it is tested on its own.
 */
import { findStyle } from '../brewing/styles';
import type { RecipeSearchDocument, RecipeVisibility } from './document';

/** Only the parts of the head version's document that the index reads. */
export interface IndexedDocumentParts {
  style?: { code?: unknown; name?: unknown } | null;
  fermentables?: unknown;
  hops?: unknown;
  yeasts?: unknown;
  notes?: unknown;
}

export interface RecipeIndexRow {
  id: string;
  slug: string;
  title: string;
  ownerId: string;
  ownerName: string | null;
  ownerHandle: string;
  visibility: RecipeVisibility;
  hiddenAt: Date | null;
  starCount: number;
  forkCount: number;
  headNumber: number;
  createdAt: Date;
  updatedAt: Date;
  og: number;
  fg: number;
  abv: number;
  ibu: number;
  srm: number;
  styleCode: string | null;
  document: IndexedDocumentParts;
}

/** Notes are searchable, but a long brew log need not be indexed whole. */
export const MAX_INDEXED_NOTES_CHARS = 5_000;

/** Rounded as the site shows them, so a range typed from a displayed number includes it. */
function roundTo(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}

function text(value: unknown): string {
  return typeof value === 'string' ? value.trim() : '';
}

/** The `key` of every entry of a list, trimmed, empty ones dropped, each spelling once (case ignored). */
function distinctValues(list: unknown, key: 'name' | 'kind'): string[] {
  if (!Array.isArray(list)) return [];
  const seen = new Map<string, string>();
  for (const entry of list) {
    const value = text((entry as Record<string, unknown> | null)?.[key]);
    if (value !== '' && !seen.has(value.toLowerCase())) seen.set(value.toLowerCase(), value);
  }
  return [...seen.values()];
}

export function toSearchDocument(row: RecipeIndexRow): RecipeSearchDocument {
  const doc = row.document ?? {};
  const styleCode = text(row.styleCode) || text(doc.style?.code);
  const guideline = styleCode ? findStyle(styleCode) : undefined;
  return {
    id: row.id,
    slug: row.slug,
    title: row.title,
    ownerId: row.ownerId,
    authorName: row.ownerName?.trim() || row.ownerHandle,
    authorHandle: row.ownerHandle,
    styleCode: guideline?.code ?? styleCode,
    styleName: text(doc.style?.name) || guideline?.name || '',
    styleCategory: guideline?.category ?? '',
    fermentables: distinctValues(doc.fermentables, 'name'),
    hops: distinctValues(doc.hops, 'name'),
    yeasts: distinctValues(doc.yeasts, 'name'),
    yeastKinds: distinctValues(doc.yeasts, 'kind'),
    notes: text(doc.notes).slice(0, MAX_INDEXED_NOTES_CHARS),
    og: roundTo(row.og, 3),
    fg: roundTo(row.fg, 3),
    abv: roundTo(row.abv, 1),
    ibu: roundTo(row.ibu, 0),
    srm: roundTo(row.srm, 1),
    stars: row.starCount,
    forks: row.forkCount,
    createdAt: row.createdAt.getTime(),
    updatedAt: row.updatedAt.getTime(),
    visibility: row.visibility,
    hidden: row.hiddenAt !== null,
    headVersion: row.headNumber,
  };
}
