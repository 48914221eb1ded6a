import { describe, expect, it } from 'vitest';
import { computeStats, recipeDocumentSchema } from '@/lib/brewing';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

/** The page's text without tags, spaces collapsed. */
const textOf = (html: string) =>
  html
    .replace(/<[^>]+>/g, ' ')
    .replace(/&#x27;|&apos;/g, "'")
    .replace(/\s+/g, ' ');

describe('the brew sheet', () => {
  it('gives the predicted mash pH beside a blank to write the measured one, and the spunding setting', async () => {
    const { client } = await signedInClient();
    const document = paleAle({
      fermentation: { steps: [{ tempC: 18, days: 10 }], spunding: { pressureKPa: 100, tempC: 18 } },
    });
    const saved = await createRecipeVia(client, { document });
    const res = await new TestClient().fetch(`/print/recipes/${saved.recipe.slug}/v/1`);
    expect(res.status).toBe(200);
    const text = textOf(await res.text());
    // The sheet shows the engine's own prediction (Troester 2009 model, lib/brewing/mash-ph.ts).
    const predicted = computeStats(recipeDocumentSchema.parse(document)).mash.predictedPh!;
    expect(text).toContain(`Mash pH (room temperature) ${predicted.toFixed(2)} predicted (aim 5.2–5.6)`);
    expect(text).toContain('Spund: set the valve to 100 kPa with the beer at 18 °C');
    expect(text).toContain('pressure-relief valve');
  });
});
