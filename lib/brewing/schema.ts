import { z } from 'zod';
import { ION_NAMES } from './constants';

/**
 * The recipe document: one versioned record, metric units named in each field.
 * Bounds refuse impossible or absurd values with a message a brewer can read;
 * every message names the field it is about.
 */

/** A number field with readable messages for a missing value or a wrong type. */
function numberField(label: string) {
  return z.number({
    error: (issue) => (issue.input === undefined ? `${label} is required` : `${label} must be a number`),
  });
}

function textField(label: string, maxLength: number) {
  return z
    .string({
      error: (issue) => (issue.input === undefined ? `${label} is required` : `${label} must be text`),
    })
    .trim()
    .min(1, `${label} cannot be empty`)
    .max(maxLength, `${label} must be at most ${maxLength} characters`);
}

function choiceField<const T extends readonly [string, ...string[]]>(label: string, choices: T) {
  return z.enum(choices, { error: `${label} must be one of: ${choices.join(', ')}` });
}

function listField<T extends z.ZodType>(label: string, item: T, maxItems: number) {
  return z
    .array(item, {
      error: (issue) => (issue.input === undefined ? `${label} are required` : `${label} must be a list`),
    })
    .max(maxItems, `${label} can hold at most ${maxItems} entries`);
}

function objectError(label: string) {
  return {
    error: (issue: { input?: unknown }) =>
      issue.input === undefined ? `${label} is required` : `${label} must be an object`,
  };
}

/** Heaviest grist we accept per litre of batch: about twice a very strong barley wine's (common practice). */
const MAX_GRIST_KG_PER_L = 1;
/** Heaviest total hop load we accept per litre of batch (a heavy dry-hopped beer uses about 20 g/L; common practice). */
const MAX_HOPS_G_PER_L = 100;
/** Thinnest mash accepted, in litres of water per kg of grist. */
const MAX_MASH_WATER_L_PER_KG = 30;
/** Longest hop contact accepted: 90 days. */
const MAX_HOP_TIME_MIN = 129600;
/** Longest mash rest accepted: three days. */
const MAX_MASH_STEP_MIN = 4320;
/** Most salt we accept per litre of brewing water. */
const MAX_SALTS_G_PER_L = 5;

export const FERMENTABLE_KINDS = ['grain', 'extract', 'sugar', 'adjunct'] as const;
export const HOP_USES = ['mash', 'first_wort', 'boil', 'whirlpool', 'dry_hop'] as const;
export const HOP_FORMS = ['pellet', 'leaf'] as const;
export const YEAST_KINDS = ['ale', 'lager', 'kveik', 'wheat', 'wild', 'other'] as const;
export const SALT_NAMES = ['gypsum', 'epsom', 'table_salt', 'calcium_chloride', 'baking_soda'] as const;
const ACID_KINDS = ['lactic_88', 'phosphoric_10'] as const;
/** Highest spunding pressure accepted: past what homebrew pressure fermenters and kegs are rated for. */
const MAX_SPUNDING_KPA = 400;
// Kept with the constants so display code can list the ions without loading the validators.
export { ION_NAMES };

export type FermentableKind = (typeof FERMENTABLE_KINDS)[number];
export type HopUse = (typeof HOP_USES)[number];
export type HopForm = (typeof HOP_FORMS)[number];
export type YeastKind = (typeof YEAST_KINDS)[number];
export type SaltName = (typeof SALT_NAMES)[number];
export type IonName = (typeof ION_NAMES)[number];

const batchSchema = z.object(
  {
    volumeL: numberField('Batch volume')
      .min(0.1, 'Batch volume must be at least 0.1 L')
      .max(2000, 'Batch volume must be at most 2000 L'),
    boilTimeMin: numberField('Boil time')
      .min(0, 'Boil time cannot be negative')
      .max(360, 'Boil time must be at most 360 min'),
    efficiencyPct: numberField('Brewhouse efficiency')
      .min(10, 'Brewhouse efficiency must be at least 10%')
      .max(100, 'Brewhouse efficiency must be at most 100%'),
    boilOffLPerHour: numberField('Boil-off rate')
      .min(0, 'Boil-off rate cannot be negative')
      .max(100, 'Boil-off rate must be at most 100 L per hour')
      .default(4),
    trubLossL: numberField('Kettle trub loss')
      .min(0, 'Kettle trub loss cannot be negative')
      .max(500, 'Kettle trub loss must be at most 500 L')
      .default(1),
    grainAbsorptionLPerKg: numberField('Grain absorption')
      .min(0, 'Grain absorption cannot be negative')
      .max(3, 'Grain absorption must be at most 3 L per kg')
      .default(1),
    // Up to 30 L/kg: a full-volume (no-sparge) mash of a small grist runs well past 10 L/kg (common practice).
    mashWaterLPerKg: numberField('Mash thickness')
      .min(1, 'Mash thickness must be at least 1 L per kg')
      .max(MAX_MASH_WATER_L_PER_KG, `Mash thickness must be at most ${MAX_MASH_WATER_L_PER_KG} L per kg`)
      .default(3),
  },
  objectError('Batch'),
);

const fermentableSchema = z.object(
  {
    name: textField('Fermentable name', 80),
    amountKg: numberField('Fermentable amount')
      .positive('Fermentable amount must be more than 0 kg')
      .max(2000, 'Fermentable amount must be at most 2000 kg'),
    potentialPpg: numberField('Potential')
      .min(0, 'Potential cannot be negative')
      .max(50, 'Potential must be at most 50 points per pound per gallon'),
    colorLovibond: numberField('Colour').min(0, 'Colour cannot be negative').max(800, 'Colour must be at most 800 °L'),
    kind: choiceField('Fermentable kind', FERMENTABLE_KINDS),
  },
  objectError('Fermentable'),
);

const hopSchema = z.object(
  {
    name: textField('Hop name', 80),
    amountG: numberField('Hop amount')
      .positive('Hop amount must be more than 0 g')
      .max(200000, 'Hop amount must be at most 200 kg'),
    alphaPct: numberField('Alpha acid')
      .min(0, 'Alpha acid cannot be negative')
      .max(30, 'Alpha acid must be at most 30%'),
    use: choiceField('Hop use', HOP_USES),
    // Up to 90 days: a keg hop stays in the keg while it is served, for weeks to months (common practice).
    timeMin: numberField('Hop time')
      .min(0, 'Hop time cannot be negative')
      .max(MAX_HOP_TIME_MIN, `Hop time must be at most ${MAX_HOP_TIME_MIN} min (90 days)`),
    form: choiceField('Hop form', HOP_FORMS),
    tempC: numberField('Hop stand temperature')
      .min(0, 'Hop stand temperature cannot be below 0 °C')
      .max(100, 'Hop stand temperature must be at most 100 °C')
      .optional(),
  },
  objectError('Hop'),
);

const yeastSchema = z
  .object(
    {
      name: textField('Yeast name', 80),
      kind: choiceField('Yeast kind', YEAST_KINDS),
      attenuationPct: numberField('Attenuation')
        .min(1, 'Attenuation must be at least 1%')
        .max(100, 'Attenuation must be at most 100%'),
      tempMinC: numberField('Lowest yeast temperature')
        .min(0, 'Lowest yeast temperature cannot be below 0 °C')
        .max(45, 'Lowest yeast temperature must be at most 45 °C')
        .optional(),
      tempMaxC: numberField('Highest yeast temperature')
        .min(0, 'Highest yeast temperature cannot be below 0 °C')
        .max(45, 'Highest yeast temperature must be at most 45 °C')
        .optional(),
    },
    objectError('Yeast'),
  )
  .refine((yeast) => yeast.tempMinC === undefined || yeast.tempMaxC === undefined || yeast.tempMinC <= yeast.tempMaxC, {
    message: 'Highest yeast temperature must not be below the lowest',
    path: ['tempMaxC'],
  });

const mashStepSchema = z.object(
  {
    name: textField('Mash step name', 60).optional(),
    // From 25 °C: a souring rest for lactic bacteria runs from about 30 °C (common practice).
    tempC: numberField('Mash temperature')
      .min(25, 'Mash temperature must be at least 25 °C')
      .max(80, 'Mash temperature must be at most 80 °C'),
    // Up to three days: sour mashes and overnight rests are held for 12–72 hours (common practice).
    timeMin: numberField('Mash step time')
      .positive('Mash step time must be more than 0 min')
      .max(MAX_MASH_STEP_MIN, `Mash step time must be at most ${MAX_MASH_STEP_MIN} min (3 days)`),
  },
  objectError('Mash step'),
);

const fermentationStepSchema = z.object(
  {
    tempC: numberField('Fermentation temperature')
      .min(0, 'Fermentation temperature cannot be below 0 °C')
      .max(40, 'Fermentation temperature must be at most 40 °C'),
    days: numberField('Fermentation days')
      .positive('Fermentation days must be more than 0')
      .max(365, 'Fermentation days must be at most 365'),
  },
  objectError('Fermentation step'),
);

function ionField(label: string) {
  return numberField(label).min(0, `${label} cannot be negative`).max(2000, `${label} must be at most 2000 mg/L`);
}

const waterProfileSchema = z.object(
  {
    calcium: ionField('Calcium'),
    magnesium: ionField('Magnesium'),
    sodium: ionField('Sodium'),
    chloride: ionField('Chloride'),
    sulfate: ionField('Sulfate'),
    bicarbonate: ionField('Bicarbonate'),
  },
  objectError('Water profile'),
);

const saltAdditionSchema = z.object(
  {
    salt: choiceField('Salt', SALT_NAMES),
    grams: numberField('Salt amount')
      .min(0, 'Salt amount cannot be negative')
      .max(10000, 'Salt amount must be at most 10 kg'),
  },
  objectError('Salt addition'),
);

const waterSchema = z
  .object(
    {
      volumeL: numberField('Water volume')
        .min(0.1, 'Water volume must be at least 0.1 L')
        .max(10000, 'Water volume must be at most 10000 L'),
      source: waterProfileSchema,
      salts: listField('Salts', saltAdditionSchema, 20).default([]),
      /** The profile the brewer aims for; the engine proposes salts towards it. */
      target: waterProfileSchema.optional(),
      acid: z
        .object(
          {
            kind: choiceField('Acid', ACID_KINDS),
            mL: numberField('Acid amount')
              .min(0, 'Acid amount cannot be negative')
              .max(1000, 'Acid amount must be at most 1000 mL'),
          },
          objectError('Acid'),
        )
        .optional(),
    },
    objectError('Water'),
  )
  .refine((water) => totalOf(water.salts, (s) => s.grams) <= MAX_SALTS_G_PER_L * water.volumeL, {
    message: `Salts must total at most ${MAX_SALTS_G_PER_L} g per litre of water`,
    path: ['salts'],
  });

const carbonationSchema = z.object(
  {
    volumesCO2: numberField('Carbonation')
      .min(1, 'Carbonation must be at least 1 volume of CO2')
      .max(5, 'Carbonation must be at most 5 volumes of CO2'),
    servingTempC: numberField('Serving temperature')
      .min(-2, 'Serving temperature must be at least -2 °C')
      .max(25, 'Serving temperature must be at most 25 °C'),
  },
  objectError('Carbonation'),
);

const spundingSchema = z.object(
  {
    pressureKPa: numberField('Spunding pressure')
      .min(0, 'Spunding pressure cannot be negative')
      .max(
        MAX_SPUNDING_KPA,
        `Spunding pressure must be at most ${MAX_SPUNDING_KPA} kPa (about 58 psi), past what homebrew vessels are rated for`,
      ),
    tempC: numberField('Spunding temperature')
      .min(0, 'Spunding temperature cannot be below 0 °C')
      .max(40, 'Spunding temperature must be at most 40 °C'),
  },
  objectError('Spunding'),
);

const styleSchema = z.object(
  {
    code: textField('Style code', 10),
    name: textField('Style name', 120),
  },
  objectError('Style'),
);

function totalOf<T>(items: readonly T[], amount: (item: T) => number): number {
  let total = 0;
  for (const item of items) total += amount(item);
  return total;
}

const documentShape = z.object(
  {
    title: textField('Title', 120),
    batch: batchSchema,
    fermentables: listField('Fermentables', fermentableSchema, 50).min(1, 'Fermentables need at least one entry'),
    hops: listField('Hops', hopSchema, 50),
    yeasts: listField('Yeasts', yeastSchema, 10).min(1, 'Yeasts need at least one entry'),
    mash: z.object({ steps: listField('Mash steps', mashStepSchema, 20) }, objectError('Mash')),
    fermentation: z.object(
      { steps: listField('Fermentation steps', fermentationStepSchema, 20), spunding: spundingSchema.optional() },
      objectError('Fermentation'),
    ),
    water: waterSchema.optional(),
    carbonation: carbonationSchema.optional(),
    style: styleSchema.optional(),
    notes: z.string({ error: 'Notes must be text' }).max(50000, 'Notes must be at most 50000 characters').default(''),
  },
  objectError('Recipe'),
);

type DocumentShape = z.output<typeof documentShape>;

export const recipeDocumentSchema = documentShape.superRefine((doc, ctx) => {
  // A ratio to a batch volume or boil time that is itself refused says nothing: leave it to that field's message.
  if (!hasIssueAt(ctx.issues, ['batch', 'volumeL'])) checkLoadsPerLitre(doc, ctx);
  if (!hasIssueAt(ctx.issues, ['batch', 'boilTimeMin'])) checkHopTimesWithinBoil(doc, ctx);
});

function hasIssueAt(issues: readonly { path?: readonly PropertyKey[] }[], path: readonly PropertyKey[]): boolean {
  return issues.some((issue) => path.every((part, i) => issue.path?.[i] === part));
}

function checkLoadsPerLitre(doc: DocumentShape, ctx: z.RefinementCtx<DocumentShape>): void {
  const gristKg = totalOf(doc.fermentables, (f) => f.amountKg);
  if (gristKg > MAX_GRIST_KG_PER_L * doc.batch.volumeL) {
    ctx.addIssue({
      code: 'custom',
      path: ['fermentables'],
      message: `Fermentables total ${round1(gristKg)} kg, too much for a ${round1(doc.batch.volumeL)} L batch (at most ${MAX_GRIST_KG_PER_L} kg per litre)`,
    });
  }
  const hopsG = totalOf(doc.hops, (h) => h.amountG);
  if (hopsG > MAX_HOPS_G_PER_L * doc.batch.volumeL) {
    ctx.addIssue({
      code: 'custom',
      path: ['hops'],
      message: `Hops total ${round1(hopsG)} g, too much for a ${round1(doc.batch.volumeL)} L batch (at most ${MAX_HOPS_G_PER_L} g per litre)`,
    });
  }
}

function checkHopTimesWithinBoil(doc: DocumentShape, ctx: z.RefinementCtx<DocumentShape>): void {
  doc.hops.forEach((hop, index) => {
    if ((hop.use === 'boil' || hop.use === 'first_wort') && hop.timeMin > doc.batch.boilTimeMin) {
      ctx.addIssue({
        code: 'custom',
        path: ['hops', index, 'timeMin'],
        message: `Hop time (${hop.timeMin} min) cannot be longer than the boil (${doc.batch.boilTimeMin} min)`,
      });
    }
  });
}

function round1(value: number): number {
  return Math.round(value * 10) / 10;
}

/** A checked document: defaults filled in. */
export type RecipeDocument = z.infer<typeof recipeDocumentSchema>;
/** What a client may send: defaulted fields may be left out. */
export type RecipeDocumentInput = z.input<typeof recipeDocumentSchema>;
export type Fermentable = RecipeDocument['fermentables'][number];
export type Hop = RecipeDocument['hops'][number];
export type Yeast = RecipeDocument['yeasts'][number];
export type WaterProfile = z.infer<typeof waterProfileSchema>;
export type SaltAddition = z.infer<typeof saltAdditionSchema>;

export interface FieldIssue {
  /** Dotted path into the document, e.g. `hops.2.alphaPct`; empty for the document itself. */
  path: string;
  message: string;
}

/** Every issue of a failed parse as a dotted path and a message, in the order zod found them. */
export function formatIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issue.path.map((part) => String(part)).join('.'),
    message: issue.message,
  }));
}
