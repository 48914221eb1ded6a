import { z } from 'zod';
import { recipeDocumentSchema } from '@/lib/brewing';
import { idOf } from '@/lib/validation/ids';

const VISIBILITIES = ['public', 'unlisted', 'private'] as const;
export type Visibility = (typeof VISIBILITIES)[number];

const visibilitySchema = z.enum(VISIBILITIES, { error: 'Visibility must be public, unlisted or private.' });

const versionMessage = z
  .string({ error: 'Say in a few words what changed.' })
  .trim()
  .max(200, 'Keep the message under 200 characters.');

const versionIdOf = (label: string) => idOf(`${label} must be a version id.`);

export const createRecipeSchema = z.object({
  document: recipeDocumentSchema,
  visibility: visibilitySchema.default('public'),
  message: versionMessage.default(''),
});

export const saveVersionSchema = z.object({
  document: recipeDocumentSchema,
  baseVersionId: versionIdOf('The version you started from'),
  message: versionMessage.min(1, 'Say in a few words what changed.'),
});

export const restoreVersionSchema = z.object({
  versionId: versionIdOf('The version to restore'),
  baseVersionId: versionIdOf('The version you started from'),
  message: versionMessage.optional(),
});

export const forkSchema = z.object({
  title: z
    .string({ error: 'Give your fork a title.' })
    .trim()
    .min(1, 'Give your fork a title.')
    .max(120, 'Keep the title under 120 characters.'),
  visibility: visibilitySchema.default('public'),
  /** The copy fitted to the member's brewhouse, saved as the fork's second version in the same transaction. */
  fitted: recipeDocumentSchema.optional(),
});

/** POST /api/import and the import page: a BeerXML or BeerJSON file's text, read for a preview. */
export const importFileSchema = z.object({
  format: z.enum(['beerxml', 'beerjson'], { error: 'Format must be beerxml or beerjson.' }).optional(),
  text: z
    .string({ error: 'Paste the text of a BeerXML or BeerJSON file.' })
    .min(1, 'Paste the text of a BeerXML or BeerJSON file.'),
});

export const updateRecipeSchema = z.object({ visibility: visibilitySchema });

export const computeStatsSchema = z.object({ document: recipeDocumentSchema });

export const compareQuerySchema = z.object({
  a: versionIdOf('Version a'),
  b: versionIdOf('Version b'),
});

export const listRecipesQuerySchema = z.object({
  owner: z.string().trim().max(40, 'Owner handle is too long.').optional(),
  page: z.coerce
    .number({ error: 'Page must be a whole number.' })
    .int('Page must be a whole number.')
    .min(1, 'Page starts at 1.')
    .max(1000, 'Page must be at most 1000.')
    .default(1),
});
