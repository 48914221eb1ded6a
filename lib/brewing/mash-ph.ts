import { isMashed } from './extract';
import type { Fermentable, WaterProfile } from './schema';
import { residualAlkalinity } from './water';

/**
 * Predicted room-temperature mash pH from the grist and the mash water, after
 * the model Troester published ("The effect of brewing water and grist
 * composition on the pH of the mash", 2009) and Palmer & Kaminski carry
 * (Water: A Comprehensive Guide for Brewers, 2013, ch. 5–6):
 *  - each malt has a distilled-water mash pH set by its kind and colour, and a
 *    buffering capacity; the grist's pH is the buffering-weighted mean;
 *  - the water's residual alkalinity (Kolbach) adds mEq per kg of grist that
 *    the grist's buffering turns into a pH shift, so a thin mash moves more;
 *  - acidulated malt lowers the mash about 0.1 pH per 1 % of the grist
 *    (common practice); an acid addition removes its mEq like negative RA.
 * The per-kind values below are from memory of those sources, not copied from
 * a printed table; a homebrewer's measured 5.33 is the check (fact of the trade).
 */

export type MaltClass = 'base' | 'crystal' | 'roasted' | 'acidulated';

/** Buffering capacity of malt, mEq per kg per pH unit (roughly 30–50 for base malt; from memory, Troester 2009). */
const MALT_BUFFER_MEQ_PER_KG_PH = 33;
/** Distilled-water pH of base malt at 2 °L and its fall per °L of colour (from memory, Troester 2009). */
const BASE_PH_AT_2L = 5.72;
const BASE_PH_PER_LOVIBOND = -0.02;
/** Crystal malts: pH ≈ 5.22 − 0.00504 × °L (a published linear fit; from memory, Troester 2009). */
const CRYSTAL_PH_AT_0L = 5.22;
const CRYSTAL_PH_PER_LOVIBOND = -0.00504;
/** Roasted malts: about 4.6–4.8 (from memory, Troester 2009). */
const ROASTED_PH = 4.7;
/** Acidulated malt lowers a mash about 0.1 pH per 1 % of the grist (common practice). */
const ACIDULATED_PH_PER_PCT = 0.1;
/** mEq of acid per mL (common practice; within 10 % of the Henderson–Hasselbalch figure at mash pH, see acid-strength.test.ts). */
export const ACID_MEQ_PER_ML = { lactic_88: 11.8, phosphoric_10: 1.0 } as const;
export type AcidKind = keyof typeof ACID_MEQ_PER_ML;

const ROASTED_NAME = /roast|black|chocolate|coffee/i;
const CRYSTAL_NAME = /crystal|caramel|cara/i;
const ACID_NAME = /acid/i;

/** Kind of malt for the pH model, from its name and colour (roasted above 200 °L whatever the name). */
export function maltClass(fermentable: Pick<Fermentable, 'name' | 'colorLovibond'>): MaltClass {
  if (ACID_NAME.test(fermentable.name)) return 'acidulated';
  if (ROASTED_NAME.test(fermentable.name) || fermentable.colorLovibond > 200) return 'roasted';
  if (CRYSTAL_NAME.test(fermentable.name)) return 'crystal';
  return 'base';
}

/** Distilled-water mash pH of one malt (acidulated malt is handled as a shift of the whole grist). */
export function distilledWaterPh(fermentable: Pick<Fermentable, 'name' | 'colorLovibond'>): number {
  const kind = maltClass(fermentable);
  if (kind === 'roasted') return ROASTED_PH;
  if (kind === 'crystal') return CRYSTAL_PH_AT_0L + CRYSTAL_PH_PER_LOVIBOND * fermentable.colorLovibond;
  return BASE_PH_AT_2L + BASE_PH_PER_LOVIBOND * (fermentable.colorLovibond - 2);
}

export interface MashPhInput {
  fermentables: readonly Fermentable[];
  /** Ions of the water in the mash (after salts). */
  water: WaterProfile;
  /** Mash water per kg of grist (L/kg). */
  mashWaterLPerKg: number;
  /** Acid added to the mash water, mEq in all. */
  acidMEq?: number;
}

/** Grist kg and buffering-weighted distilled-water pH of the mashed malts; null with nothing mashed. */
function gristPh(fermentables: readonly Fermentable[]) {
  let kg = 0;
  let acidulatedKg = 0;
  let weightedPh = 0;
  for (const f of fermentables) {
    if (!isMashed(f.kind)) continue;
    kg += f.amountKg;
    if (maltClass(f) === 'acidulated') {
      acidulatedKg += f.amountKg;
      continue;
    }
    weightedPh += f.amountKg * distilledWaterPh(f);
  }
  if (kg <= 0) return null;
  const otherKg = kg - acidulatedKg;
  const basePh = otherKg > 0 ? weightedPh / otherKg : BASE_PH_AT_2L;
  return { kg, ph: basePh - ACIDULATED_PH_PER_PCT * ((acidulatedKg / kg) * 100) };
}

/** Predicted room-temperature mash pH; null when nothing is mashed (an extract brew). */
export function predictedMashPh(input: MashPhInput): number | null {
  const grist = gristPh(input.fermentables);
  if (!grist) return null;
  const buffering = grist.kg * MALT_BUFFER_MEQ_PER_KG_PH;
  // RA mg/L as CaCO3 → mEq/L (50.04 mg per mEq), times the litres in the mash.
  const raMEq = (residualAlkalinity(input.water) / 50.04) * input.mashWaterLPerKg * grist.kg;
  return grist.ph + (raMEq - (input.acidMEq ?? 0)) / buffering;
}

/**
 * mL of acid that bring the mash from `predictedPh` down to `targetPh` (0 when
 * it is already there or below; acids only lower pH).
 */
export function acidForMashPh(
  fermentables: readonly Fermentable[],
  predictedPh: number,
  targetPh: number,
  acid: AcidKind,
): number {
  const grist = gristPh(fermentables);
  if (!grist || predictedPh <= targetPh) return 0;
  return ((predictedPh - targetPh) * grist.kg * MALT_BUFFER_MEQ_PER_KG_PH) / ACID_MEQ_PER_ML[acid];
}
