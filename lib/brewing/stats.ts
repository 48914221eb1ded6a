import {
  abvHall,
  abvSimple,
  adjustedAttenuationPct,
  caloriesPer355mL,
  finalGravity,
  mainSaccharificationTempC,
} from './alcohol';
import { hopIbu } from './bitterness';
import { kegPressureKPa, kegPressurePsi } from './carbonation';
import { maltColourUnits, moreySrm, srmToEbc } from './colour';
import { gravityToPoints } from './constants';
import { originalGravity } from './extract';
import { sgToPlato } from './gravity';
import type { HopUse, RecipeDocument, WaterProfile } from './schema';
import { fitStyle, type StyleFit } from './styles';
import { residualAlkalinity, sulfateToChlorideRatio, waterAfterSalts } from './water';

/** Version of the formulas behind computeStats; stored beside each recipe version's stats. */
export const ENGINE_VERSION = '1.0.0';

interface HopStats {
  name: string;
  use: HopUse;
  ibu: number;
}

interface WaterStats extends WaterProfile {
  sulfateToChloride: number;
  /** mg/L as CaCO3 (Kolbach). */
  residualAlkalinity: number;
}

interface CarbonationStats {
  volumesCO2: number;
  servingTempC: number;
  kegPressureKPa: number;
  kegPressurePsi: number;
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
  carbonation: CarbonationStats | null;
  styleFit: StyleFit | null;
}

/** With several yeasts the most attenuative one sets how far the beer ferments. */
function yeastAttenuationPct(doc: RecipeDocument): number {
  let best = 0;
  for (const yeast of doc.yeasts) if (yeast.attenuationPct > best) best = yeast.attenuationPct;
  return best;
}

function hopStats(doc: RecipeDocument, og: number): HopStats[] {
  const { volumeL, boilTimeMin } = doc.batch;
  return doc.hops.map((hop) => ({ name: hop.name, use: hop.use, ibu: hopIbu(hop, og, volumeL, boilTimeMin) }));
}

function waterStats(water: RecipeDocument['water']): WaterStats | null {
  if (!water) return null;
  const profile = waterAfterSalts(water.source, water.salts, water.volumeL);
  return {
    ...profile,
    sulfateToChloride: sulfateToChlorideRatio(profile),
    residualAlkalinity: residualAlkalinity(profile),
  };
}

function carbonationStats(carbonation: RecipeDocument['carbonation']): CarbonationStats | null {
  if (!carbonation) return null;
  const { volumesCO2, servingTempC } = carbonation;
  return {
    volumesCO2,
    servingTempC,
    kegPressureKPa: kegPressureKPa(volumesCO2, servingTempC),
    kegPressurePsi: kegPressurePsi(volumesCO2, servingTempC),
  };
}

/**
 * The numbers of a recipe. Takes a document already checked by
 * recipeDocumentSchema (no parsing here, so it stays cheap for previews).
 */
export function computeStats(doc: RecipeDocument): RecipeStats {
  const { volumeL, efficiencyPct } = doc.batch;
  const og = originalGravity(doc.fermentables, volumeL, efficiencyPct);
  const attenuationPct = adjustedAttenuationPct(yeastAttenuationPct(doc), mainSaccharificationTempC(doc.mash.steps));
  const fg = finalGravity(og, attenuationPct);
  const hops = hopStats(doc, og);
  let ibu = 0;
  for (const hop of hops) ibu += hop.ibu;
  const srm = moreySrm(maltColourUnits(doc.fermentables, volumeL));
  const abv = abvSimple(og, fg);
  const gravityPoints = gravityToPoints(og);
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
    water: waterStats(doc.water),
    carbonation: carbonationStats(doc.carbonation),
    styleFit: doc.style ? fitStyle(doc.style.code, { og, fg, abv, ibu, srm }) : null,
  };
}
