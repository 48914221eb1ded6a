import type { RecipeDocumentInput } from '@/lib/brewing';

/** What a new recipe starts from: a plain pale ale on the member's own batch size and efficiency. */
export function starterDocument(defaults: { volumeL: number; efficiencyPct: number }): RecipeDocumentInput {
  return {
    title: 'New recipe',
    batch: { volumeL: defaults.volumeL, boilTimeMin: 60, efficiencyPct: defaults.efficiencyPct },
    fermentables: [
      {
        name: 'Pale ale malt',
        amountKg: Math.round(defaults.volumeL * 0.22 * 10) / 10,
        potentialPpg: 38,
        colorLovibond: 3,
        kind: 'grain',
      },
    ],
    hops: [
      {
        name: 'Cascade',
        amountG: Math.round(defaults.volumeL * 1.25),
        alphaPct: 6,
        use: 'boil',
        timeMin: 60,
        form: 'pellet',
      },
    ],
    yeasts: [{ name: 'Clean ale yeast', kind: 'ale', attenuationPct: 76, tempMinC: 16, tempMaxC: 22 }],
    mash: { steps: [{ name: 'Saccharification', tempC: 66, timeMin: 60 }] },
    fermentation: { steps: [{ tempC: 18, days: 14 }] },
    notes: '',
  };
}
