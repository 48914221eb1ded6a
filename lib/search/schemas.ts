/**
 * What a reader may ask the recipe search for. The URL holds the whole search, so
 * this module parses URLSearchParams into a checked query and serializes it back.
 */
import { z } from 'zod';
import { isStorableText } from '@/lib/validation/text';

export const SEARCH_SORTS = ['relevance', 'newest', 'stars', 'forks'] as const;
export type SearchSort = (typeof SEARCH_SORTS)[number];

export const SEARCH_PAGE_SIZE = 20;
const MAX_SEARCH_PAGE = 1000;
export const MAX_QUERY_LENGTH = 200;
export const MAX_FILTER_VALUES = 20;
const MAX_FILTER_VALUE_LENGTH = 100;

/** Sane bounds for each range filter, in the units the index stores (%, IBU, SRM, specific gravity). */
export const RANGE_BOUNDS = {
  abv: { min: 0, max: 25 },
  ibu: { min: 0, max: 200 },
  srm: { min: 0, max: 100 },
  og: { min: 1, max: 1.2 },
} as const;

export type RangeField = keyof typeof RANGE_BOUNDS;
const RANGE_FIELDS = Object.keys(RANGE_BOUNDS) as RangeField[];

const LIST_FIELDS = ['style', 'hop', 'malt', 'yeast'] as const;
type ListField = (typeof LIST_FIELDS)[number];

const STYLE_CODE = /^[0-9A-Za-z][0-9A-Za-z.-]{0,15}$/;

/** Text a search can hold: no NUL byte, no broken character (as every stored field, lib/validation/text.ts). */
function searchText(label: string) {
  return z
    .string({ error: `${label} must be text` })
    .refine(isStorableText, { error: `${label} contains a NUL byte or a broken character`, abort: true });
}

function valueList(field: ListField, item: z.ZodString) {
  return z
    .array(item, { error: `${field} must be a list of values` })
    .max(MAX_FILTER_VALUES, `${field} accepts at most ${MAX_FILTER_VALUES} values`)
    .default([]);
}

function ingredientName(field: ListField) {
  return searchText(`${field} values`)
    .trim()
    .min(1, `${field} values must not be empty`)
    .max(MAX_FILTER_VALUE_LENGTH, `${field} values must be at most ${MAX_FILTER_VALUE_LENGTH} characters`);
}

function bound(field: string, min: number, max: number) {
  return z
    .number({ error: `${field} must be a number` })
    .min(min, `${field} must be at least ${min}`)
    .max(max, `${field} must be at most ${max}`)
    .optional();
}

const PAGE_MESSAGE = `page must be a whole number from 1 to ${MAX_SEARCH_PAGE}`;

const baseSchema = z.object({
  q: searchText('q').trim().max(MAX_QUERY_LENGTH, `q must be at most ${MAX_QUERY_LENGTH} characters`).default(''),
  style: valueList(
    'style',
    searchText('style values')
      .trim()
      .regex(
        STYLE_CODE,
        'style values must be style codes such as 21A (letters, digits, dots and dashes, up to 16 characters)',
      ),
  ),
  hop: valueList('hop', ingredientName('hop')),
  malt: valueList('malt', ingredientName('malt')),
  yeast: valueList('yeast', ingredientName('yeast')),
  abvMin: bound('abvMin', RANGE_BOUNDS.abv.min, RANGE_BOUNDS.abv.max),
  abvMax: bound('abvMax', RANGE_BOUNDS.abv.min, RANGE_BOUNDS.abv.max),
  ibuMin: bound('ibuMin', RANGE_BOUNDS.ibu.min, RANGE_BOUNDS.ibu.max),
  ibuMax: bound('ibuMax', RANGE_BOUNDS.ibu.min, RANGE_BOUNDS.ibu.max),
  srmMin: bound('srmMin', RANGE_BOUNDS.srm.min, RANGE_BOUNDS.srm.max),
  srmMax: bound('srmMax', RANGE_BOUNDS.srm.min, RANGE_BOUNDS.srm.max),
  ogMin: bound('ogMin', RANGE_BOUNDS.og.min, RANGE_BOUNDS.og.max),
  ogMax: bound('ogMax', RANGE_BOUNDS.og.min, RANGE_BOUNDS.og.max),
  sort: z.enum(SEARCH_SORTS, { error: `sort must be one of ${SEARCH_SORTS.join(', ')}` }).default('relevance'),
  page: z
    .number({ error: PAGE_MESSAGE })
    .int(PAGE_MESSAGE)
    .min(1, PAGE_MESSAGE)
    .max(MAX_SEARCH_PAGE, PAGE_MESSAGE)
    .default(1),
});

/** The reader's search, checked: bounded text, value lists, ranges with min ≤ max, a known sort, a page. */
export const recipeSearchQuerySchema = baseSchema.superRefine((query, ctx) => {
  for (const field of RANGE_FIELDS) {
    const min = query[`${field}Min`];
    const max = query[`${field}Max`];
    if (min !== undefined && max !== undefined && min > max) {
      ctx.addIssue({
        code: 'custom',
        path: [`${field}Min`],
        message: `${field}Min must not be greater than ${field}Max`,
      });
    }
  }
});

export type RecipeSearchQuery = z.output<typeof recipeSearchQuerySchema>;
export type RecipeSearchQueryInput = z.input<typeof recipeSearchQuerySchema>;

export type SearchQueryField = keyof RecipeSearchQuery;

export type SearchQueryParseResult =
  | { success: true; data: RecipeSearchQuery }
  | { success: false; fieldErrors: Partial<Record<SearchQueryField, string[]>>; formErrors: string[] };

const NUMBER_FIELDS = [...RANGE_FIELDS.flatMap((field) => [`${field}Min`, `${field}Max`]), 'page'];

/** Numbers arrive as text; unparseable text is passed on unchanged so the schema names the field. */
function numberFromParam(raw: string): number | string {
  const n = Number(raw);
  return raw.trim() !== '' && Number.isFinite(n) ? n : raw;
}

function rawFromParams(params: URLSearchParams): Record<string, unknown> {
  const raw: Record<string, unknown> = {};
  const q = params.get('q');
  if (q !== null) raw.q = q;
  for (const field of LIST_FIELDS) {
    const values = params.getAll(field).filter((value) => value.trim() !== '');
    if (values.length > 0) raw[field] = values;
  }
  for (const field of NUMBER_FIELDS) {
    const value = params.get(field);
    if (value !== null && value.trim() !== '') raw[field] = numberFromParam(value);
  }
  const sort = params.get('sort');
  if (sort !== null && sort !== '') raw.sort = sort;
  return raw;
}

/** Checks any input (a JSON body, a form) against the schema, returning every field's messages. */
export function parseRecipeSearchQuery(input: unknown): SearchQueryParseResult {
  const result = recipeSearchQuerySchema.safeParse(input);
  if (result.success) return { success: true, data: result.data };
  const { fieldErrors, formErrors } = z.flattenError(result.error);
  return { success: false, fieldErrors: fieldErrors as Partial<Record<SearchQueryField, string[]>>, formErrors };
}

/**
 * The search as a URL query, checked in one schema: repeated keys (`hop=Cascade&hop=Saaz`) make
 * lists and numbers arrive as text, then the query schema names any field it refuses.
 */
export const searchParamsSchema = z.instanceof(URLSearchParams).transform(rawFromParams).pipe(recipeSearchQuerySchema);

/** Parses a search page's URL query, returning every field's messages. */
export function parseSearchParams(params: URLSearchParams): SearchQueryParseResult {
  const result = searchParamsSchema.safeParse(params);
  if (result.success) return { success: true, data: result.data };
  const { fieldErrors, formErrors } = z.flattenError(result.error);
  return { success: false, fieldErrors: fieldErrors as Partial<Record<SearchQueryField, string[]>>, formErrors };
}

/** Writes a query back to a URL query string, leaving out defaults so links stay short. */
export function serializeSearchQuery(query: RecipeSearchQueryInput): string {
  const params = new URLSearchParams();
  if (query.q && query.q.trim() !== '') params.set('q', query.q.trim());
  for (const field of LIST_FIELDS) for (const value of query[field] ?? []) params.append(field, value);
  for (const field of NUMBER_FIELDS) {
    const value = query[field as keyof RecipeSearchQueryInput];
    if (typeof value === 'number' && !(field === 'page' && value === 1)) params.set(field, String(value));
  }
  if (query.sort && query.sort !== 'relevance') params.set('sort', query.sort);
  return params.toString();
}

export interface LenientSearchParse {
  query: RecipeSearchQuery;
  /** Fields left out of the search, each with the reasons. */
  ignored: Array<{ field: SearchQueryField; messages: string[] }>;
}

/** A range is left out whole when either end is unusable: half of an inverted range means nothing. */
function paramsOf(field: string): string[] {
  const range = /^(abv|ibu|srm|og)(Min|Max)$/.exec(field);
  return range ? [`${range[1]}Min`, `${range[1]}Max`] : [field];
}

/**
 * For a search page's URL, which people edit and share: searches with every usable part and
 * reports the parts it left out, instead of refusing the whole address.
 */
export function parseSearchParamsLeniently(params: URLSearchParams): LenientSearchParse {
  const usable = new URLSearchParams(params);
  const ignored: LenientSearchParse['ignored'] = [];
  for (;;) {
    const parsed = parseSearchParams(usable);
    if (parsed.success) return { query: parsed.data, ignored };
    const failed = Object.entries(parsed.fieldErrors) as Array<[SearchQueryField, string[]]>;
    if (failed.length === 0) return { query: recipeSearchQuerySchema.parse({}), ignored };
    for (const [field, messages] of failed) {
      ignored.push({ field, messages });
      for (const key of paramsOf(field)) usable.delete(key);
    }
  }
}
