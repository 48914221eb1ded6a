import { describe, expect, it } from 'vitest';
import { scaleRecipe } from './scale';
import { computeStats } from './stats';
import { examplePaleAle } from './test-fixtures';

describe('scaleRecipe', () => {
  const doc = examplePaleAle();
  const before = computeStats(doc);

  it('keeps OG, IBU, colour and water concentrations when the volume changes', () => {
    const scaled = scaleRecipe(doc, { volumeL: 45 });
    const after = computeStats(scaled);
    expect(scaled.batch.volumeL).toBe(45);
    expect(after.og).toBeCloseTo(before.og, 4);
    expect(after.ibu).toBeCloseTo(before.ibu, 1);
    after.hops.forEach((hop, i) => expect(hop.ibu).toBeCloseTo(before.hops[i].ibu, 1));
    expect(after.srm).toBeCloseTo(before.srm, 2);
    expect(after.water?.calcium).toBeCloseTo(before.water!.calcium, 0);
    expect(scaled.water?.volumeL).toBeCloseTo(doc.water!.volumeL * 2.25, 10);
  });

  it('adds grain for a lower efficiency and keeps OG and IBU', () => {
    const scaled = scaleRecipe(doc, { volumeL: 20, efficiencyPct: 60 });
    const after = computeStats(scaled);
    expect(scaled.fermentables[0].amountKg).toBeCloseTo((doc.fermentables[0].amountKg * 72) / 60, 3);
    expect(after.og).toBeCloseTo(before.og, 4);
    expect(after.ibu).toBeCloseTo(before.ibu, 1);
  });

  it('scales extracts and sugars by volume only', () => {
    const withSugar = {
      ...doc,
      fermentables: [
        ...doc.fermentables,
        { ...doc.fermentables[0], name: 'Sugar', kind: 'sugar' as const, amountKg: 0.5 },
      ],
    };
    const scaled = scaleRecipe(withSugar, { volumeL: 40, efficiencyPct: 60 });
    expect(scaled.fermentables[3].amountKg).toBeCloseTo(1, 10);
    expect(computeStats(scaled).og).toBeCloseTo(computeStats(withSugar).og, 4);
  });

  it('returns the recipe when scaled there and back', () => {
    const back = scaleRecipe(scaleRecipe(doc, { volumeL: 60, efficiencyPct: 80 }), { volumeL: 20, efficiencyPct: 72 });
    back.fermentables.forEach((f, i) => expect(f.amountKg).toBeCloseTo(doc.fermentables[i].amountKg, 2));
    back.hops.forEach((h, i) => expect(h.amountG).toBeCloseTo(doc.hops[i].amountG, 0));
    expect(back.batch).toEqual(doc.batch);
  });
});
