// Shared test data for the brewing engine's tests: an invented pale ale and
// fast-check generators of documents inside the schema's bounds.
import fc from 'fast-check';
import examplePaleAleJson from './examples/pale-ale.json';
import {
  FERMENTABLE_KINDS,
  HOP_FORMS,
  HOP_USES,
  SALT_NAMES,
  YEAST_KINDS,
  recipeDocumentSchema,
  type RecipeDocument,
  type RecipeDocumentInput,
} from './schema';
import { listStyles } from './styles';

/** A fresh copy of the example document, safe to change. */
export function examplePaleAleInput(): RecipeDocumentInput {
  return structuredClone(examplePaleAleJson) as RecipeDocumentInput;
}

export function examplePaleAle(): RecipeDocument {
  return recipeDocumentSchema.parse(examplePaleAleInput());
}

/** A minimal valid document to vary in tests: one grain, one boil hop, one yeast, one rest. */
export function minimalInput(): RecipeDocumentInput {
  return {
    title: 'Test batch',
    batch: { volumeL: 20, boilTimeMin: 60, efficiencyPct: 75 },
    fermentables: [{ name: 'Pale malt', amountKg: 4, potentialPpg: 37, colorLovibond: 3, kind: 'grain' }],
    hops: [{ name: 'Bittering hop', amountG: 25, alphaPct: 10, use: 'boil', timeMin: 60, form: 'pellet' }],
    yeasts: [{ name: 'Ale yeast', kind: 'ale', attenuationPct: 75 }],
    mash: { steps: [{ tempC: 66, timeMin: 60 }] },
    fermentation: { steps: [{ tempC: 19, days: 14 }] },
  };
}

const fraction = (min = 0.0001) => fc.double({ min, max: 1, noNaN: true });
const within = (min: number, max: number) => fc.double({ min, max, noNaN: true });

function fermentablesArb(volumeL: number, minKgShare: number) {
  return fc.array(
    fc.record({
      name: fc.constantFrom('Pale malt', 'Munich', 'Crystal', 'Sugar', 'Extract', 'Oats'),
      amountKg: fraction(minKgShare).map((share) => (share * volumeL) / 8.01),
      potentialPpg: within(0, 50),
      colorLovibond: within(0, 800),
      kind: fc.constantFrom(...FERMENTABLE_KINDS),
    }),
    { minLength: 1, maxLength: 8 },
  );
}

function hopsArb(volumeL: number, boilTimeMin: number) {
  return fc.array(
    fc
      .record({
        name: fc.constantFrom('Bittering', 'Aroma', 'Flavour'),
        amountG: fraction(0.001).map((share) => (share * volumeL * 100) / 8.01),
        alphaPct: within(0, 30),
        use: fc.constantFrom(...HOP_USES),
        timeShare: fraction(0),
        form: fc.constantFrom(...HOP_FORMS),
        tempC: fc.option(within(0, 100), { nil: undefined }),
      })
      .map(({ timeShare, ...hop }) => ({
        ...hop,
        timeMin: hop.use === 'boil' || hop.use === 'first_wort' ? timeShare * boilTimeMin : timeShare * 129600,
      })),
    { maxLength: 8 },
  );
}

const yeastArb = fc
  .record({
    name: fc.constantFrom('Ale yeast', 'Lager yeast', 'Farmhouse yeast'),
    kind: fc.constantFrom(...YEAST_KINDS),
    attenuationPct: within(1, 100),
    temps: fc.option(fc.tuple(within(0, 45), within(0, 45)), { nil: undefined }),
  })
  .map(({ temps, ...yeast }) =>
    temps ? { ...yeast, tempMinC: Math.min(...temps), tempMaxC: Math.max(...temps) } : yeast,
  );

const waterArb = within(0.1, 10000).chain((volumeL) =>
  fc.record({
    volumeL: fc.constant(volumeL),
    source: fc.record({
      calcium: within(0, 2000),
      magnesium: within(0, 2000),
      sodium: within(0, 2000),
      chloride: within(0, 2000),
      sulfate: within(0, 2000),
      bicarbonate: within(0, 2000),
    }),
    salts: fc.array(
      fc.record({ salt: fc.constantFrom(...SALT_NAMES), grams: fraction(0).map((share) => share * volumeL * 0.999) }),
      { maxLength: 5 },
    ),
  }),
);

const styleArb = fc.oneof(
  fc.constantFrom(...listStyles().map((style) => ({ code: style.code, name: style.name }))),
  fc.constant({ code: '99Z', name: 'Unknown style' }),
);

export interface RecipeArbOptions {
  /** Smallest grist entry as a share of volumeL / 8 (keeps scaling tests clear of rounding floors). */
  minKgShare?: number;
}

/** Documents inside the schema's bounds, edge values included (parse them before use). */
export function recipeInputArb(options: RecipeArbOptions = {}): fc.Arbitrary<RecipeDocumentInput> {
  return fc
    .record({ volumeL: within(0.1, 2000), boilTimeMin: within(0, 360), efficiencyPct: within(10, 100) })
    .chain((batch) =>
      fc.record({
        title: fc.constant('Generated recipe'),
        batch: fc.record({
          volumeL: fc.constant(batch.volumeL),
          boilTimeMin: fc.constant(batch.boilTimeMin),
          efficiencyPct: fc.constant(batch.efficiencyPct),
          boilOffLPerHour: within(0, 100),
          trubLossL: within(0, 500),
          grainAbsorptionLPerKg: within(0, 3),
          mashWaterLPerKg: within(1, 30),
        }),
        fermentables: fermentablesArb(batch.volumeL, options.minKgShare ?? 0.0001),
        hops: hopsArb(batch.volumeL, batch.boilTimeMin),
        yeasts: fc.array(yeastArb, { minLength: 1, maxLength: 3 }),
        mash: fc.record({
          steps: fc.array(fc.record({ tempC: within(25, 80), timeMin: within(0.01, 4320) }), { maxLength: 4 }),
        }),
        fermentation: fc.record({
          steps: fc.array(fc.record({ tempC: within(0, 40), days: within(0.01, 365) }), { maxLength: 3 }),
        }),
        water: fc.option(waterArb, { nil: undefined }),
        carbonation: fc.option(fc.record({ volumesCO2: within(1, 5), servingTempC: within(-2, 25) }), {
          nil: undefined,
        }),
        style: fc.option(styleArb, { nil: undefined }),
      }),
    );
}

/** Every number inside a value, with its path, for finiteness checks. */
export function collectNumbers(value: unknown, path = ''): { path: string; value: number }[] {
  if (typeof value === 'number') return [{ path, value }];
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([key, child]) => collectNumbers(child, path ? `${path}.${key}` : key));
}
