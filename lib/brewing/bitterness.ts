import type { Hop } from './schema';

/**
 * Hop bitterness after Glenn Tinseth's utilisation model (c. 1995–97,
 * reproduced in Palmer, How to Brew, ch. 5): utilisation = bigness factor ×
 * boil-time factor, IBU = utilisation × mg/L of alpha acid added.
 */

/** Tinseth's bigness factor: denser wort isomerises less. */
export function tinsethBignessFactor(gravity: number): number {
  return 1.65 * Math.pow(0.000125, gravity - 1);
}

/** Tinseth's boil-time factor (time in minutes). */
export function tinsethTimeFactor(timeMin: number): number {
  return (1 - Math.exp(-0.04 * timeMin)) / 4.15;
}

/** Tinseth's utilisation for a hop boiled `timeMin` minutes in wort of the given gravity. */
export function tinsethUtilisation(gravity: number, timeMin: number): number {
  return tinsethBignessFactor(gravity) * tinsethTimeFactor(timeMin);
}

/** IBU from a utilisation, grams of hops at an alpha-acid percentage, and litres of wort. */
export function ibuFromUtilisation(utilisation: number, amountG: number, alphaPct: number, volumeL: number): number {
  return (utilisation * (alphaPct / 100) * amountG * 1000) / volumeL;
}

/**
 * Mash hops: most alpha acid stays in the grain bed and mash heat isomerises
 * little; a rule of thumb credits them about a fifth of a full-boil addition
 * (common practice). Measured at brewery scale, mash hops averaged 9.1%
 * utilisation against 44.0% for 60-minute additions (Justus, "Tracking IBU
 * Through the Brewing Process: The Quest for Consistency", MBAA Technical
 * Quarterly 55 (3), 2018).
 */
const MASH_HOP_FRACTION = 0.2;

/** Temperature assumed for a hop stand that gives none (common practice for a whirlpool rest). */
export const DEFAULT_HOP_STAND_TEMP_C = 80;

/**
 * Relative rate of alpha-acid isomerisation at `tempC` against a 100 °C boil:
 * Arrhenius scaling with an activation temperature of 11,858 K (Malowicki and
 * Shellhammer, "Isomerization and Degradation Kinetics of Hop Acids in a Model
 * Wort-Boiling System", J. Agric. Food Chem., 2005; constant from memory).
 * 1 at 100 °C, about 0.42 at 90 °C, 0.17 at 80 °C, 0.10 at 75 °C and falling
 * towards 0 below. An approximation: it ignores that the wort keeps cooling
 * during the stand.
 */
export function hopStandTemperatureFactor(tempC: number): number {
  const boilK = 373.15;
  const standK = Math.min(tempC, 100) + 273.15;
  return Math.exp(-11858 * (1 / standK - 1 / boilK));
}

/**
 * Utilisation of one addition:
 * - boil: Tinseth for its time (a flame-out addition, time 0, gives 0);
 * - first wort: counted as a boil addition for its time (no bonus);
 * - mash: MASH_HOP_FRACTION of a boil addition lasting the whole boil;
 * - whirlpool: Tinseth's time factor for the stand, scaled by hopStandTemperatureFactor;
 * - dry hop: 0 (no isomerisation in cold beer).
 * Pellets and leaf count alike.
 */
function hopUtilisation(hop: Hop, gravity: number, boilTimeMin: number): number {
  switch (hop.use) {
    case 'boil':
    case 'first_wort':
      return tinsethUtilisation(gravity, hop.timeMin);
    case 'mash':
      return MASH_HOP_FRACTION * tinsethUtilisation(gravity, boilTimeMin);
    case 'whirlpool':
      return (
        tinsethUtilisation(gravity, hop.timeMin) * hopStandTemperatureFactor(hop.tempC ?? DEFAULT_HOP_STAND_TEMP_C)
      );
    case 'dry_hop':
      return 0;
  }
}

/** IBU of one addition in a batch of `volumeL` at the given gravity. */
export function hopIbu(hop: Hop, gravity: number, volumeL: number, boilTimeMin: number): number {
  return ibuFromUtilisation(hopUtilisation(hop, gravity, boilTimeMin), hop.amountG, hop.alphaPct, volumeL);
}
