import { describe, expect, it } from 'vitest';
import { formatIssues, recipeDocumentSchema, type RecipeDocumentInput } from './schema';
import { examplePaleAleInput, minimalInput } from './test-fixtures';

/** Parses a document and returns its issues (empty when it is accepted). */
function issuesOf(input: unknown) {
  const result = recipeDocumentSchema.safeParse(input);
  return result.success ? [] : formatIssues(result.error);
}

function withChange(change: (doc: RecipeDocumentInput) => void): RecipeDocumentInput {
  const doc = structuredClone(examplePaleAleInput());
  change(doc);
  return doc;
}

describe('recipe document', () => {
  it('accepts the example and fills defaults', () => {
    const parsed = recipeDocumentSchema.parse(minimalInput());
    expect(parsed.notes).toBe('');
    expect(parsed.batch).toMatchObject({
      boilOffLPerHour: 4,
      trubLossL: 1,
      grainAbsorptionLPerKg: 1,
      mashWaterLPerKg: 3,
    });
    expect(issuesOf(examplePaleAleInput())).toEqual([]);
  });

  it('trims titles and names', () => {
    const parsed = recipeDocumentSchema.parse({ ...minimalInput(), title: '  Spaced  ' });
    expect(parsed.title).toBe('Spaced');
  });

  it.each<[string, (doc: RecipeDocumentInput) => void, string, RegExp]>([
    ['an empty title', (d) => (d.title = '   '), 'title', /Title cannot be empty/],
    ['a long title', (d) => (d.title = 'x'.repeat(121)), 'title', /Title must be at most 120/],
    ['a zero batch volume', (d) => (d.batch.volumeL = 0), 'batch.volumeL', /Batch volume/],
    ['a negative batch volume', (d) => (d.batch.volumeL = -5), 'batch.volumeL', /Batch volume/],
    ['a negative boil time', (d) => (d.batch.boilTimeMin = -1), 'batch.boilTimeMin', /Boil time/],
    ['an efficiency over 100%', (d) => (d.batch.efficiencyPct = 120), 'batch.efficiencyPct', /efficiency/],
    [
      'a negative fermentable',
      (d) => (d.fermentables[1].amountKg = -1),
      'fermentables.1.amountKg',
      /Fermentable amount/,
    ],
    ['an empty fermentable name', (d) => (d.fermentables[0].name = ''), 'fermentables.0.name', /Fermentable name/],
    [
      'an unknown fermentable kind',
      (d) => ((d.fermentables[0] as { kind: string }).kind = 'rock'),
      'fermentables.0.kind',
      /Fermentable kind must be one of/,
    ],
    ['alpha acid over 30%', (d) => (d.hops[2].alphaPct = 45), 'hops.2.alphaPct', /Alpha acid must be at most 30%/],
    ['a negative hop amount', (d) => (d.hops[0].amountG = -3), 'hops.0.amountG', /Hop amount/],
    ['an unknown hop use', (d) => ((d.hops[0] as { use: string }).use = 'tea'), 'hops.0.use', /Hop use must be one of/],
    ['a boil hop longer than the boil', (d) => (d.hops[0].timeMin = 90), 'hops.0.timeMin', /longer than the boil/],
    ['a hot hop stand over 100 °C', (d) => (d.hops[2].tempC = 120), 'hops.2.tempC', /Hop stand temperature/],
    ['attenuation over 100%', (d) => (d.yeasts[0].attenuationPct = 130), 'yeasts.0.attenuationPct', /Attenuation/],
    [
      'a yeast range upside down',
      (d) => Object.assign(d.yeasts[0], { tempMinC: 25, tempMaxC: 15 }),
      'yeasts.0.tempMaxC',
      /Highest yeast temperature/,
    ],
    [
      'a mash at 90 °C',
      (d) => (d.mash.steps[0].tempC = 90),
      'mash.steps.0.tempC',
      /Mash temperature must be at most 80/,
    ],
    [
      'a mash at 20 °C',
      (d) => (d.mash.steps[0].tempC = 20),
      'mash.steps.0.tempC',
      /Mash temperature must be at least 25/,
    ],
    [
      'a 100 °C fermentation',
      (d) => (d.fermentation.steps[0].tempC = 100),
      'fermentation.steps.0.tempC',
      /Fermentation temperature/,
    ],
    ['negative calcium', (d) => (d.water!.source.calcium = -1), 'water.source.calcium', /Calcium cannot be negative/],
    [
      'an unknown salt',
      (d) => ((d.water!.salts![0] as { salt: string }).salt = 'chalk'),
      'water.salts.0.salt',
      /Salt must be one of/,
    ],
    ['a pile of salt', (d) => (d.water!.salts![0].grams = 1000), 'water.salts', /Salts must total at most/],
    ['carbonation of 9 volumes', (d) => (d.carbonation!.volumesCO2 = 9), 'carbonation.volumesCO2', /Carbonation/],
    ['an empty style code', (d) => (d.style!.code = ''), 'style.code', /Style code/],
    ['no fermentables', (d) => (d.fermentables = []), 'fermentables', /Fermentables need at least one/],
    ['no yeast', (d) => (d.yeasts = []), 'yeasts', /Yeasts need at least one/],
  ])('refuses %s, naming the field', (_label, change, path, message) => {
    const issues = issuesOf(withChange(change));
    const issue = issues.find((i) => i.path === path);
    expect(issue, JSON.stringify(issues)).toBeDefined();
    expect(issue?.message).toMatch(message);
  });

  // Common practice: a very strong barley wine uses about 0.45 kg of grain per litre.
  it('refuses a 900 kg grist in a 20 L batch', () => {
    const issues = issuesOf(withChange((d) => (d.fermentables[0].amountKg = 900)));
    expect(issues).toEqual([{ path: 'fermentables', message: expect.stringMatching(/too much for a 20 L batch/) }]);
  });

  it('checks the grist against the batch even when another field is refused, but not against a refused volume', () => {
    const bothBad = withChange((d) => {
      d.fermentables[0].amountKg = 900;
      d.hops[0].alphaPct = 40;
    });
    expect(issuesOf(bothBad).map((i) => i.path)).toEqual(['hops.0.alphaPct', 'fermentables']);
    const zeroVolume = withChange((d) => (d.batch.volumeL = 0));
    expect(issuesOf(zeroVolume).map((i) => i.path)).toEqual(['batch.volumeL']);
    const negativeBoil = withChange((d) => (d.batch.boilTimeMin = -10));
    expect(issuesOf(negativeBoil).map((i) => i.path)).toEqual(['batch.boilTimeMin']);
  });

  it('refuses a hop load no beer uses', () => {
    const issues = issuesOf(withChange((d) => (d.hops[3].amountG = 5000)));
    expect(issues.map((i) => i.path)).toEqual(['hops']);
  });

  it('refuses missing fields and wrong types with readable messages', () => {
    const doc = withChange((d) => {
      delete (d.batch as Partial<typeof d.batch>).volumeL;
      (d.hops[1] as { alphaPct: unknown }).alphaPct = '6';
      (d as { title: unknown }).title = 42;
    });
    expect(issuesOf(doc)).toEqual(
      expect.arrayContaining([
        { path: 'batch.volumeL', message: 'Batch volume is required' },
        { path: 'hops.1.alphaPct', message: 'Alpha acid must be a number' },
        { path: 'title', message: 'Title must be text' },
      ]),
    );
    expect(issuesOf(null)).toEqual([{ path: '', message: 'Recipe must be an object' }]);
    expect(issuesOf({ ...minimalInput(), hops: undefined })).toEqual([{ path: 'hops', message: 'Hops are required' }]);
  });

  it('refuses non-finite numbers', () => {
    expect(issuesOf(withChange((d) => (d.batch.volumeL = Number.POSITIVE_INFINITY))).map((i) => i.path)).toContain(
      'batch.volumeL',
    );
    expect(issuesOf(withChange((d) => (d.hops[0].amountG = Number.NaN))).map((i) => i.path)).toContain(
      'hops.0.amountG',
    );
  });

  it('reports every bad field, not only the first', () => {
    const doc = withChange((d) => {
      d.hops[0].alphaPct = 31;
      d.hops[2].alphaPct = -1;
      d.fermentation.steps[0].tempC = 100;
    });
    expect(issuesOf(doc).map((i) => i.path)).toEqual([
      'hops.0.alphaPct',
      'hops.2.alphaPct',
      'fermentation.steps.0.tempC',
    ]);
  });
});
