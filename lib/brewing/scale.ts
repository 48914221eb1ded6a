import { hopIbu } from './bitterness';
import { isMashed, originalGravity } from './extract';
import type { RecipeDocument } from './schema';

/**
 * A brewhouse to fit a recipe to, as plain numbers: from the member's settings,
 * or a measured efficiency from their brew days. Left-out fields keep the recipe's.
 */
export interface ScaleTarget {
  volumeL: number;
  /** Brewhouse efficiency of the brewery the recipe moves to; the recipe's own when left out. */
  efficiencyPct?: number;
  boilOffLPerHour?: number;
  trubLossL?: number;
  grainAbsorptionLPerKg?: number;
  mashWaterLPerKg?: number;
}

/** Malts at or below this colour count as base malt when the fit keeps colour (common practice: base malts are 1.5–4 °L). */
const BASE_MALT_MAX_LOVIBOND = 5;

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
 * changes, base and specialty malts get their own ratios so both the extract
 * and Morey's colour units hold (colourKeepingRatios); a grist of one colour
 * group cannot do both, and its colour moves with the grain weight.
 * Losses (boil-off, trub, absorption, mash thickness) are the new brewhouse's
 * and do not change OG, which is counted at the batch volume.
 * The result is a plain document: check it with recipeDocumentSchema before
 * saving (a much lower efficiency can push the grist past its bound).
 */
export function scaleRecipe(doc: RecipeDocument, target: ScaleTarget): RecipeDocument {
  const efficiencyPct = target.efficiencyPct ?? doc.batch.efficiencyPct;
  const volumeRatio = target.volumeL / doc.batch.volumeL;
  const grainRatio = volumeRatio * (doc.batch.efficiencyPct / efficiencyPct);
  const batch = {
    ...doc.batch,
    volumeL: target.volumeL,
    efficiencyPct,
    boilOffLPerHour: target.boilOffLPerHour ?? doc.batch.boilOffLPerHour,
    trubLossL: target.trubLossL ?? doc.batch.trubLossL,
    grainAbsorptionLPerKg: target.grainAbsorptionLPerKg ?? doc.batch.grainAbsorptionLPerKg,
    mashWaterLPerKg: target.mashWaterLPerKg ?? doc.batch.mashWaterLPerKg,
  };
  const { base, specialty } = colourKeepingRatios(doc, volumeRatio, grainRatio, efficiencyPct);
  const fermentables = doc.fermentables.map((fermentable) => {
    const ratio = !isMashed(fermentable.kind)
      ? volumeRatio
      : fermentable.colorLovibond <= BASE_MALT_MAX_LOVIBOND
        ? base
        : specialty;
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

/**
 * Ratios for base and specialty malt that keep both the extract (OG) and
 * Morey's malt colour units (colour) at a new efficiency: two linear equations
 * in two unknowns. Extract: Σ kg × ppg × efficiency; colour: Σ kg × °L, each
 * per litre. Base malt carries most extract, specialty malt most colour, so
 * the brewhouse that extracts less adds base malt and holds the specialty
 * malts at the volume ratio (colour comes from the grain, not the efficiency).
 * Falls back to one ratio for all mashed grain when the grist has no malt of
 * one group or the answer would take a group below nothing.
 */
function colourKeepingRatios(doc: RecipeDocument, volumeRatio: number, grainRatio: number, efficiencyPct: number) {
  const same = { base: grainRatio, specialty: grainRatio };
  if (efficiencyPct === doc.batch.efficiencyPct) return same;
  let baseExtract = 0;
  let specialtyExtract = 0;
  let baseColour = 0;
  let specialtyColour = 0;
  for (const f of doc.fermentables) {
    if (!isMashed(f.kind)) continue;
    if (f.colorLovibond <= BASE_MALT_MAX_LOVIBOND) {
      baseExtract += f.amountKg * f.potentialPpg;
      baseColour += f.amountKg * f.colorLovibond;
    } else {
      specialtyExtract += f.amountKg * f.potentialPpg;
      specialtyColour += f.amountKg * f.colorLovibond;
    }
  }
  // Wanted: extract × new efficiency = old extract × old efficiency × volume ratio; colour × volume ratio.
  const extractWanted = ((baseExtract + specialtyExtract) * doc.batch.efficiencyPct * volumeRatio) / efficiencyPct;
  const colourWanted = (baseColour + specialtyColour) * volumeRatio;
  const determinant = baseExtract * specialtyColour - specialtyExtract * baseColour;
  if (!(Math.abs(determinant) > 1e-12)) return same;
  const base = (extractWanted * specialtyColour - specialtyExtract * colourWanted) / determinant;
  const specialty = (baseExtract * colourWanted - extractWanted * baseColour) / determinant;
  // A grist where one group carries next to no extract or colour gives a wild answer: keep one ratio then.
  const low = 0.5 * Math.min(volumeRatio, grainRatio);
  const high = 2 * Math.max(volumeRatio, grainRatio);
  const sensible = (ratio: number) => ratio >= low && ratio <= high;
  return sensible(base) && sensible(specialty) ? { base, specialty } : same;
}

/**
 * The stored unit of a fit line. `hop g` is a hop's weight (shown in ounces to US members); `g` is
 * a water salt, weighed in grams in every system (common practice).
 */
export type FitUnit = 'L' | '%' | 'L/h' | 'L/kg' | 'kg' | 'hop g' | 'g';

/** One line of what a fit changes, for showing before it is applied. */
export interface FitChange {
  what: string;
  from: number;
  to: number;
  unit: FitUnit;
}

/** A hop's time as brewers say it: a dry hop in days, a boil or stand in minutes. */
function hopTimeWords(timeMin: number, use: string): string {
  const MINUTES_PER_DAY = 24 * 60;
  if (use === 'dry_hop' && timeMin >= MINUTES_PER_DAY) {
    const days = Math.round((timeMin / MINUTES_PER_DAY) * 10) / 10;
    return `${days} day${days === 1 ? '' : 's'}`;
  }
  return `${timeMin} min`;
}

/** What `scaleRecipe` changed between two documents of the same shape: batch numbers and every amount. */
export function describeFit(before: RecipeDocument, after: RecipeDocument): FitChange[] {
  const changes: FitChange[] = [];
  const push = (what: string, from: number, to: number, unit: FitUnit) => {
    if (from !== to) changes.push({ what, from, to, unit });
  };
  push('Batch volume', before.batch.volumeL, after.batch.volumeL, 'L');
  push('Brewhouse efficiency', before.batch.efficiencyPct, after.batch.efficiencyPct, '%');
  push('Boil-off', before.batch.boilOffLPerHour, after.batch.boilOffLPerHour, 'L/h');
  push('Kettle trub loss', before.batch.trubLossL, after.batch.trubLossL, 'L');
  push('Grain absorption', before.batch.grainAbsorptionLPerKg, after.batch.grainAbsorptionLPerKg, 'L/kg');
  push('Mash thickness', before.batch.mashWaterLPerKg, after.batch.mashWaterLPerKg, 'L/kg');
  before.fermentables.forEach((f, i) => push(f.name, f.amountKg, after.fermentables[i]?.amountKg ?? 0, 'kg'));
  before.hops.forEach((h, i) =>
    push(
      `${h.name} (${h.use.replace('_', ' ')}, ${hopTimeWords(h.timeMin, h.use)})`,
      h.amountG,
      after.hops[i]?.amountG ?? 0,
      'hop g',
    ),
  );
  if (before.water && after.water) {
    push('Water', before.water.volumeL, after.water.volumeL, 'L');
    before.water.salts.forEach((s, i) =>
      push(s.salt.replace('_', ' '), s.grams, after.water!.salts[i]?.grams ?? 0, 'g'),
    );
  }
  return changes;
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
    ...(water.acid && { acid: { ...water.acid, mL: roundTo(water.acid.mL * volumeRatio, GRAM_DECIMALS) } }),
  };
}
