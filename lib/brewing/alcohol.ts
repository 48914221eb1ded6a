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
 * alcohol at 6.9 kcal/g and remaining extract less 0.1 for ash at 4 kcal/g
 * (The Oxford Companion to Beer, ed. Garrett Oliver, 2011, "calories"; an EBC
 * analysis committee fit, as George Fix reported it in 1992). Never negative:
 * the ash term alone would make water −1.4 kcal.
 */
export function caloriesPer355mL(og: number, fg: number): number {
  const kcal = (6.9 * abwHall(og, fg) + 4.0 * (realExtractPlato(og, fg) - 0.1)) * fg * 3.55;
  return Math.max(kcal, 0);
}

/**
 * Main saccharification rest and apparent attenuation, as one continuous
 * straight line: a yeast's stated attenuation holds at a 66 °C rest, and each
 * °C hotter leaves about one percentage point more unfermentable dextrin (each
 * °C cooler, one point less), clamped to the 60–72 °C amylase range.
 * Beta-amylase is most active near 60–65 °C and denatures quickly above it,
 * alpha-amylase works on to about 70–72 °C (Briggs, Boulton, Brookes & Stevens,
 * Brewing: Science and Practice, 2004, ch. 4; from memory). The slope of 1
 * point per °C is the middle of the 0.5–1.5 points per °C rule of thumb
 * (common practice); the 66 °C reference is where yeast makers usually state
 * attenuation (common practice). Replaces the earlier flat 65–67 °C band, so a
 * rest 1 °C cooler now gives a drier beer, as brewers expect.
 */
export const REFERENCE_MASH_TEMP_C = 66;
const ATTENUATION_PCT_PER_MASH_C = 1;
const SACCHARIFICATION_TEMP_C = { min: 60, max: 72 } as const;
/** Rest temperatures offered when solving for a target FG (common practice). */
const DESIGN_REST_TEMP_C = { min: 62, max: 72 } as const;

/** Attenuation (%) after the mash-temperature adjustment; `mainMashTempC` null means no mash (no adjustment). */
export function adjustedAttenuationPct(yeastAttenuationPct: number, mainMashTempC: number | null): number {
  if (mainMashTempC === null) return clamp(yeastAttenuationPct, 0, 100);
  const tempC = clamp(mainMashTempC, SACCHARIFICATION_TEMP_C.min, SACCHARIFICATION_TEMP_C.max);
  const shiftPct = (REFERENCE_MASH_TEMP_C - tempC) * ATTENUATION_PCT_PER_MASH_C;
  return clamp(yeastAttenuationPct + shiftPct, 0, 100);
}

export type RestForFg =
  { ok: true; tempC: number } | { ok: false; reason: 'too_low' | 'too_high'; closestTempC: number; closestFg: number };

/**
 * The main rest temperature (62–72 °C) whose attenuation, by the line above,
 * ferments `og` down to `targetFg`: the inverse of adjustedAttenuationPct.
 * When no rest in that range gets there, says whether the target is below
 * what the coolest rest reaches ('too_low') or above the hottest ('too_high').
 */
export function restTempForFg(og: number, yeastAttenuationPct: number, targetFg: number): RestForFg {
  const points = og - 1;
  const wantedPct = points > 0 ? (1 - (targetFg - 1) / points) * 100 : yeastAttenuationPct;
  const tempC = REFERENCE_MASH_TEMP_C - (wantedPct - yeastAttenuationPct) / ATTENUATION_PCT_PER_MASH_C;
  if (tempC < DESIGN_REST_TEMP_C.min) {
    const closest = DESIGN_REST_TEMP_C.min;
    return {
      ok: false,
      reason: 'too_low',
      closestTempC: closest,
      closestFg: finalGravity(og, adjustedAttenuationPct(yeastAttenuationPct, closest)),
    };
  }
  if (tempC > DESIGN_REST_TEMP_C.max) {
    const closest = DESIGN_REST_TEMP_C.max;
    return {
      ok: false,
      reason: 'too_high',
      closestTempC: closest,
      closestFg: finalGravity(og, adjustedAttenuationPct(yeastAttenuationPct, closest)),
    };
  }
  return { ok: true, tempC };
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
