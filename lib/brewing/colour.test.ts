import { describe, expect, it } from 'vitest';
import {
  danielsSrm,
  ebcToSrm,
  lovibondToSrm,
  maltColourUnits,
  moreySrm,
  srmToEbc,
  srmToHex,
  srmToLovibond,
} from './colour';
import { KG_PER_LB, L_PER_US_GALLON } from './constants';

describe('beer colour', () => {
  // MCU = Σ(lb × °L) / gal (the definition behind Morey's and Daniels's formulas).
  it('computes malt colour units in metric as in US units', () => {
    const grist = [
      { amountKg: 10 * KG_PER_LB, colorLovibond: 3 },
      { amountKg: 1 * KG_PER_LB, colorLovibond: 60 },
    ];
    expect(maltColourUnits(grist, 5 * L_PER_US_GALLON)).toBeCloseTo((10 * 3 + 60) / 5, 10);
  });

  // Dan Morey, "Approximating Beer Color", Brewing Techniques (mid-1990s; year from memory): SRM = 1.4922 × MCU^0.6859.
  // Recomputed from the formula: MCU 20 → 11.65; MCU 56.4 → 23.72.
  it('follows Morey', () => {
    expect(moreySrm(20)).toBeCloseTo(11.65, 2);
    expect(moreySrm(56.4)).toBeCloseTo(23.72, 2);
    expect(moreySrm(0)).toBe(0);
  });

  // Ray Daniels, Designing Great Beers (1996): SRM = 0.2 × MCU + 8.4; printed 56.4 MCU → 19.7 SRM.
  // Morey and Daniels part for dark beers: Morey reads darker there.
  it('follows Daniels and differs from Morey for a dark grist', () => {
    expect(danielsSrm(56.4)).toBeCloseTo(19.7, 1);
    expect(moreySrm(56.4) - danielsSrm(56.4)).toBeGreaterThan(3);
  });

  // ASBC and EBC absorbance methods at 430 nm: SRM = 12.7 D A430, EBC = 25 D A430, so EBC ≈ 1.97 SRM.
  it('converts SRM to EBC and back', () => {
    expect(srmToEbc(10)).toBeCloseTo((25 / 12.7) * 10, 1);
    expect(ebcToSrm(srmToEbc(7.3))).toBeCloseTo(7.3, 10);
  });

  // Common conversion for malt colour (common practice): SRM = 1.3546 °L − 0.76.
  it('converts Lovibond to SRM and back', () => {
    expect(lovibondToSrm(10)).toBeCloseTo(12.786, 3);
    expect(srmToLovibond(lovibondToSrm(40))).toBeCloseTo(40, 10);
  });
});

describe('colour swatch (an approximation for display)', () => {
  const luminance = (hex: string) => {
    const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
    return 0.2126 * r + 0.7152 * g + 0.0722 * b;
  };

  it('gives a valid sRGB hex colour for any input, also out of range', () => {
    for (const srm of [-5, 0, 1, 2.5, 6, 11, 19, 30, 45, 1000, Number.NaN]) {
      expect(srmToHex(srm)).toMatch(/^#[0-9a-f]{6}$/);
    }
  });

  // Common practice: higher SRM is darker beer.
  it('darkens as SRM rises', () => {
    for (let srm = 1; srm < 40; srm += 0.5) {
      expect(luminance(srmToHex(srm + 0.5))).toBeLessThanOrEqual(luminance(srmToHex(srm)));
    }
  });

  // Common practice for on-screen beer colour: pale straw at 1–2 SRM, gold near 6,
  // amber 10–13, brown 17–20, near black above 30.
  it('runs from pale straw through gold, amber and brown to near black', () => {
    const channels = (hex: string) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
    const [strawR, strawG, strawB] = channels(srmToHex(1.5));
    expect(strawR).toBeGreaterThan(230);
    expect(strawG).toBeGreaterThan(220);
    expect(strawB).toBeLessThan(strawG);
    const [goldR, goldG, goldB] = channels(srmToHex(6));
    expect(goldR).toBeGreaterThan(goldG);
    expect(goldG).toBeGreaterThan(goldB * 2);
    const [amberR, amberG] = channels(srmToHex(12));
    expect(amberR).toBeGreaterThan(150);
    expect(amberG).toBeLessThan(amberR * 0.65);
    expect(luminance(srmToHex(18))).toBeLessThan(80);
    expect(luminance(srmToHex(35))).toBeLessThan(25);
  });
});
