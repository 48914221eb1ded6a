import { POINTS_L_PER_KG_PER_PPG, gravityToPoints, pointsToGravity } from './constants';
import { abvHall, abvSimple, apparentAttenuationPct, realAttenuationPct } from './alcohol';
import { isMashed } from './extract';
import type { Fermentable, RecipeDocument } from './schema';

/**
 * Brew-day arithmetic: water temperatures and volumes before the boil, and
 * what measured gravities say afterwards.
 */

/** Heat capacity of grain relative to water, per kg of grain and litre of water (Palmer, How to Brew: 0.41 metric, 0.2 in qt/lb). */
const GRAIN_HEAT_CAPACITY_L_PER_KG = 0.41;

/** Wort shrinks about 4% cooling from boiling to pitching temperature (common practice). */
export const COOLING_SHRINKAGE_FRACTION = 0.04;

/**
 * Strike water temperature (°C) for a single infusion: Tw = (0.41 / r)(T2 − T1) + T2,
 * r the mash thickness in L/kg (Palmer, How to Brew).
 */
export function strikeWaterTempC(targetMashTempC: number, grainTempC: number, mashWaterLPerKg: number): number {
  return (GRAIN_HEAT_CAPACITY_L_PER_KG / mashWaterLPerKg) * (targetMashTempC - grainTempC) + targetMashTempC;
}

/**
 * Litres of hot water at `infusionTempC` that raise a mash from `currentTempC`
 * to `targetTempC`: Wa = (T2 − T1)(0.41 G + Wm) / (Tw − T2) (Palmer, How to Brew).
 * 0 when no rise is asked for; throws when the water is not hotter than the target.
 */
export function infusionVolumeL(input: {
  currentTempC: number;
  targetTempC: number;
  infusionTempC: number;
  grainKg: number;
  mashWaterL: number;
}): number {
  const { currentTempC, targetTempC, infusionTempC, grainKg, mashWaterL } = input;
  if (targetTempC <= currentTempC) return 0;
  if (infusionTempC <= targetTempC)
    throw new RangeError('Infusion water must be hotter than the target mash temperature');
  return (
    ((targetTempC - currentTempC) * (GRAIN_HEAT_CAPACITY_L_PER_KG * grainKg + mashWaterL)) /
    (infusionTempC - targetTempC)
  );
}

function mashedGrainKg(fermentables: readonly Fermentable[]): number {
  let kg = 0;
  for (const fermentable of fermentables) if (isMashed(fermentable.kind)) kg += fermentable.amountKg;
  return kg;
}

/** Hot wort volume (L) at the end of the boil: what reaches the fermenter plus kettle losses, before cooling. */
export function postBoilVolumeL(batch: RecipeDocument['batch']): number {
  return (batch.volumeL + batch.trubLossL) / (1 - COOLING_SHRINKAGE_FRACTION);
}

/** Volume (L) to collect in the kettle before the boil. */
export function preBoilVolumeL(batch: RecipeDocument['batch']): number {
  return postBoilVolumeL(batch) + (batch.boilOffLPerHour * batch.boilTimeMin) / 60;
}

/** Gravity before the boil: the same sugar in more wort. */
export function preBoilGravity(og: number, batch: RecipeDocument['batch']): number {
  return pointsToGravity((gravityToPoints(og) * postBoilVolumeL(batch)) / preBoilVolumeL(batch));
}

export interface WaterVolumes {
  mashWaterL: number;
  spargeWaterL: number;
  totalWaterL: number;
  preBoilVolumeL: number;
  grainAbsorptionL: number;
}

/**
 * Mash and sparge water for a recipe: the mash at the recipe's thickness, the
 * sparge making up what the grain keeps and the boil needs. Sparge water is
 * never negative (a thin mash may already give the whole pre-boil volume).
 */
export function mashAndSpargeVolumes(doc: Pick<RecipeDocument, 'batch' | 'fermentables'>): WaterVolumes {
  const grainKg = mashedGrainKg(doc.fermentables);
  const grainAbsorptionL = grainKg * doc.batch.grainAbsorptionLPerKg;
  const preBoilL = preBoilVolumeL(doc.batch);
  const mashWaterL = grainKg * doc.batch.mashWaterLPerKg;
  const totalWaterL = Math.max(preBoilL + grainAbsorptionL, mashWaterL);
  return {
    mashWaterL,
    spargeWaterL: totalWaterL - mashWaterL,
    totalWaterL,
    preBoilVolumeL: preBoilL,
    grainAbsorptionL,
  };
}

export interface MeasuredBeer {
  abv: number;
  abvAlternate: number;
  apparentAttenuationPct: number;
  realAttenuationPct: number;
}

/** What measured original and final gravities say about the beer. */
export function measuredBeer(og: number, fg: number): MeasuredBeer {
  return {
    abv: abvSimple(og, fg),
    abvAlternate: abvHall(og, fg),
    apparentAttenuationPct: apparentAttenuationPct(og, fg),
    realAttenuationPct: realAttenuationPct(og, fg),
  };
}

/**
 * Brewhouse efficiency (%) actually reached: gravity points measured in the
 * fermenter, less what extracts and sugars gave at 100%, over what the mashed
 * grist could have given. 0 when nothing was mashed.
 */
export function measuredEfficiencyPct(
  fermentables: readonly Fermentable[],
  measuredOg: number,
  volumeIntoFermenterL: number,
): number {
  let mashedPotential = 0;
  let unmashedPoints = 0;
  for (const fermentable of fermentables) {
    const pointLitres = fermentable.amountKg * fermentable.potentialPpg * POINTS_L_PER_KG_PER_PPG;
    if (isMashed(fermentable.kind)) mashedPotential += pointLitres;
    else unmashedPoints += pointLitres;
  }
  if (mashedPotential <= 0) return 0;
  return ((gravityToPoints(measuredOg) * volumeIntoFermenterL - unmashedPoints) / mashedPotential) * 100;
}

/**
 * Pitch rate in million cells per mL per °P (George Fix, An Analysis of
 * Brewing Techniques, 1997): 0.75 for ales, 1.5 for lagers.
 */
export const PITCH_RATE_MILLION_CELLS_PER_ML_PLATO = { ale: 0.75, lager: 1.5 } as const;

/** Yeast cells to pitch, in billions: rate × mL × °P / 1000. */
export function pitchCellsBillion(volumeL: number, plato: number, rateMillionPerMlPlato: number): number {
  return (rateMillionPerMlPlato * volumeL * 1000 * plato) / 1000;
}

export interface YeastTemperatureFit {
  yeastIndex: number;
  tempC: number;
  position: 'below' | 'within' | 'above';
}

/**
 * Where the primary fermentation (the first fermentation step) sits in each
 * yeast's stated range, for yeasts that give one. Too cool can stall a yeast
 * (kveik especially, common practice); too warm brings off-flavours. Later
 * steps are left out: a cold crash below the range is intended.
 */
export function primaryFermentationFit(doc: Pick<RecipeDocument, 'yeasts' | 'fermentation'>): YeastTemperatureFit[] {
  const primary = doc.fermentation.steps[0];
  if (!primary) return [];
  return doc.yeasts.flatMap((yeast, yeastIndex) => {
    if (yeast.tempMinC === undefined && yeast.tempMaxC === undefined) return [];
    const tooCool = yeast.tempMinC !== undefined && primary.tempC < yeast.tempMinC;
    const tooWarm = yeast.tempMaxC !== undefined && primary.tempC > yeast.tempMaxC;
    const position = tooCool ? 'below' : tooWarm ? 'above' : 'within';
    return [{ yeastIndex, tempC: primary.tempC, position }];
  });
}
