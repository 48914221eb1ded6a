/** Index settings the fake keeps, with the engine's documented defaults. */
import { badRequest } from './errors';

export interface TypoToleranceSettings {
  enabled: boolean;
  minWordSizeForTypos: { oneTypo: number; twoTypos: number };
  disableOnWords: string[];
  disableOnAttributes: string[];
  disableOnNumbers: boolean;
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
      disableOnNumbers: false,
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

type FieldCheck = (value: unknown) => boolean;

const isNaturalNumber: FieldCheck = (value) => typeof value === 'number' && Number.isInteger(value) && value >= 0;
const isBoolean: FieldCheck = (value) => typeof value === 'boolean';
const isFacetOrderMap: FieldCheck = (value) =>
  typeof value === 'object' &&
  value !== null &&
  !Array.isArray(value) &&
  Object.values(value).every((order) => order === 'alpha' || order === 'count');

/** The fields each object-valued setting takes; any of them may be null, which resets it to its default. */
const OBJECT_FIELDS: Partial<Record<keyof IndexSettings, Record<string, FieldCheck>>> = {
  typoTolerance: {
    enabled: isBoolean,
    minWordSizeForTypos: (value) => checkObject(value, { oneTypo: isNaturalNumber, twoTypos: isNaturalNumber }),
    disableOnWords: isStringList,
    disableOnAttributes: isStringList,
    disableOnNumbers: isBoolean,
  },
  faceting: { maxValuesPerFacet: isNaturalNumber, sortFacetValuesBy: isFacetOrderMap },
  pagination: { maxTotalHits: isNaturalNumber },
};

function checkObject(value: unknown, fields: Record<string, FieldCheck>): boolean {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
  return Object.entries(value).every(([key, inner]) => key in fields && (inner === null || fields[key](inner)));
}

function isSynonyms(value: unknown): boolean {
  return (
    typeof value === 'object' && value !== null && !Array.isArray(value) && Object.values(value).every(isStringList)
  );
}

function validateSetting(name: keyof IndexSettings, value: unknown): unknown {
  if (value === null) return defaultSettings()[name];
  const candidate = name === 'filterableAttributes' ? filterablePatterns(value) : value;
  const fields = OBJECT_FIELDS[name];
  const valid = LIST_SETTINGS.has(name)
    ? isStringList(candidate)
    : name === 'distinctAttribute'
      ? typeof candidate === 'string'
      : name === 'synonyms'
        ? isSynonyms(candidate)
        : fields !== undefined && checkObject(candidate, fields);
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

/** Merges an object-valued setting: given fields replace, null fields go back to their defaults. */
function mergeObject(base: Record<string, unknown>, patch: Record<string, unknown>, defaults: Record<string, unknown>) {
  const next: Record<string, unknown> = { ...base };
  for (const [key, value] of Object.entries(patch)) {
    if (value === null) next[key] = defaults[key];
    else if (key === 'minWordSizeForTypos') {
      next[key] = mergeObject(
        base[key] as Record<string, unknown>,
        value as Record<string, unknown>,
        defaults[key] as Record<string, unknown>,
      );
    } else if (key === 'sortFacetValuesBy') {
      // The map is replaced as a whole; `*` falls back to alphabetical order when it is not given.
      next[key] = { '*': 'alpha', ...(value as object) };
    } else next[key] = value;
  }
  return next;
}

/** Applies a patch; object-valued settings (except synonyms) merge field by field, as the engine's PATCH does. */
export function applySettingsPatch(current: IndexSettings, patch: Partial<IndexSettings>): IndexSettings {
  const next: IndexSettings = { ...current };
  const defaults = defaultSettings();
  for (const [key, value] of Object.entries(patch) as Array<[keyof IndexSettings, unknown]>) {
    const merged =
      OBJECT_FIELDS[key] !== undefined
        ? mergeObject(
            current[key] as unknown as Record<string, unknown>,
            value as Record<string, unknown>,
            defaults[key] as unknown as Record<string, unknown>,
          )
        : value;
    Object.assign(next, { [key]: merged });
  }
  return next;
}
