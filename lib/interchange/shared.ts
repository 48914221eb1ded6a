import {
  recipeDocumentSchema,
  type Fermentable,
  type RecipeDocument,
  type RecipeDocumentInput,
  type SaltName,
  type WaterProfile,
} from '@/lib/brewing/schema';
import { ION_NAMES } from '@/lib/brewing/constants';
import { findStyle, listStyles } from '@/lib/brewing/styles';
import { fitToSchema, refuseNonsense } from './fit';
import type { ImportedRecipe } from './types';
import { tidy } from './units';

/** What one reader collects while it maps a recipe: the draft document and its two lists. */
export interface Draft {
  dropped: string[];
  guessed: string[];
  /** Lines kept for the notes: things we do not model but a brewer would want to read. */
  kept: string[];
}

export function newDraft(): Draft {
  return { dropped: [], guessed: [], kept: [] };
}

/** Where in the file each part of the document was read from, by document path (`hops.2`, `water.salts`). */
export type Origins<R> = Map<string, R>;

/**
 * The file's own words for a document path: the nearest part of the path that `origins` knows,
 * then the rest of the path as the format names that field (`fieldName`, given the path's first
 * part, such as `hops`, and the rest), put together by `join`. Undefined when no part of the
 * path was read from a recorded element, so the reader can name the recipe's own field.
 */
export function describeFromOrigins<R extends { path: string }>(
  origins: Origins<R>,
  path: string,
  fieldName: (section: string, field: string) => string,
  join: (originPath: string, name: string) => string,
): string | undefined {
  const parts = path.split('.');
  for (let n = parts.length; n > 0; n--) {
    const origin = origins.get(parts.slice(0, n).join('.'));
    if (!origin) continue;
    const field = parts.slice(n).join('.');
    return field ? join(origin.path, fieldName(parts[0], field)) : origin.path;
  }
  return undefined;
}

/**
 * The brewer and co-brewer a file credits: listed as dropped, since an imported recipe is saved
 * under the importing member's name.
 */
export function dropCredits(draft: Draft, at: string, names: (string | undefined)[]): void {
  const credit = names.filter(Boolean).join(' and ');
  if (credit) draft.dropped.push(`${at}: ${credit} (the recipe is saved under your name)`);
}

/** The notes of an imported recipe: the file's own notes, then what we kept from the rest of it. */
function notesWith(notes: string, kept: readonly string[], formatName: string): string {
  const parts = [notes.trim()];
  if (kept.length) parts.push(`### Also in the ${formatName} file\n\n${kept.map((line) => `- ${line}`).join('\n')}`);
  return parts.filter(Boolean).join('\n\n').slice(0, 50000);
}

/**
 * Finishes a mapped document: refuses physical nonsense, fits what is real but outside the
 * editor's limits (listing each change), then writes the notes: the file's own, then what we kept.
 * A refusal names the element of the file (through `describe`, which turns `hops.1.amountG` into
 * the file's own words) and the rule.
 */
export function finishRecipe(
  input: RecipeDocumentInput,
  draft: Draft,
  describe: (path: string) => string,
  notes: { text: string; formatName: string },
): ImportedRecipe {
  refuseNonsense(input, describe);
  const fitted = fitToSchema(input, draft, describe);
  fitted.notes = notesWith(notes.text, draft.kept, notes.formatName);
  const document = recipeDocumentSchema.parse(fitted);
  return { document, dropped: draft.dropped, guessed: draft.guessed };
}

/** Salt names as brewers and both formats write them, to our salt list. */
const SALT_PATTERNS: [RegExp, SaltName][] = [
  [/gypsum|calcium sulph?ate|caso4/i, 'gypsum'],
  [/epsom|magnesium sulph?ate|mgso4/i, 'epsom'],
  [/calcium chloride|cacl2/i, 'calcium_chloride'],
  [/baking soda|sodium bicarbonate|nahco3|bicarbonate of soda/i, 'baking_soda'],
  [/table salt|sodium chloride|nacl|^salt$|canning salt|non-iodi[sz]ed salt/i, 'table_salt'],
];

function saltFromName(name: string): SaltName | null {
  for (const [pattern, salt] of SALT_PATTERNS) if (pattern.test(name.trim())) return salt;
  return null;
}

export const SALT_FILE_NAMES: Record<SaltName, string> = {
  gypsum: 'Gypsum (calcium sulfate)',
  epsom: 'Epsom salt (magnesium sulfate)',
  table_salt: 'Table salt (sodium chloride)',
  calcium_chloride: 'Calcium chloride',
  baking_soda: 'Baking soda (sodium bicarbonate)',
};

/** Splits our style code `21A` into the category number and letter both formats use. */
export function splitStyleCode(code: string): { number: string; letter: string } {
  const match = /^(\d+)([A-Z]?)$/i.exec(code.trim());
  return match ? { number: match[1], letter: match[2].toUpperCase() } : { number: code, letter: '' };
}

/**
 * A style from a file, matched to the BJCP 2021 guidelines we fit against: by code when the
 * file names that edition, else by name. Null (and the style kept in the notes) when neither fits.
 */
export function matchStyle(
  file: { name?: string; number?: string; letter?: string; guide?: string },
  draft: Draft,
): { code: string; name: string } | undefined {
  const code = `${file.number ?? ''}${file.letter ?? ''}`.trim();
  const byCode = code ? findStyle(code) : undefined;
  const name = (file.name ?? '').trim().toLowerCase();
  const guide = file.guide ?? '';
  if (byCode && (/2021/.test(guide) || byCode.name.toLowerCase() === name))
    return { code: byCode.code, name: byCode.name };
  const byName = name ? listStyles().find((s) => s.name.toLowerCase() === name) : undefined;
  if (byName) {
    draft.guessed.push(`Style "${file.name}" matched by name to ${byName.code} ${byName.name} (BJCP 2021)`);
    return { code: byName.code, name: byName.name };
  }
  if (byCode && !guide) {
    draft.guessed.push(`Style code ${code} read as ${byCode.code} ${byCode.name} (BJCP 2021); the file names no guide`);
    return { code: byCode.code, name: byCode.name };
  }
  if (file.name || code) {
    const label = [code, file.name, guide && `(${guide})`].filter(Boolean).join(' ');
    draft.dropped.push(`Style ${label}: not found in the BJCP 2021 guidelines`);
    draft.kept.push(`Style: ${label}`);
  }
  return undefined;
}

/** Typical attenuation by yeast kind, used when a file gives none (common practice). */
export const DEFAULT_ATTENUATION_PCT = { ale: 75, lager: 76, kveik: 78, wheat: 74, wild: 85, other: 75 } as const;

export const DEFAULT_EFFICIENCY_PCT = 72;
export const DEFAULT_BOIL_TIME_MIN = 60;
export const DEFAULT_SERVING_TEMP_C = 4;

/** Kilograms of grain and adjuncts: what goes into the mash (sugars and extracts do not). */
export function mashedKg(fermentables: readonly Pick<Fermentable, 'kind' | 'amountKg'>[]): number {
  let kg = 0;
  for (const f of fermentables) if (f.kind === 'grain' || f.kind === 'adjunct') kg += f.amountKg;
  return kg;
}

/** How a recipe is brewed, in the words both formats share (each writes them in its own case). */
export type BrewMethod = 'all grain' | 'partial mash' | 'extract';

/** The brewing method a recipe's fermentables imply: extract with mashed grain is a partial mash. */
export function recipeType(doc: Pick<RecipeDocument, 'fermentables'>): BrewMethod {
  const mashed = doc.fermentables.some((f) => f.kind === 'grain' || f.kind === 'adjunct');
  const extract = doc.fermentables.some((f) => f.kind === 'extract');
  return mashed && extract ? 'partial mash' : extract ? 'extract' : 'all grain';
}

/**
 * The recipe's water from the waters a file lists: one profile, mixed by volume (evenly when no
 * volumes are given), and the salts. Salts with no water are counted in distilled water.
 */
export function mixWaters(
  readings: { ions: WaterProfile; volumeL: number }[],
  salts: SaltAddition[],
  draft: Draft,
  fallbackVolumeL: number,
) {
  const source: WaterProfile = { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 };
  let volumeL = readings.reduce((n, r) => n + r.volumeL, 0);
  if (readings.length) {
    const weights = volumeL > 0 ? readings.map((r) => r.volumeL / volumeL) : readings.map(() => 1 / readings.length);
    for (const ion of ION_NAMES) source[ion] = tidy(readings.reduce((n, r, i) => n + r.ions[ion] * weights[i], 0));
    if (readings.length > 1) draft.guessed.push(`Water: ${readings.length} waters mixed into one profile by volume`);
  } else draft.guessed.push('Water: salts without a water profile; assumed water with no ions (distilled)');
  if (volumeL <= 0) {
    volumeL = Math.round(fallbackVolumeL * 100) / 100;
    draft.guessed.push(`Water volume: the file gives none; used ${volumeL} L`);
  }
  return { volumeL: tidy(volumeL), source, salts };
}

export interface SaltAddition {
  salt: SaltName;
  grams: number;
}

/** Adds a salt to the list, summing repeats of the same salt. */
function addSalt(salts: SaltAddition[], salt: SaltName, grams: number): void {
  const existing = salts.find((s) => s.salt === salt);
  if (existing) existing.grams = tidy(existing.grams + grams);
  else salts.push({ salt, grams });
}

/**
 * Reads one of a file's miscellaneous additions as a brewing salt when its name is a salt's and
 * it is given by weight (`weighedGrams` answers undefined otherwise): summed into `salts`, and
 * the element kept as where the water's salts came from. False when it is something else.
 */
export function takeSalt<R>(
  salts: SaltAddition[],
  origins: Origins<R>,
  record: R,
  name: string,
  weighedGrams: () => number | undefined,
): boolean {
  const salt = saltFromName(name);
  const grams = salt ? weighedGrams() : undefined;
  if (!salt || grams === undefined) return false;
  addSalt(salts, salt, tidy(grams));
  origins.set('water.salts', record);
  return true;
}

/** The yeast a recipe without one gets, so its numbers can be worked out. */
export function defaultYeast(draft: Draft) {
  draft.guessed.push(
    `Yeast: the recipe names none; added a clean ale yeast at ${DEFAULT_ATTENUATION_PCT.ale}% attenuation so the numbers can be worked out`,
  );
  return [{ name: 'Clean ale yeast', kind: 'ale' as const, attenuationPct: DEFAULT_ATTENUATION_PCT.ale }];
}

/** A mash step's name in a file when the brewer gave none (BeerXML requires one); read back as no name. */
export function unnamedStep(index: number): string {
  return `Step ${index + 1}`;
}
