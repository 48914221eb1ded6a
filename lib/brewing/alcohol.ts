import { clamp } from './constants';
import { sgToPlato } from './gravity';

/** ABV (%) by the common formula (OG − FG) × 131.25. */
export function abvSimple(og: number, fg: number): number {
  return (og - fg) * 131.25;
}

/** Alcohol by weight (%): Michael Hall, "Brew by the Numbers", Zymurgy (summer 1995). */
function abwHall(og: number, fg: number): number {
  return (76.08 * (og - fg)) / (1.775 - og);
}

/** ABV (%) from Hall's ABW: ABV = ABW × FG / 0.794 (Hall, Zymurgy 1995). */
export function abvHall(og: number, fg: number): number {
  return (abwHall(og, fg) * fg) / 0.794;
}

/** Apparent attenuation (%): share of the original gravity points gone, as the hydrometer sees it. */
export function apparentAttenuationPct(og: number, fg: number): number {
  return og > 1 ? ((og - fg) / (og - 1)) * 100 : 0;
}

/** Real extract (°P) from original and apparent extract: RE = 0.1808 OE + 0.8192 AE (Balling's relation). */
export function realExtractPlato(og: number, fg: number): number {
  return 0.1808 * sgToPlato(og) + 0.8192 * sgToPlato(fg);
}

/** Real degree of attenuation (%): share of the original extract actually fermented. */
export function realAttenuationPct(og: number, fg: number): number {
  const originalPlato = sgToPlato(og);
  return originalPlato > 0 ? ((originalPlato - realExtractPlato(og, fg)) / originalPlato) * 100 : 0;
}

/**
 * kcal in 355 mL (12 US fl oz): [6.9 ABW + 4.0 (RE − 0.1)] × FG × 3.55,
 * alcohol at 6.9 kcal/g and remaining carbohydrate at 4 kcal/g (a formula
 * widely reprinted by brewing writers; secondary source). Never negative.
 */
export function caloriesPer355mL(og: number, fg: number): number {
  const kcal = (6.9 * abwHall(og, fg) + 4.0 * (realExtractPlato(og, fg) - 0.1)) * fg * 3.55;
  return Math.max(kcal, 0);
}

/**
 * Mash temperature band where a yeast's stated attenuation applies unchanged,
 * and how far each °C outside it moves attenuation: hotter mashes leave more
 * unfermentable dextrins, cooler ones fewer (common practice; the size of the
 * step, 1 percentage point per °C up to ±5, is a rule of thumb).
 */
const NEUTRAL_MASH_TEMP_C = { min: 65, max: 67 } as const;
const ATTENUATION_PCT_PER_MASH_C = 1;
const SACCHARIFICATION_TEMP_C = { min: 60, max: 72 } as const;

/** Attenuation (%) after the mash-temperature adjustment; `mainMashTempC` null means no mash (no adjustment). */
export function adjustedAttenuationPct(yeastAttenuationPct: number, mainMashTempC: number | null): number {
  if (mainMashTempC === null) return clamp(yeastAttenuationPct, 0, 100);
  const tempC = clamp(mainMashTempC, SACCHARIFICATION_TEMP_C.min, SACCHARIFICATION_TEMP_C.max);
  let shiftPct = 0;
  if (tempC > NEUTRAL_MASH_TEMP_C.max) shiftPct = -(tempC - NEUTRAL_MASH_TEMP_C.max) * ATTENUATION_PCT_PER_MASH_C;
  else if (tempC < NEUTRAL_MASH_TEMP_C.min) shiftPct = (NEUTRAL_MASH_TEMP_C.min - tempC) * ATTENUATION_PCT_PER_MASH_C;
  return clamp(yeastAttenuationPct + shiftPct, 0, 100);
}

/**
 * Time-weighted temperature of the saccharification rests (60–72 °C); null
 * when the mash has none (an extract brew, or only protein and mash-out rests).
 */
export function mainSaccharificationTempC(steps: readonly { tempC: number; timeMin: number }[]): number | null {
  let weightedC = 0;
  let minutes = 0;
  for (const step of steps) {
    if (step.tempC < SACCHARIFICATION_TEMP_C.min || step.tempC > SACCHARIFICATION_TEMP_C.max) continue;
    weightedC += step.tempC * step.timeMin;
    minutes += step.timeMin;
  }
  return minutes > 0 ? weightedC / minutes : null;
}

/** FG = 1 + (OG − 1)(1 − attenuation). */
export function finalGravity(og: number, attenuationPct: number): number {
  return 1 + (og - 1) * (1 - attenuationPct / 100);
}
