import { describe, expect, it } from 'vitest';
import { L_PER_US_GALLON } from './constants';
import type { WaterProfile } from './schema';
import {
  MASH_PH_TARGET,
  SALT_ION_MG_PER_G,
  SULFATE_CHLORIDE_READING,
  planWaterSalts,
  residualAlkalinity,
  sulfateToChlorideRatio,
  waterAfterSalts,
} from './water';

const DISTILLED: WaterProfile = { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 };

describe('ions from salts', () => {
  // Mass fractions from IUPAC standard atomic weights (mg/L per g/L; in brackets ppm per g in one US gallon),
  // each computed from those atomic weights (IUPAC, Standard Atomic Weights, 2021).
  it.each([
    ['gypsum', 'calcium', 232.8, 61.5],
    ['gypsum', 'sulfate', 557.9, 147.4],
    ['epsom', 'magnesium', 98.6, 26.1],
    ['epsom', 'sulfate', 389.7, 103.0],
    ['table_salt', 'sodium', 393.4, 103.9],
    ['table_salt', 'chloride', 606.6, 160.3],
    ['calcium_chloride', 'calcium', 272.6, 72.0],
    ['calcium_chloride', 'chloride', 482.3, 127.4],
    ['baking_soda', 'sodium', 273.7, 72.3],
    ['baking_soda', 'bicarbonate', 726.3, 191.9],
  ] as const)('%s gives %s at %s mg per g', (salt, ion, mgPerG, ppmPerGramInGallon) => {
    // The table prints one decimal; allow its rounding plus a hair for atomic-weight editions.
    expect(Math.abs(SALT_ION_MG_PER_G[salt][ion] - mgPerG)).toBeLessThanOrEqual(0.06);
    expect(Math.abs(SALT_ION_MG_PER_G[salt][ion] / L_PER_US_GALLON - ppmPerGramInGallon)).toBeLessThanOrEqual(0.06);
  });

  // Common practice: 8 US gallons of near-mineral-free water with 5 g gypsum, 3 g Epsom salt, 3 g table salt
  // and 10 g calcium chloride (dihydrate) gives about 128 Ca, 10 Mg, 39 Na, 219 Cl, 130 SO4, 0 HCO3 mg/L.
  it('reproduces a common salt addition to 8 gallons of soft water', () => {
    const salts = [
      { salt: 'gypsum', grams: 5 },
      { salt: 'epsom', grams: 3 },
      { salt: 'table_salt', grams: 3 },
      { salt: 'calcium_chloride', grams: 10 },
    ] as const;
    const water = waterAfterSalts(DISTILLED, [...salts], 8 * L_PER_US_GALLON);
    const expected = { calcium: 128, magnesium: 10, sodium: 39, chloride: 219, sulfate: 130, bicarbonate: 0 };
    for (const [ion, mgPerL] of Object.entries(expected)) {
      expect(Math.abs(water[ion as keyof WaterProfile] - mgPerL)).toBeLessThanOrEqual(2);
    }
  });

  // Common practice: salt additions add to the source water's ions (baking soda: 726.3 mg/L bicarbonate per g/L, IUPAC weights as above).
  it('adds salts on top of the source water', () => {
    const source = { ...DISTILLED, calcium: 40, bicarbonate: 100 };
    const water = waterAfterSalts(source, [{ salt: 'baking_soda', grams: 2 }], 20);
    expect(water.calcium).toBe(40);
    expect(water.bicarbonate).toBeCloseTo(100 + (726.3 * 2) / 20, 0);
  });
});

describe('water readings', () => {
  // Kolbach's (1953; year from memory) residual alkalinity as given by John Palmer, How to Brew (3rd ed., 2006; edition and year from memory): RA = alkalinity − (Ca/1.4 + Mg/1.7);
  // recomputed: alkalinity 120, Ca 50, Mg 10 → 78.4 mg/L as CaCO3.
  it('computes residual alkalinity', () => {
    const bicarbonateForAlkalinity120 = (120 * 61.02) / 50.04;
    const profile = { ...DISTILLED, calcium: 50, magnesium: 10, bicarbonate: bicarbonateForAlkalinity120 };
    expect(residualAlkalinity(profile)).toBeCloseTo(78.4, 1);
  });

  // Common practice: above about 2 reads bitter-leaning, below about 0.8 soft and malty.
  it('reads the sulfate-to-chloride ratio and keeps it finite without chloride', () => {
    expect(sulfateToChlorideRatio({ ...DISTILLED, sulfate: 150, chloride: 50 })).toBe(3);
    expect(sulfateToChlorideRatio({ ...DISTILLED, sulfate: 150, chloride: 0 })).toBe(150);
    expect(SULFATE_CHLORIDE_READING.bitterAbove).toBe(2);
    expect(SULFATE_CHLORIDE_READING.maltyBelow).toBe(0.8);
  });

  // Common practice: a pale beer's mash pH of about 5.2–5.6 is the usual target.
  it('exposes the usual mash pH target', () => {
    expect(MASH_PH_TARGET).toEqual({ min: 5.2, max: 5.6 });
  });
});

describe('salt planning', () => {
  it('recovers the salts that made a profile', () => {
    const volumeL = 30;
    const salts = [
      { salt: 'gypsum', grams: 5 },
      { salt: 'epsom', grams: 3 },
      { salt: 'table_salt', grams: 3 },
      { salt: 'calcium_chloride', grams: 10 },
    ] as const;
    const target = waterAfterSalts(DISTILLED, [...salts], volumeL);
    const plan = planWaterSalts(DISTILLED, target, volumeL);
    expect(plan.salts).toEqual(salts.map((s) => ({ ...s })));
    expect(plan.rmsErrorMgPerL).toBeLessThan(0.5);
  });

  it('never proposes negative salts and adds nothing when the source already overshoots', () => {
    const source = { calcium: 200, magnesium: 30, sodium: 80, chloride: 200, sulfate: 300, bicarbonate: 300 };
    const plan = planWaterSalts(source, DISTILLED, 20);
    expect(plan.salts).toEqual([]);
    expect(plan.water).toEqual(source);
  });

  it('finds the least-squares answer among non-negative amounts', () => {
    const source = { calcium: 10, magnesium: 2, sodium: 5, chloride: 8, sulfate: 10, bicarbonate: 30 };
    const target = { calcium: 80, magnesium: 5, sodium: 20, chloride: 60, sulfate: 150, bicarbonate: 0 };
    const volumeL = 25;
    const plan = planWaterSalts(source, target, volumeL);
    for (const addition of plan.salts) expect(addition.grams).toBeGreaterThan(0);
    // No single-salt nudge of ±0.05 g improves the plan (a local, hence global, optimum of a convex problem).
    const error = (salts: { salt: (typeof plan.salts)[number]['salt']; grams: number }[]) => {
      const water = waterAfterSalts(source, salts, volumeL);
      return (Object.keys(target) as (keyof WaterProfile)[]).reduce(
        (sum, ion) => sum + (water[ion] - target[ion]) ** 2,
        0,
      );
    };
    const base = error(plan.salts);
    for (const salt of ['gypsum', 'epsom', 'table_salt', 'calcium_chloride', 'baking_soda'] as const) {
      for (const step of [0.05, -0.05]) {
        const grams = (plan.salts.find((s) => s.salt === salt)?.grams ?? 0) + step;
        if (grams < 0) continue;
        const nudged = [...plan.salts.filter((s) => s.salt !== salt), { salt, grams }];
        expect(error(nudged)).toBeGreaterThanOrEqual(base - 1e-6);
      }
    }
  });

  // A homebrewer's water (fact of the trade): 8 US gal of soft water with 5 g gypsum, 3 g Epsom salt,
  // 3 g table salt and 10 g calcium chloride dihydrate gives about 128 Ca / 10 Mg / 39 Na / 219 Cl /
  // 130 SO4 / 0 HCO3 mg/L. Solved backwards from the printed profile, the plan finds those salts.
  it('solves the seed pale ale water backwards from its printed profile', () => {
    const target = { calcium: 128, magnesium: 10, sodium: 39, chloride: 219, sulfate: 130, bicarbonate: 0 };
    const plan = planWaterSalts(DISTILLED, target, 8 * L_PER_US_GALLON);
    const grams = Object.fromEntries(plan.salts.map((s) => [s.salt, s.grams]));
    expect(grams.gypsum).toBeCloseTo(5, 0);
    expect(grams.epsom).toBeCloseTo(3, 0);
    expect(grams.table_salt).toBeCloseTo(3, 0);
    expect(grams.calcium_chloride).toBeCloseTo(10, 0);
    expect(grams.baking_soda).toBeUndefined();
    expect(plan.misses).toEqual([]);
    expect(plan.rmsErrorMgPerL).toBeLessThan(2);
  });

  // Salts only add ions (common practice): sodium already above target in the source is named, with how far off.
  it('names an ion the source already overshoots', () => {
    const source = { calcium: 5, magnesium: 2, sodium: 60, chloride: 10, sulfate: 10, bicarbonate: 20 };
    const target = { calcium: 128, magnesium: 10, sodium: 39, chloride: 219, sulfate: 130, bicarbonate: 0 };
    const plan = planWaterSalts(source, target, 30);
    const sodium = plan.misses.find((m) => m.ion === 'sodium');
    expect(sodium?.fromSource).toBe(true);
    expect(sodium!.offMgPerL).toBeGreaterThanOrEqual(21 - 1e-9);
    expect(plan.misses.find((m) => m.ion === 'bicarbonate')).toMatchObject({ fromSource: true, offMgPerL: 20 });
  });

  it('scales the grams with the volume treated and solves in well under 5 ms', () => {
    const target = { calcium: 90, magnesium: 8, sodium: 20, chloride: 120, sulfate: 180, bicarbonate: 10 };
    const source = { calcium: 4, magnesium: 1, sodium: 3, chloride: 4, sulfate: 3, bicarbonate: 15 };
    const started = performance.now();
    const small = planWaterSalts(source, target, 10);
    const elapsed = performance.now() - started;
    const large = planWaterSalts(source, target, 40);
    expect(elapsed).toBeLessThan(5);
    small.salts.forEach((s, i) => expect(large.salts[i].grams).toBeCloseTo(s.grams * 4, 1));
  });
});
