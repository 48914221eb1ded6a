import { z } from 'zod';
import { idOf } from '@/lib/validation/ids';
import { textSchema } from '@/lib/validation/text';

// Stored metric (°C, litres, kPa, grams); forms convert the member's units at the edge, and each
// message names both units so it reads right in either.

/** Hydrometer and corrected gravities outside this are not beer or wort (common practice). */
export const GRAVITY_MIN = 0.98;
export const GRAVITY_MAX = 1.2;
const BRIX_MAX = 40;
/** Liquid water at ordinary pressure: 0–100 °C. */
const WATER_TEMP_MIN_C = 0;
const WATER_TEMP_MAX_C = 100;
/** A typical keg's working pressure (common practice); above it the page defers to the maker's limits. */
export const TYPICAL_KEG_RATING_KPA = 200;

export const GRAVITY_RANGE_MESSAGE = `must be a gravity between ${GRAVITY_MIN.toFixed(3)} and ${GRAVITY_MAX.toFixed(3)}`;

function num(label: string) {
  return z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a number`);
}

/** An empty form field (blank text, or a gravity with no reading typed) counts as not measured. */
function blankToNull(value: unknown): unknown {
  if (value === '') return null;
  if (value && typeof value === 'object' && 'value' in value) {
    const v = (value as { value: unknown }).value;
    if (v === undefined || v === null || v === '') return null;
  }
  return value;
}

function optional<T extends z.ZodType>(schema: T) {
  return z.preprocess(blankToNull, schema.nullish()).transform((v) => (v ?? null) as z.output<T> | null);
}

function temperatureField(label: string) {
  return num(label)
    .min(WATER_TEMP_MIN_C, `${label} must be between 0 and 100 °C (32–212 °F): water is not liquid outside that`)
    .max(WATER_TEMP_MAX_C, `${label} must be between 0 and 100 °C (32–212 °F): water is not liquid outside that`);
}

function volumeField(label: string) {
  return num(label).gt(0, `${label} must be more than 0`).max(2000, `${label} must be at most 2000 L (528 gal)`);
}

const isoDate = (label: string) =>
  z
    .string({ error: `${label} is required` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date such as 2025-05-17`)
    .refine(
      (s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
      `${label} is not a real date`,
    );

const gravityMethods = ['hydrometer', 'refractometer'] as const;

/** One gravity as measured: SG from a hydrometer (with its sample temperature) or °Brix from a refractometer. */
const gravityEntrySchema = z
  .object({
    method: z.enum(gravityMethods, { error: 'Choose hydrometer or refractometer' }),
    value: num('Reading'),
    sampleTempC: optional(temperatureField('Sample temperature')),
  })
  .superRefine((entry, ctx) => {
    if (!Number.isFinite(entry.value)) return;
    if (entry.method === 'hydrometer' && (entry.value < GRAVITY_MIN || entry.value > GRAVITY_MAX)) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: `A hydrometer reading ${GRAVITY_RANGE_MESSAGE}` });
    }
    if (entry.method === 'refractometer' && (entry.value < 0 || entry.value > BRIX_MAX)) {
      ctx.addIssue({
        code: 'custom',
        path: ['value'],
        message: `A refractometer reading must be between 0 and ${BRIX_MAX} °Brix`,
      });
    }
  });

const measuredFields = {
  brewedOn: isoDate('Brew date'),
  strikeTempC: optional(temperatureField('Strike water temperature')),
  mashTempC: optional(temperatureField('Mash temperature')),
  mashPh: optional(num('Mash pH').min(3, 'Mash pH must be between 3 and 8').max(8, 'Mash pH must be between 3 and 8')),
  preBoilVolumeL: optional(volumeField('Pre-boil volume')),
  preBoilGravity: optional(gravityEntrySchema),
  postBoilVolumeL: optional(volumeField('Post-boil volume')),
  fermenterVolumeL: optional(volumeField('Volume into the fermenter')),
  og: optional(gravityEntrySchema),
  pitchTempC: optional(temperatureField('Pitching temperature')),
  fg: optional(gravityEntrySchema),
  packagedOn: optional(isoDate('Packaging date')),
  packaging: optional(z.enum(['keg', 'bottles'], { error: 'Packaging must be keg or bottles' })),
  kegPressureKPa: optional(
    num('Keg pressure')
      .min(0, 'Keg pressure cannot be negative')
      .max(1000, 'Keg pressure must be at most 1000 kPa (145 psi)'),
  ),
  primingSugarG: optional(
    num('Priming sugar').min(0, 'Priming sugar cannot be negative').max(5000, 'Priming sugar must be at most 5000 g'),
  ),
  notes: z.string().max(20_000, 'Notes must be at most 20,000 characters').default(''),
};

function checkDatesAndPackaging(
  day: {
    brewedOn: string;
    packagedOn: string | null;
    packaging: string | null;
    kegPressureKPa: number | null;
    primingSugarG: number | null;
  },
  ctx: z.RefinementCtx,
) {
  if (day.packagedOn && day.packagedOn < day.brewedOn) {
    ctx.addIssue({ code: 'custom', path: ['packagedOn'], message: 'Packaging date cannot be before the brew date' });
  }
  if (day.kegPressureKPa !== null && day.packaging !== 'keg') {
    ctx.addIssue({ code: 'custom', path: ['kegPressureKPa'], message: 'Keg pressure goes with keg packaging' });
  }
  if (day.primingSugarG !== null && day.packaging !== 'bottles') {
    ctx.addIssue({ code: 'custom', path: ['primingSugarG'], message: 'Priming sugar goes with bottle packaging' });
  }
}

/** What a brewer records about a brew day (also what an edit sends). */
export const brewDayFieldsSchema = z.object(measuredFields).superRefine(checkDatesAndPackaging);
export type BrewDayFields = z.output<typeof brewDayFieldsSchema>;

/** A new brew day names the exact recipe version brewed. */
export const createBrewDaySchema = z
  .object({ versionId: idOf('Version must be a version id'), ...measuredFields })
  .superRefine(checkDatesAndPackaging);
export type CreateBrewDayInput = z.output<typeof createBrewDaySchema>;

export const readingSchema = z
  .object({
    takenOn: isoDate('Reading date'),
    method: optional(z.enum(gravityMethods, { error: 'Choose hydrometer or refractometer' })),
    value: optional(num('Reading')),
    sampleTempC: optional(temperatureField('Sample temperature')),
    beerTempC: optional(temperatureField('Beer temperature')),
    note: z.string().max(300, 'Note must be at most 300 characters').default(''),
  })
  .superRefine((r, ctx) => {
    if (r.value === null && r.beerTempC === null) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: 'Give a gravity reading, a temperature, or both' });
      return;
    }
    if (r.value !== null) {
      if (!r.method) ctx.addIssue({ code: 'custom', path: ['method'], message: 'Choose hydrometer or refractometer' });
      else {
        const parsed = gravityEntrySchema.safeParse({ method: r.method, value: r.value, sampleTempC: r.sampleTempC });
        if (!parsed.success)
          for (const issue of parsed.error.issues)
            ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
      }
    }
  });
export type ReadingInput = z.output<typeof readingSchema>;

const tastingText = (label: string) =>
  z.string().trim().max(2000, `${label} must be at most 2000 characters`).default('');

export const tastingSchema = z
  .object({
    tastedOn: isoDate('Tasting date'),
    appearance: tastingText('Appearance'),
    aroma: tastingText('Aroma'),
    flavour: tastingText('Flavour'),
    mouthfeel: tastingText('Mouthfeel'),
    overall: tastingText('Overall'),
    rating: z
      .number({ error: 'Rating must be a whole number from 1 to 5' })
      .int('Rating must be a whole number from 1 to 5')
      .min(1, 'Rating must be a whole number from 1 to 5')
      .max(5, 'Rating must be a whole number from 1 to 5'),
  })
  .refine((t) => [t.appearance, t.aroma, t.flavour, t.mouthfeel, t.overall].some((s) => s.length > 0), {
    path: ['overall'],
    message: 'Write at least one note about the beer',
  });
export type TastingInput = z.output<typeof tastingSchema>;

export const photoCaptionSchema = textSchema('Caption').trim().max(200, 'Caption must be at most 200 characters');
export const photoSizeSchema = z.enum(['display', 'thumb'], { error: 'No such photo size.' });

/** The brew-day fields brew-day mode asks for at the step where each is measured. */
export const LIVE_FIELDS = [
  'strikeTempC',
  'mashTempC',
  'mashPh',
  'preBoilVolumeL',
  'preBoilGravity',
  'postBoilVolumeL',
  'og',
  'fermenterVolumeL',
  'pitchTempC',
] as const;
export type LiveField = (typeof LIVE_FIELDS)[number];

/** One field's value checked exactly as the brew-day form checks it (the form's own field schema). */
export function parseLiveFieldValue(field: LiveField, value: unknown) {
  return measuredFields[field].safeParse(value);
}

const idempotencyKey = z.uuid({ error: 'Idempotency key must be a UUID made by the device' });
const stepId = z.string({ error: 'Step is required' }).regex(/^[a-z0-9-]{1,40}$/, 'No such step');
/**
 * The write a tick follows: the idempotency key of the step's last saved write as the device saw it,
 * or of its own tick still waiting before this one (null, or left out, when the step was never
 * ticked). A tick that follows something else has missed another device's tick or untick, and is a
 * conflict.
 */
const basedOn = z.uuid({ error: 'Based on must be the idempotency key of an earlier write' }).nullable().optional();

/**
 * A write from brew-day mode: a field measured at its step, a step ticked or unticked, or the
 * brewer's choice between two values. `knownValue` is the field's value on the server as the device
 * last saw it (null when it was empty), so a value entered meanwhile on another device is a
 * conflict rather than overwritten; a tick names the write it follows (`basedOn`) for the same end.
 */
export const liveEntrySchema = z.discriminatedUnion(
  'kind',
  [
    z
      .object({
        idempotencyKey,
        kind: z.literal('field'),
        field: z.enum(LIVE_FIELDS, { error: 'No such brew-day field' }),
        value: z.unknown(),
        knownValue: z.unknown().optional(),
      })
      .superRefine((entry, ctx) => {
        const parsed = parseLiveFieldValue(entry.field, entry.value);
        if (!parsed.success)
          for (const issue of parsed.error.issues)
            ctx.addIssue({ code: 'custom', path: ['value', ...issue.path.map(String)], message: issue.message });
        else if (parsed.data === null)
          ctx.addIssue({ code: 'custom', path: ['value'], message: 'Enter a value before saving' });
      }),
    z.object({
      idempotencyKey,
      kind: z.literal('step'),
      stepId,
      checked: z.boolean({ error: 'Checked must be true or false' }),
      basedOn,
    }),
    z.object({
      idempotencyKey,
      kind: z.literal('resolve'),
      conflictId: z.uuid({ error: 'Conflict must be the id of a conflict' }),
      keep: z.enum(['entered', 'saved'], { error: 'Keep must be entered or saved' }),
      /** The saved side as the device showed it (`LiveConflict.savedToken`): a choice made against a value that has moved since is refused. */
      savedToken: z.string({ error: 'Saved token is required' }).min(1, 'Saved token is required').max(400),
    }),
  ],
  { error: 'Kind must be field, step or resolve' },
);
export type LiveEntryInput = z.output<typeof liveEntrySchema>;
