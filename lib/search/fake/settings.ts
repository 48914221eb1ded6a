/** Index settings the fake keeps, with the engine's documented defaults. */
import { badRequest } from './errors';

export interface TypoToleranceSettings {
  enabled: boolean;
  minWordSizeForTypos: { oneTypo: number; twoTypos: number };
  disableOnWords: string[];
  disableOnAttributes: string[];
}

export interface IndexSettings {
  displayedAttributes: string[];
  searchableAttributes: string[];
  filterableAttributes: string[];
  sortableAttributes: string[];
  rankingRules: string[];
  stopWords: string[];
  synonyms: Record<string, string[]>;
  distinctAttribute: string | null;
  typoTolerance: TypoToleranceSettings;
  faceting: { maxValuesPerFacet: number; sortFacetValuesBy: Record<string, 'alpha' | 'count'> };
  pagination: { maxTotalHits: number };
}

export function defaultSettings(): IndexSettings {
  return {
    displayedAttributes: ['*'],
    searchableAttributes: ['*'],
    filterableAttributes: [],
    sortableAttributes: [],
    rankingRules: ['words', 'typo', 'proximity', 'attribute', 'sort', 'exactness'],
    stopWords: [],
    synonyms: {},
    distinctAttribute: null,
    typoTolerance: {
      enabled: true,
      minWordSizeForTypos: { oneTypo: 5, twoTypos: 9 },
      disableOnWords: [],
      disableOnAttributes: [],
    },
    faceting: { maxValuesPerFacet: 100, sortFacetValuesBy: { '*': 'alpha' } },
    pagination: { maxTotalHits: 1000 },
  };
}

/** Settings routes use kebab-case sub-paths (`/settings/filterable-attributes`). */
export function settingNameFromRoute(route: string): keyof IndexSettings | null {
  const camel = route.replace(/-([a-z])/g, (_, ch: string) => ch.toUpperCase());
  return camel in defaultSettings() ? (camel as keyof IndexSettings) : null;
}

function isStringList(value: unknown): value is string[] {
  return Array.isArray(value) && value.every((item) => typeof item === 'string');
}

const LIST_SETTINGS = new Set<keyof IndexSettings>([
  'displayedAttributes',
  'searchableAttributes',
  'filterableAttributes',
  'sortableAttributes',
  'rankingRules',
  'stopWords',
]);

/** Filterable attributes may also be given in the granular `{ attributePatterns: [...] }` form. */
function filterablePatterns(value: unknown): unknown {
  if (!Array.isArray(value)) return value;
  return value.flatMap((item: unknown) => {
    if (typeof item === 'object' && item !== null && 'attributePatterns' in item) {
      return (item as { attributePatterns: unknown }).attributePatterns;
    }
    return [item];
  });
}

function snakeCase(name: string): string {
  return name.replace(/[A-Z]/g, (ch) => `_${ch.toLowerCase()}`);
}

function validateSetting(name: keyof IndexSettings, value: unknown): unknown {
  if (value === null) return defaultSettings()[name];
  const candidate = name === 'filterableAttributes' ? filterablePatterns(value) : value;
  const valid = LIST_SETTINGS.has(name)
    ? isStringList(candidate)
    : name === 'distinctAttribute'
      ? typeof candidate === 'string'
      : typeof candidate === 'object' && !Array.isArray(candidate);
  if (!valid) {
    throw badRequest(`invalid_settings_${snakeCase(name)}`, `Invalid value type at \`.${name}\``);
  }
  return candidate;
}

/** Checks a settings payload at enqueue time, as the engine does, and returns the validated patch. */
export function validateSettingsPatch(body: unknown): Partial<IndexSettings> {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    throw badRequest('bad_request', 'Invalid value type: expected an object');
  }
  const patch: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(body)) {
    const name = settingNameFromRoute(key) === key ? (key as keyof IndexSettings) : null;
    if (name === null)
      throw badRequest(
        'bad_request',
        `Unknown field \`${key}\`: the fake accepts ${Object.keys(defaultSettings()).join(', ')}`,
      );
    patch[name] = validateSetting(name, value);
  }
  return patch as Partial<IndexSettings>;
}

/** Applies a patch; object-valued settings merge one level deep, as the engine's PATCH does. */
export function applySettingsPatch(current: IndexSettings, patch: Partial<IndexSettings>): IndexSettings {
  const next: IndexSettings = { ...current };
  for (const [key, value] of Object.entries(patch) as Array<[keyof IndexSettings, unknown]>) {
    const base = current[key];
    const merged =
      typeof base === 'object' && base !== null && !Array.isArray(base) && key !== 'synonyms'
        ? { ...base, ...(value as object) }
        : value;
    Object.assign(next, { [key]: merged });
  }
  return next;
}
