import { hopIbu } from './bitterness';
import { isMashed, originalGravity } from './extract';
import type { RecipeDocument } from './schema';

export interface ScaleTarget {
  volumeL: number;
  /** Brewhouse efficiency of the brewery the recipe moves to; the recipe's own when left out. */
  efficiencyPct?: number;
}

/** Rounds to a number of decimals; amounts are rounded to what a brewer weighs. */
function roundTo(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}

/** Grist to 1 g, hops and salts to 0.1 g; a scaled grist or hop amount never rounds to nothing. */
const KG_DECIMALS = 3;
const GRAM_DECIMALS = 1;
const SMALLEST_KG = 0.001;
const SMALLEST_G = 0.1;

/**
 * Rescales a recipe to another batch volume and brewhouse efficiency, keeping
 * its original gravity and each hop's IBU. Mashed grain scales by the volume
 * ratio times the efficiency ratio, extracts and sugars by the volume ratio.
 * Each hop is then weighed so its IBU at the new gravity (after rounding the
 * grist) matches the original — utilisation depends on gravity, and IBU is
 * proportional to grams at a fixed gravity, so one correction is exact.
 * Water and salts scale with the batch, keeping ion concentrations.
 * Colour: at an unchanged efficiency it is kept exactly; when the efficiency
 * changes, Morey's estimate (which counts grain weight, not extract) moves with
 * the grain weight even though the extracted colour is the same.
 * The result is a plain document: check it with recipeDocumentSchema before
 * saving (a much lower efficiency can push the grist past its bound).
 */
export function scaleRecipe(doc: RecipeDocument, target: ScaleTarget): RecipeDocument {
  const efficiencyPct = target.efficiencyPct ?? doc.batch.efficiencyPct;
  const volumeRatio = target.volumeL / doc.batch.volumeL;
  const grainRatio = volumeRatio * (doc.batch.efficiencyPct / efficiencyPct);
  const batch = { ...doc.batch, volumeL: target.volumeL, efficiencyPct };
  const fermentables = doc.fermentables.map((fermentable) => {
    const ratio = isMashed(fermentable.kind) ? grainRatio : volumeRatio;
    return { ...fermentable, amountKg: Math.max(roundTo(fermentable.amountKg * ratio, KG_DECIMALS), SMALLEST_KG) };
  });
  const oldOg = originalGravity(doc.fermentables, doc.batch.volumeL, doc.batch.efficiencyPct);
  const newOg = originalGravity(fermentables, batch.volumeL, batch.efficiencyPct);
  const hops = doc.hops.map((hop) => {
    const scaledHop = { ...hop, amountG: hop.amountG * volumeRatio };
    const wantedIbu = hopIbu(hop, oldOg, doc.batch.volumeL, doc.batch.boilTimeMin);
    const scaledIbu = hopIbu(scaledHop, newOg, batch.volumeL, batch.boilTimeMin);
    const correction = scaledIbu > 0 ? wantedIbu / scaledIbu : 1;
    return { ...hop, amountG: Math.max(roundTo(scaledHop.amountG * correction, GRAM_DECIMALS), SMALLEST_G) };
  });
  return { ...doc, batch, fermentables, hops, water: scaleWater(doc.water, volumeRatio) };
}

function scaleWater(water: RecipeDocument['water'], volumeRatio: number): RecipeDocument['water'] {
  if (!water) return undefined;
  return {
    ...water,
    volumeL: water.volumeL * volumeRatio,
    salts: water.salts.map((addition) => ({
      ...addition,
      grams: roundTo(addition.grams * volumeRatio, GRAM_DECIMALS),
    })),
  };
}
