import { describe, expect, it } from 'vitest';
import { describeFit, scaleRecipe } from './scale';
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

  // Morey's colour counts grain weight, extract counts weight × efficiency: a brewhouse that extracts
  // less adds base malt (more than the efficiency ratio) and holds the specialty malts near the volume
  // ratio, so OG, IBU and colour all stay (Morey, as printed by Palmer, How to Brew).
  it('adds base malt for a lower efficiency and keeps OG, IBU and colour', () => {
    const scaled = scaleRecipe(doc, { volumeL: 20, efficiencyPct: 60 });
    const after = computeStats(scaled);
    expect(scaled.fermentables[0].amountKg).toBeGreaterThan((doc.fermentables[0].amountKg * 72) / 60);
    expect(scaled.fermentables[2].amountKg).toBeLessThan((doc.fermentables[2].amountKg * 72) / 60);
    expect(after.og).toBeCloseTo(before.og, 3);
    expect(after.ibu).toBeCloseTo(before.ibu, 1);
    expect(after.srm).toBeCloseTo(before.srm, 1);
  });

  it('takes the new brewhouse losses and lists what it changes', () => {
    const scaled = scaleRecipe(doc, { volumeL: 40, efficiencyPct: 65, trubLossL: 2.5, boilOffLPerHour: 6 });
    expect(scaled.batch).toMatchObject({ volumeL: 40, efficiencyPct: 65, trubLossL: 2.5, boilOffLPerHour: 6 });
    const changes = describeFit(doc, scaled);
    expect(changes.find((c) => c.what === 'Batch volume')).toEqual({
      what: 'Batch volume',
      from: 20,
      to: 40,
      unit: 'L',
    });
    expect(changes.find((c) => c.what === doc.fermentables[0].name)?.to).toBe(scaled.fermentables[0].amountKg);
    // Hops are marked as hop weights, so US members read them in ounces; salts stay in grams,
    // as brewers weigh them in every system (common practice).
    expect(changes.find((c) => c.what.startsWith(doc.hops[0].name))?.unit).toBe('hop g');
    expect(changes.some((c) => c.what === 'Mash thickness')).toBe(false);
    // A dry hop is named by its days in contact, a boil addition by its minutes.
    const whats = changes.map((c) => c.what);
    expect(whats).toContain('Cascade (dry hop, 3 days)');
    expect(whats).toContain('Magnum (boil, 60 min)');
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
