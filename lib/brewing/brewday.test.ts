import { describe, expect, it } from 'vitest';
import {
  COOLING_SHRINKAGE_FRACTION,
  PITCH_RATE_MILLION_CELLS_PER_ML_PLATO,
  infusionVolumeL,
  mashAndSpargeVolumes,
  measuredBeer,
  measuredEfficiencyPct,
  pitchCellsBillion,
  postBoilVolumeL,
  preBoilGravity,
  preBoilVolumeL,
  primaryFermentationFit,
  strikeWaterTempC,
} from './brewday';
import { KG_PER_LB, L_PER_US_GALLON, celsiusToFahrenheit, fahrenheitToCelsius } from './constants';
import { originalGravity } from './extract';
import { recipeDocumentSchema } from './schema';
import { minimalInput } from './test-fixtures';

const QUART_L = L_PER_US_GALLON / 4;

describe('mash water temperatures', () => {
  // John Palmer, How to Brew (3rd ed., 2006; edition and year from memory): Tw = (0.2 / r)(T2 − T1) + T2 (qt/lb, °F); printed 152 °F target,
  // 68 °F grain, 1.25 qt/lb → 165.4 °F. Palmer's metric constant 0.41 differs slightly from 0.2 qt/lb.
  it("reproduces Palmer's strike water example", () => {
    const litresPerKg = (1.25 * QUART_L) / KG_PER_LB;
    const tempC = strikeWaterTempC(fahrenheitToCelsius(152), fahrenheitToCelsius(68), litresPerKg);
    expect(Math.abs(celsiusToFahrenheit(tempC) - 165.4)).toBeLessThan(0.5);
  });

  // Palmer, How to Brew (2006), infusion equation Wa = (T2 − T1)(0.2 G + Wm) / (Tw − T2);
  // recomputed: 10 lb, 12.5 qt, 104 → 140 °F with 210 °F water → 7.46 qt.
  it('computes an infusion to raise the mash', () => {
    const litres = infusionVolumeL({
      currentTempC: fahrenheitToCelsius(104),
      targetTempC: fahrenheitToCelsius(140),
      infusionTempC: fahrenheitToCelsius(210),
      grainKg: 10 * KG_PER_LB,
      mashWaterL: 12.5 * QUART_L,
    });
    expect(Math.abs(litres / QUART_L - 7.46)).toBeLessThan(0.1);
  });

  it('refuses infusion water that is not hotter than the target, and needs none for no rise', () => {
    const base = { currentTempC: 50, targetTempC: 66, grainKg: 5, mashWaterL: 15 };
    expect(() => infusionVolumeL({ ...base, infusionTempC: 60 })).toThrow(RangeError);
    expect(infusionVolumeL({ ...base, targetTempC: 50, infusionTempC: 95 })).toBe(0);
  });
});

describe('volumes and gravities around the boil', () => {
  const doc = recipeDocumentSchema.parse(minimalInput());

  // Common practice: about 4% cooling shrinkage; boil-off per hour from the batch settings.
  it('adds losses, shrinkage and boil-off to reach the pre-boil volume', () => {
    expect(COOLING_SHRINKAGE_FRACTION).toBe(0.04);
    expect(postBoilVolumeL(doc.batch)).toBeCloseTo(21 / 0.96, 10);
    expect(preBoilVolumeL(doc.batch)).toBeCloseTo(21 / 0.96 + 4, 10);
  });

  it('dilutes the gravity points before the boil', () => {
    const og = 1.05;
    const pre = preBoilGravity(og, doc.batch);
    expect((pre - 1) * preBoilVolumeL(doc.batch)).toBeCloseTo((og - 1) * postBoilVolumeL(doc.batch), 10);
    expect(pre).toBeLessThan(og);
  });

  it('splits water into mash and sparge', () => {
    const volumes = mashAndSpargeVolumes(doc);
    expect(volumes.mashWaterL).toBeCloseTo(4 * 3, 10);
    expect(volumes.grainAbsorptionL).toBeCloseTo(4, 10);
    expect(volumes.totalWaterL).toBeCloseTo(volumes.preBoilVolumeL + 4, 10);
    expect(volumes.spargeWaterL).toBeCloseTo(volumes.totalWaterL - 12, 10);
    const thin = { ...doc, batch: { ...doc.batch, mashWaterLPerKg: 10 } };
    expect(mashAndSpargeVolumes(thin).spargeWaterL).toBe(0);
  });
});

describe('measured results', () => {
  it('gives ABV and attenuation from measured gravities', () => {
    const beer = measuredBeer(1.05, 1.01);
    expect(beer.abv).toBeCloseTo(5.25, 10);
    expect(beer.abvAlternate).toBeCloseTo(5.34, 2);
    expect(beer.apparentAttenuationPct).toBeCloseTo(80, 10);
    expect(beer.realAttenuationPct).toBeLessThan(beer.apparentAttenuationPct);
  });

  it('recovers the brewhouse efficiency a gravity came from, extracts counted at 100%', () => {
    const fermentables = [
      { name: 'Pale malt', amountKg: 4, potentialPpg: 37, colorLovibond: 3, kind: 'grain' as const },
      { name: 'Sugar', amountKg: 0.5, potentialPpg: 46, colorLovibond: 0, kind: 'sugar' as const },
    ];
    const og = originalGravity(fermentables, 20, 68);
    expect(measuredEfficiencyPct(fermentables, og, 20)).toBeCloseTo(68, 8);
    expect(measuredEfficiencyPct([fermentables[1]], og, 20)).toBe(0);
  });

  // George Fix, An Analysis of Brewing Techniques (1997): 0.75 million cells/mL/°P for ales,
  // 1.5 for lagers; printed 5.5 gal of 15 °P ale → about 234 billion cells.
  it('computes a pitch rate', () => {
    const cells = pitchCellsBillion(5.5 * L_PER_US_GALLON, 15, PITCH_RATE_MILLION_CELLS_PER_ML_PLATO.ale);
    expect(Math.abs(cells - 234)).toBeLessThan(1);
    expect(PITCH_RATE_MILLION_CELLS_PER_ML_PLATO.lager).toBe(1.5);
  });
});

describe('primary fermentation against the yeast range', () => {
  // Common practice: kveik ferments well around 29–35 °C and may stall when kept cool.
  it('flags a kveik kept at ale temperature and accepts it hot', () => {
    const kveik = { name: 'Kveik', kind: 'kveik' as const, attenuationPct: 80, tempMinC: 29, tempMaxC: 35 };
    const at = (tempC: number) =>
      primaryFermentationFit({
        yeasts: [kveik],
        fermentation: {
          steps: [
            { tempC, days: 5 },
            { tempC: 2, days: 3 },
          ],
        },
      });
    expect(at(18)).toEqual([{ yeastIndex: 0, tempC: 18, position: 'below' }]);
    expect(at(32)[0].position).toBe('within');
    expect(at(38)[0].position).toBe('above');
  });

  it('says nothing without a range or without fermentation steps', () => {
    const yeast = { name: 'Ale yeast', kind: 'ale' as const, attenuationPct: 75 };
    expect(primaryFermentationFit({ yeasts: [yeast], fermentation: { steps: [{ tempC: 19, days: 10 }] } })).toEqual([]);
    expect(primaryFermentationFit({ yeasts: [{ ...yeast, tempMinC: 15 }], fermentation: { steps: [] } })).toEqual([]);
  });
});
