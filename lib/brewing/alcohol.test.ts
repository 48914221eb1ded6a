import { describe, expect, it } from 'vitest';
import {
  abvHall,
  abvSimple,
  adjustedAttenuationPct,
  apparentAttenuationPct,
  caloriesPer355mL,
  finalGravity,
  mainSaccharificationTempC,
  realAttenuationPct,
  realExtractPlato,
  REFERENCE_MASH_TEMP_C,
  restTempForFg,
} from './alcohol';
import { sgToPlato } from './gravity';

describe('alcohol', () => {
  // Common practice: OG 1.057 fermented to 1.017 is about 5.3% ABV.
  it('gives about 5.3% ABV for 1.057 → 1.017', () => {
    expect(abvSimple(1.057, 1.017)).toBeCloseTo(5.25, 2);
    expect(Math.abs(abvSimple(1.057, 1.017) - 5.3)).toBeLessThan(0.1);
  });

  // Michael Hall, "Brew by the Numbers", Zymurgy (summer 1995): ABW = 76.08 (OG − FG) / (1.775 − OG),
  // ABV = ABW × FG / 0.794. Recomputed: 1.050/1.010 → 5.34%; 1.065/1.012 → 7.24%.
  it('follows Hall', () => {
    expect(abvHall(1.05, 1.01)).toBeCloseTo(5.34, 2);
    expect(abvHall(1.065, 1.012)).toBeCloseTo(7.24, 2);
  });

  // Common practice: alcohol comes only from fermented extract, so no gravity drop means no alcohol.
  it('gives no alcohol without a gravity drop', () => {
    expect(abvSimple(1.05, 1.05)).toBe(0);
    expect(abvHall(1.05, 1.05)).toBe(0);
  });
});

describe('attenuation and extract', () => {
  // Common practice: apparent attenuation = (OG − FG) / (OG − 1), in gravity points.
  it('computes apparent attenuation as the share of gravity points gone', () => {
    expect(apparentAttenuationPct(1.05, 1.01)).toBeCloseTo(80, 10);
    expect(apparentAttenuationPct(1, 1)).toBe(0);
  });

  // Balling's relation (real extract = 0.1808 OE + 0.8192 AE; source not verified):
  // real attenuation is about 0.82 of apparent attenuation.
  it('computes real extract and real attenuation', () => {
    expect(realExtractPlato(1.05, 1.01)).toBeCloseTo(0.1808 * sgToPlato(1.05) + 0.8192 * sgToPlato(1.01), 10);
    const real = realAttenuationPct(1.05, 1.01);
    expect(real).toBeGreaterThan(64);
    expect(real).toBeLessThan(67);
  });

  // kcal per 12 US fl oz (355 mL) = [6.9 ABW + 4 (RE − 0.1)] × FG × 3.55, ash 0.1: a widely printed
  // secondary form whose first author we have not traced (from memory, it restates the brewing
  // chemists' energy values of 6.9 kcal per gram of alcohol and 4 per gram of carbohydrate). Its
  // printed check is "about 165 kcal" for 1.050 → 1.010; worked by hand here: ABW (Hall, "Brew by the
  // Numbers", Zymurgy, 1995) = 76.08 × 0.040 / 0.725 = 4.1975; OE 12.388 °P and AE 2.561 °P (Noonan,
  // New Brewing Lager Beer, 1996); RE = 0.1808 × 12.388 + 0.8192 × 2.561 = 4.3375;
  // kcal = (6.9 × 4.1975 + 4 × 4.2375) × 1.010 × 3.55 = 164.6.
  it('estimates calories per 355 mL by the published formula', () => {
    expect(caloriesPer355mL(1.05, 1.01)).toBeCloseTo(164.6, 1);
    expect(Math.abs(caloriesPer355mL(1.05, 1.01) - 165)).toBeLessThan(1);
  });

  // Water has no calories (a fact of nutrition); the formula's ash term alone would give
  // 4 × (0 − 0.1) × 1 × 3.55 = −1.42 kcal for it, which the estimate must not show.
  it('gives water no calories rather than a negative count', () => {
    expect(caloriesPer355mL(1, 1)).toBe(0);
  });
});

describe('final gravity from yeast and mash', () => {
  // Common practice: a yeast's stated apparent attenuation leaves that share of the points unfermented.
  it('uses FG = 1 + (OG − 1)(1 − attenuation)', () => {
    expect(finalGravity(1.05, 75)).toBeCloseTo(1.0125, 10);
  });

  // The flat 65–67 °C band is replaced by a continuous line: the yeast's stated attenuation at a 66 °C
  // rest, one point per °C (common practice, the middle of the 0.5–1.5 points per °C rule of thumb);
  // beta-amylase gives way to alpha-amylase as the rest gets hotter (Briggs et al., Brewing: Science
  // and Practice, 2004; from memory), so a hotter rest always leaves more dextrin.
  it('moves attenuation continuously with the main rest, hotter rest lower attenuation', () => {
    expect(adjustedAttenuationPct(75, REFERENCE_MASH_TEMP_C)).toBe(75);
    expect(adjustedAttenuationPct(75, 65)).toBeCloseTo(76, 10);
    expect(adjustedAttenuationPct(75, 67)).toBeCloseTo(74, 10);
    expect(adjustedAttenuationPct(75, 65.5)).toBeGreaterThan(adjustedAttenuationPct(75, 66));
    expect(adjustedAttenuationPct(75, 69)).toBeLessThan(75);
    expect(adjustedAttenuationPct(75, 63)).toBeGreaterThan(75);
    expect(adjustedAttenuationPct(75, null)).toBe(75);
    for (let t = 60; t < 72; t += 0.5) {
      expect(adjustedAttenuationPct(75, t + 0.5)).toBeLessThan(adjustedAttenuationPct(75, t));
    }
  });

  // The inverse of the same line: the rest that gives a target FG, and none when 62–72 °C cannot.
  it('finds the rest temperature for a target FG and says when none in 62–72 °C reaches it', () => {
    const og = 1.05;
    const wanted = finalGravity(og, adjustedAttenuationPct(78, 68.4));
    const found = restTempForFg(og, 78, wanted);
    expect(found.ok && found.tempC).toBeCloseTo(68.4, 6);
    const tooDry = restTempForFg(og, 78, 1.002);
    expect(tooDry).toMatchObject({ ok: false, reason: 'too_low', closestTempC: 62 });
    const tooSweet = restTempForFg(og, 78, 1.03);
    expect(tooSweet).toMatchObject({ ok: false, reason: 'too_high', closestTempC: 72 });
  });

  it('clamps the adjustment and the attenuation', () => {
    expect(adjustedAttenuationPct(75, 79)).toBe(adjustedAttenuationPct(75, 72));
    expect(adjustedAttenuationPct(75, 40)).toBe(adjustedAttenuationPct(75, 60));
    expect(adjustedAttenuationPct(99, 60)).toBe(100);
    expect(adjustedAttenuationPct(2, 72)).toBe(0);
  });

  // Common practice: beta and alpha amylase work at about 60–72 °C; protein rests and mash-out do not set fermentability.
  it('weights the saccharification rests by time and ignores protein and mash-out rests', () => {
    const steps = [
      { tempC: 52, timeMin: 15 },
      { tempC: 63, timeMin: 30 },
      { tempC: 70, timeMin: 30 },
      { tempC: 77, timeMin: 10 },
    ];
    expect(mainSaccharificationTempC(steps)).toBeCloseTo(66.5, 10);
    expect(mainSaccharificationTempC([{ tempC: 77, timeMin: 10 }])).toBeNull();
    expect(mainSaccharificationTempC([])).toBeNull();
  });
});
