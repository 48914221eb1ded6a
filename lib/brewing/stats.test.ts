import { describe, expect, it } from 'vitest';
import { abvHall } from './alcohol';
import { hopIbu } from './bitterness';
import { maltColourUnits, moreySrm } from './colour';
import { originalGravity } from './extract';
import { sgToPlato } from './gravity';
import { recipeDocumentSchema } from './schema';
import { ENGINE_VERSION, computeStats, restTempForTargetFg } from './stats';
import { collectNumbers, examplePaleAle, minimalInput } from './test-fixtures';

describe('computeStats', () => {
  const doc = examplePaleAle();
  const stats = computeStats(doc);

  it('stamps the engine version', () => {
    expect(ENGINE_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
    expect(stats.engineVersion).toBe(ENGINE_VERSION);
  });

  it('puts the formulas together for the example pale ale', () => {
    expect(stats.og).toBeCloseTo(originalGravity(doc.fermentables, 20, 72), 12);
    expect(stats.attenuationPct).toBe(77);
    expect(stats.fg).toBeCloseTo(1 + (stats.og - 1) * 0.23, 12);
    expect(stats.abv).toBeCloseTo((stats.og - stats.fg) * 131.25, 12);
    expect(stats.abvAlternate).toBeCloseTo(abvHall(stats.og, stats.fg), 12);
    expect(stats.plato).toBeCloseTo(sgToPlato(stats.og), 12);
    expect(stats.srm).toBeCloseTo(moreySrm(maltColourUnits(doc.fermentables, 20)), 12);
    expect(stats.ebc).toBeCloseTo(stats.srm * 1.97, 12);
    expect(stats.buGu).toBeCloseTo(stats.ibu / ((stats.og - 1) * 1000), 12);
    expect(stats.caloriesPer355mL).toBeGreaterThan(150);
    expect(stats.caloriesPer355mL).toBeLessThan(220);
  });

  it("lists each hop's IBU in document order and totals them (Tinseth on OG and batch volume)", () => {
    expect(stats.hops.map((h) => h.name)).toEqual(doc.hops.map((h) => h.name));
    doc.hops.forEach((hop, i) => expect(stats.hops[i].ibu).toBeCloseTo(hopIbu(hop, stats.og, 20, 60), 12));
    expect(stats.hops[3].ibu).toBe(0);
    expect(stats.ibu).toBeCloseTo(
      stats.hops.reduce((sum, h) => sum + h.ibu, 0),
      12,
    );
  });

  it('reports the water after salts, its ratio and residual alkalinity', () => {
    expect(stats.water?.calcium).toBeGreaterThan(doc.water!.source.calcium);
    expect(stats.water?.sulfateToChloride).toBeCloseTo(stats.water!.sulfate / stats.water!.chloride, 12);
    expect(Number.isFinite(stats.water?.residualAlkalinity)).toBe(true);
  });

  it('reports keg pressure in kPa and psi', () => {
    expect(stats.carbonation?.kegPressureKPa).toBeCloseTo(stats.carbonation!.kegPressurePsi * 6.894757, 4);
    expect(stats.carbonation?.kegPressurePsi).toBeGreaterThan(5);
  });

  it('returns null for absent water, carbonation and style, and for an unknown style', () => {
    const bare = computeStats(recipeDocumentSchema.parse(minimalInput()));
    expect(bare.water).toBeNull();
    expect(bare.carbonation).toBeNull();
    expect(bare.styleFit).toBeNull();
    const unknown = computeStats(
      recipeDocumentSchema.parse({ ...minimalInput(), style: { code: '99Z', name: 'Mystery' } }),
    );
    expect(unknown.styleFit).toBeNull();
  });

  // Common practice: a hotter mash leaves a fuller beer (higher FG), a cooler one a drier beer; the
  // continuous rest model (alcohol.ts) moves FG for every degree, so 1 °C cooler is drier.
  it('raises FG for a hotter mash and lowers it for a cooler one', () => {
    const at = (tempC: number) =>
      computeStats(recipeDocumentSchema.parse({ ...minimalInput(), mash: { steps: [{ tempC, timeMin: 60 }] } })).fg;
    expect(at(65)).toBeLessThan(at(66));
    expect(at(70)).toBeGreaterThan(at(66));
    expect(at(62)).toBeLessThan(at(66));
  });

  // Common practice: with a blend of yeasts the most attenuative one finishes the beer.
  it('lets the most attenuative yeast set FG', () => {
    const input = minimalInput();
    input.yeasts = [...input.yeasts, { name: 'Dry yeast', kind: 'wild', attenuationPct: 88 }];
    expect(computeStats(recipeDocumentSchema.parse(input)).attenuationPct).toBe(88);
  });

  it('returns only finite numbers', () => {
    for (const { path, value } of collectNumbers(stats)) expect(Number.isFinite(value), path).toBe(true);
  });

  it('does not change the document', () => {
    const before = JSON.stringify(doc);
    computeStats(doc);
    expect(JSON.stringify(doc)).toBe(before);
  });

  // A homebrewer's single-malt pale ale: one pale malt, 128/10/39/219/130/0 water as the target, all the water in
  // the mash (5.5 L/kg), measured mash pH 5.33 (fact of the trade); spunding 103 kPa at 29.4 °C holds
  // about 1.3 volumes (the regression behind the widely printed force-carbonation tables, solved for volumes; from memory).
  it('designs the seed pale ale: salt plan, predicted mash pH, spunding and the rest for a target FG', () => {
    const input = minimalInput();
    input.batch = { ...input.batch, volumeL: 23, mashWaterLPerKg: 5.5 };
    input.fermentables = [{ name: 'Pale ale malt', amountKg: 5.5, potentialPpg: 38, colorLovibond: 3, kind: 'grain' }];
    const target = { calcium: 128, magnesium: 10, sodium: 39, chloride: 219, sulfate: 130, bicarbonate: 0 };
    const distilled = { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 };
    input.water = { volumeL: 30.28, source: distilled, salts: [], target };
    input.fermentation = { steps: [{ tempC: 30, days: 4 }], spunding: { pressureKPa: 103, tempC: 29.4 } };
    input.carbonation = { volumesCO2: 2.4, servingTempC: 4 };
    const planned = computeStats(recipeDocumentSchema.parse(input));
    const plan = planned.water!.plan!;
    expect(plan.misses).toEqual([]);
    input.water.salts = plan.salts;
    const designed = computeStats(recipeDocumentSchema.parse(input));
    expect(designed.water!.calcium).toBeCloseTo(128, -1);
    expect(designed.water!.chloride).toBeCloseTo(219, -1);
    expect(Math.abs(designed.mash.predictedPh! - 5.33)).toBeLessThan(0.1);
    expect(designed.mash.predictedPh!).toBeLessThan(planned.mash.predictedPh!);
    expect(Math.abs(designed.spunding!.volumesCO2 - 1.3)).toBeLessThan(0.05);
    expect(designed.carbonation!.spundingVolumesCO2).toBe(designed.spunding!.volumesCO2);
    expect(designed.spunding!.servingPressureKPa!).toBeLessThan(designed.spunding!.pressureKPa);
    expect(designed.spunding!.pressureForTargetKPa!).toBeGreaterThan(designed.spunding!.pressureKPa);
    const rest = restTempForTargetFg(recipeDocumentSchema.parse(input), designed.fg + 0.002);
    expect(rest.ok && rest.tempC).toBeGreaterThan(66);
  });

  it('counts a mash without a water section as distilled water and has no pH for an extract brew', () => {
    const bare = computeStats(recipeDocumentSchema.parse(minimalInput()));
    expect(bare.mash.predictedPh).toBeGreaterThan(5.6);
    expect(bare.spunding).toBeNull();
    const extract = minimalInput();
    extract.fermentables = [
      { name: 'Light extract', amountKg: 3, potentialPpg: 36, colorLovibond: 4, kind: 'extract' },
    ];
    expect(computeStats(recipeDocumentSchema.parse(extract)).mash.predictedPh).toBeNull();
  });
});
