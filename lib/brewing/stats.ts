import {
  abvHall,
  abvSimple,
  adjustedAttenuationPct,
  caloriesPer355mL,
  finalGravity,
  mainSaccharificationTempC,
  restTempForFg,
  type RestForFg,
} from './alcohol';
import { hopIbu } from './bitterness';
import { kegPressureKPa, kegPressurePsi, volumesAtPressureKPa } from './carbonation';
import { maltColourUnits, moreySrm, srmToEbc } from './colour';
import { gravityToPoints } from './constants';
import { originalGravity } from './extract';
import { ACID_MEQ_PER_ML, predictedMashPh } from './mash-ph';
import { sgToPlato } from './gravity';
import type { HopUse, RecipeDocument, WaterProfile } from './schema';
import { fitStyle, type StyleFit } from './styles';
import { planWaterSalts, residualAlkalinity, sulfateToChlorideRatio, waterAfterSalts, type SaltPlan } from './water';

/** Version of the formulas behind computeStats; stored beside each recipe version's stats. */
// 1.1.0: continuous main-rest attenuation (was a flat 65–67 °C band), predicted mash pH, salt plan, spunding.
export const ENGINE_VERSION = '1.1.0';

interface HopStats {
  name: string;
  use: HopUse;
  ibu: number;
}

interface WaterStats extends WaterProfile {
  sulfateToChloride: number;
  /** mg/L as CaCO3 (Kolbach). */
  residualAlkalinity: number;
  /** Salts proposed for the document's target profile; absent without a target. */
  plan?: SaltPlan;
}

interface MashStats {
  /** Predicted room-temperature mash pH (Troester 2009 model, see mash-ph.ts); null when nothing is mashed. */
  predictedPh: number | null;
  /** Time-weighted main saccharification rest (°C); null without one. */
  mainRestTempC: number | null;
}

interface SpundingStats {
  pressureKPa: number;
  tempC: number;
  /** CO2 the beer holds at the valve setting. */
  volumesCO2: number;
  /** Head pressure the same dissolved CO2 shows at serving temperature (sealed vessel). */
  servingPressureKPa: number | null;
  /** Pressure to set at the spunding temperature to reach the carbonation target. */
  pressureForTargetKPa: number | null;
}

interface CarbonationStats {
  volumesCO2: number;
  servingTempC: number;
  kegPressureKPa: number;
  kegPressurePsi: number;
  /** CO2 volumes held at the spunding valve setting, when the fermentation has one. */
  spundingVolumesCO2?: number;
}

export interface RecipeStats {
  engineVersion: string;
  og: number;
  fg: number;
  /** °P of the original gravity. */
  plato: number;
  /** ABV (%) by (OG − FG) × 131.25. */
  abv: number;
  /** ABV (%) by Hall (Zymurgy 1995). */
  abvAlternate: number;
  /** Apparent attenuation (%) used for FG: the yeast's, adjusted for mash temperature. */
  attenuationPct: number;
  ibu: number;
  hops: HopStats[];
  srm: number;
  ebc: number;
  /** Bitterness ratio: IBU over gravity points. */
  buGu: number;
  caloriesPer355mL: number;
  water: WaterStats | null;
  mash: MashStats;
  carbonation: CarbonationStats | null;
  spunding: SpundingStats | null;
  styleFit: StyleFit | null;
}

/** With several yeasts the most attenuative one sets how far the beer ferments. */
function yeastAttenuationPct(doc: RecipeDocument): number {
  let best = 0;
  for (const yeast of doc.yeasts) if (yeast.attenuationPct > best) best = yeast.attenuationPct;
  return best;
}

/**
 * The main rest temperature that brings this recipe to `targetFg` (62–72 °C),
 * by the inverse of the continuous rest model in alcohol.ts.
 */
export function restTempForTargetFg(doc: RecipeDocument, targetFg: number): RestForFg {
  const og = originalGravity(doc.fermentables, doc.batch.volumeL, doc.batch.efficiencyPct);
  return restTempForFg(og, yeastAttenuationPct(doc), targetFg);
}

function hopStats(doc: RecipeDocument, og: number): HopStats[] {
  const { volumeL, boilTimeMin } = doc.batch;
  return doc.hops.map((hop) => ({ name: hop.name, use: hop.use, ibu: hopIbu(hop, og, volumeL, boilTimeMin) }));
}

function waterStats(water: RecipeDocument['water']): WaterStats | null {
  if (!water) return null;
  const profile = waterAfterSalts(water.source, water.salts, water.volumeL);
  const stats: WaterStats = {
    ...profile,
    sulfateToChloride: sulfateToChlorideRatio(profile),
    residualAlkalinity: residualAlkalinity(profile),
  };
  if (water.target) stats.plan = planWaterSalts(water.source, water.target, water.volumeL);
  return stats;
}

/** Water of no ions: a mash without a water section is counted as distilled water. */
const DISTILLED: WaterProfile = { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 };

function mashStats(doc: RecipeDocument, water: WaterStats | null, mainRestTempC: number | null): MashStats {
  const acid = doc.water?.acid;
  return {
    predictedPh: predictedMashPh({
      fermentables: doc.fermentables,
      water: water ?? DISTILLED,
      mashWaterLPerKg: doc.batch.mashWaterLPerKg,
      acidMEq: acid ? acid.mL * ACID_MEQ_PER_ML[acid.kind] : 0,
    }),
    mainRestTempC,
  };
}

function spundingStats(doc: RecipeDocument): SpundingStats | null {
  const spunding = doc.fermentation.spunding;
  if (!spunding) return null;
  const carbonation = doc.carbonation;
  const volumesCO2 = volumesAtPressureKPa(spunding.pressureKPa, spunding.tempC);
  return {
    ...spunding,
    volumesCO2,
    servingPressureKPa: carbonation ? kegPressureKPa(volumesCO2, carbonation.servingTempC) : null,
    pressureForTargetKPa: carbonation ? kegPressureKPa(carbonation.volumesCO2, spunding.tempC) : null,
  };
}

function carbonationStats(
  carbonation: RecipeDocument['carbonation'],
  spunding: SpundingStats | null,
): CarbonationStats | null {
  if (!carbonation && !spunding) return null;
  // Spunded and not carbonated further: the beer carries what the valve left, served at the spunding temperature.
  const volumesCO2 = carbonation?.volumesCO2 ?? spunding!.volumesCO2;
  const servingTempC = carbonation?.servingTempC ?? spunding!.tempC;
  const stats: CarbonationStats = {
    volumesCO2,
    servingTempC,
    kegPressureKPa: kegPressureKPa(volumesCO2, servingTempC),
    kegPressurePsi: kegPressurePsi(volumesCO2, servingTempC),
  };
  if (spunding) stats.spundingVolumesCO2 = spunding.volumesCO2;
  return stats;
}

/**
 * The numbers of a recipe. Takes a document already checked by
 * recipeDocumentSchema (no parsing here, so it stays cheap for previews).
 */
export function computeStats(doc: RecipeDocument): RecipeStats {
  const { volumeL, efficiencyPct } = doc.batch;
  const og = originalGravity(doc.fermentables, volumeL, efficiencyPct);
  const mainRestTempC = mainSaccharificationTempC(doc.mash.steps);
  const attenuationPct = adjustedAttenuationPct(yeastAttenuationPct(doc), mainRestTempC);
  const fg = finalGravity(og, attenuationPct);
  const hops = hopStats(doc, og);
  let ibu = 0;
  for (const hop of hops) ibu += hop.ibu;
  const srm = moreySrm(maltColourUnits(doc.fermentables, volumeL));
  const abv = abvSimple(og, fg);
  const gravityPoints = gravityToPoints(og);
  const water = waterStats(doc.water);
  const spunding = spundingStats(doc);
  return {
    engineVersion: ENGINE_VERSION,
    og,
    fg,
    plato: sgToPlato(og),
    abv,
    abvAlternate: abvHall(og, fg),
    attenuationPct,
    ibu,
    hops,
    srm,
    ebc: srmToEbc(srm),
    buGu: gravityPoints > 0 ? ibu / gravityPoints : 0,
    caloriesPer355mL: caloriesPer355mL(og, fg),
    water,
    mash: mashStats(doc, water, mainRestTempC),
    carbonation: carbonationStats(doc.carbonation, spunding),
    spunding,
    styleFit: doc.style ? fitStyle(doc.style.code, { og, fg, abv, ibu, srm }) : null,
  };
}
