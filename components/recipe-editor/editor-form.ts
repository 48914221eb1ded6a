import type { z } from 'zod';
import type { RecipeDocumentInput } from '@/lib/brewing/schema';
import { createRecipeSchema, saveVersionSchema, type Visibility } from '@/lib/recipes/schemas';

/**
 * The editor's form: the same body the server checks, without the base
 * version id (the editor keeps that itself), so a server error's path such as
 * `document.hops.2.alphaPct` names a form field as it is.
 */
const editVersionFormSchema = saveVersionSchema.omit({ baseVersionId: true });

export function editorFormSchema(mode: 'create' | 'edit') {
  return mode === 'create' ? createRecipeSchema : editVersionFormSchema;
}

export interface EditorValues {
  document: RecipeDocumentInput;
  message: string;
  visibility: Visibility;
}

export type CreateBody = z.output<typeof createRecipeSchema>;
export type EditBody = z.output<typeof editVersionFormSchema>;

export const MESSAGE_MAX_LENGTH = 200;

/**
 * An input left empty. The form holds it as null, because the form library
 * reads undefined as "use the starting value"; the document type has no room
 * for null, hence the cast. withoutEmpty() turns it back into a missing value.
 */
export function emptyNumber(): number {
  return null as unknown as number;
}

/** The form's values with empty inputs (null) left out, as the schema expects them. */
export function withoutEmpty<T>(value: T): T {
  if (Array.isArray(value)) return value.map(withoutEmpty) as T;
  if (value === null || typeof value !== 'object') return value;
  const kept: Record<string, unknown> = {};
  for (const [key, inner] of Object.entries(value)) {
    if (inner !== null && inner !== undefined) kept[key] = withoutEmpty(inner);
  }
  return kept as T;
}

export function newFermentable(): RecipeDocumentInput['fermentables'][number] {
  return {
    name: '',
    amountKg: emptyNumber(),
    potentialPpg: emptyNumber(),
    colorLovibond: emptyNumber(),
    kind: 'grain',
  };
}

export function newHop(): RecipeDocumentInput['hops'][number] {
  return {
    name: '',
    amountG: emptyNumber(),
    alphaPct: emptyNumber(),
    use: 'boil',
    timeMin: emptyNumber(),
    form: 'pellet',
  };
}

export function newYeast(): RecipeDocumentInput['yeasts'][number] {
  return { name: '', kind: 'ale', attenuationPct: emptyNumber() };
}

export function newMashStep(): RecipeDocumentInput['mash']['steps'][number] {
  return { tempC: emptyNumber(), timeMin: emptyNumber() };
}

export function newFermentationStep(): RecipeDocumentInput['fermentation']['steps'][number] {
  return { tempC: emptyNumber(), days: emptyNumber() };
}

/** Water switched on starts from zero ions: distilled or reverse-osmosis water. */
export function newWater(): NonNullable<RecipeDocumentInput['water']> {
  return {
    volumeL: emptyNumber(),
    source: { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 },
    salts: [],
  };
}

/** Spunding switched on starts at a common setting: about 1 bar (100 kPa, 15 psi) near the end of fermentation (common practice). */
export function newSpunding(): NonNullable<RecipeDocumentInput['fermentation']['spunding']> {
  return { pressureKPa: 100, tempC: emptyNumber() };
}

export function newCarbonation(): NonNullable<RecipeDocumentInput['carbonation']> {
  return { volumesCO2: emptyNumber(), servingTempC: emptyNumber() };
}

/** Paths the editor shows an input (or a list) for; anything else goes into the summary. */
const PLACEABLE_PATHS: readonly RegExp[] = [
  /^(message|visibility)$/,
  /^document\.(title|notes|style)$/,
  /^document\.batch\.(volumeL|boilTimeMin|efficiencyPct|boilOffLPerHour|trubLossL|grainAbsorptionLPerKg|mashWaterLPerKg)$/,
  /^document\.(fermentables|hops|yeasts|mash\.steps|fermentation\.steps|water\.salts)$/,
  /^document\.fermentables\.\d+\.(name|amountKg|potentialPpg|colorLovibond|kind)$/,
  /^document\.hops\.\d+\.(name|amountG|alphaPct|use|timeMin|form|tempC)$/,
  /^document\.yeasts\.\d+\.(name|kind|attenuationPct|tempMinC|tempMaxC)$/,
  /^document\.mash\.steps\.\d+\.(name|tempC|timeMin)$/,
  /^document\.fermentation\.steps\.\d+\.(tempC|days)$/,
  /^document\.water\.(volumeL|source\.(calcium|magnesium|sodium|chloride|sulfate|bicarbonate))$/,
  /^document\.water\.salts\.\d+\.(salt|grams)$/,
  /^document\.water\.target\.(calcium|magnesium|sodium|chloride|sulfate|bicarbonate)$/,
  /^document\.water\.acid\.(kind|mL)$/,
  /^document\.fermentation\.spunding\.(pressureKPa|tempC)$/,
  /^document\.carbonation\.(volumesCO2|servingTempC)$/,
];

/** The editor field that shows a server path's message, or undefined when only the summary can. */
export function editorFieldFor(serverPath: string): string | undefined {
  // The style's code and name are one choice in the editor.
  const path = serverPath.startsWith('document.style.') ? 'document.style' : serverPath;
  return PLACEABLE_PATHS.some((pattern) => pattern.test(path)) ? path : undefined;
}
