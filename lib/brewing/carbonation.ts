import { KPA_PER_PSI, celsiusToFahrenheit } from './constants';

/** Grams of CO2 in one litre of gas at 0 °C and 1 atm: "volumes of CO2" are counted in these litres. */
const CO2_G_PER_L_AT_STP = 1.977;

/**
 * Gauge pressure (psi) that holds `volumesCO2` in beer at `tempC`: the
 * regression behind the widely printed force-carbonation tables (check values
 * from those tables). Below 0 means no head pressure is needed; returned as 0.
 */
export function kegPressurePsi(volumesCO2: number, tempC: number): number {
  const t = celsiusToFahrenheit(tempC);
  const v = volumesCO2;
  const psi = -16.6999 - 0.0101059 * t + 0.00116512 * t * t + 0.173354 * t * v + 4.24267 * v - 0.0684226 * v * v;
  return Math.max(psi, 0);
}

export function kegPressureKPa(volumesCO2: number, tempC: number): number {
  return kegPressurePsi(volumesCO2, tempC) * KPA_PER_PSI;
}

/**
 * CO2 (volumes) left dissolved in beer after fermentation, from the highest
 * temperature it reached: V = 3.0378 − 0.050062 T + 0.00026555 T², T in °F
 * (a fit to CO2 solubility at 1 atm; secondary source).
 */
export function residualCO2Volumes(highestBeerTempC: number): number {
  const t = celsiusToFahrenheit(highestBeerTempC);
  return 3.0378 - 0.050062 * t + 0.00026555 * t * t;
}

export type PrimingSugar = 'glucose' | 'dextrose_monohydrate' | 'sucrose';

/** Molar masses from IUPAC standard atomic weights (C 12.011, H 1.008, O 15.999). */
const GLUCOSE_G_PER_MOL = 6 * 12.011 + 12 * 1.008 + 6 * 15.999;
const WATER_G_PER_MOL = 2 * 1.008 + 15.999;
const SUCROSE_G_PER_MOL = 12 * 12.011 + 22 * 1.008 + 11 * 15.999;
const CO2_G_PER_MOL = 12.011 + 2 * 15.999;

/**
 * Grams of sugar per gram of CO2 made by fermentation: glucose gives two CO2
 * (C6H12O6 → 2 C2H5OH + 2 CO2); sucrose is two hexoses, four CO2.
 */
export const SUGAR_G_PER_G_CO2: Record<PrimingSugar, number> = {
  glucose: GLUCOSE_G_PER_MOL / (2 * CO2_G_PER_MOL),
  dextrose_monohydrate: (GLUCOSE_G_PER_MOL + WATER_G_PER_MOL) / (2 * CO2_G_PER_MOL),
  sucrose: SUCROSE_G_PER_MOL / (4 * CO2_G_PER_MOL),
};

/**
 * Priming sugar (g) for bottling `volumeL` of beer to `targetVolumesCO2`,
 * counting the CO2 left from fermentation at `highestBeerTempC`. Assumes the
 * yeast ferments the sugar fully. Never negative.
 */
export function primingSugarGrams(
  targetVolumesCO2: number,
  highestBeerTempC: number,
  volumeL: number,
  sugar: PrimingSugar,
): number {
  const missingVolumes = Math.max(targetVolumesCO2 - residualCO2Volumes(highestBeerTempC), 0);
  return missingVolumes * CO2_G_PER_L_AT_STP * SUGAR_G_PER_G_CO2[sugar] * volumeL;
}

/**
 * CO2 (volumes) a beer holds under a head pressure of `psi` at `tempC`: the
 * force-carbonation regression of kegPressurePsi solved for V (the smaller
 * root of its quadratic in V), which is what a spunding valve set to that
 * pressure leaves in the beer. At or below 0 psi, the 1 atm residual CO2.
 */
export function volumesAtPressurePsi(psi: number, tempC: number): number {
  if (psi <= 0) return residualCO2Volumes(tempC);
  const t = celsiusToFahrenheit(tempC);
  const a = 0.0684226;
  const b = 0.173354 * t + 4.24267;
  const c = psi - (-16.6999 - 0.0101059 * t + 0.00116512 * t * t);
  const discriminant = b * b - 4 * a * c;
  // Past the top of the parabola (about 30 volumes) the regression has no answer; hold the top.
  if (discriminant <= 0) return b / (2 * a);
  return (b - Math.sqrt(discriminant)) / (2 * a);
}

export function volumesAtPressureKPa(kPa: number, tempC: number): number {
  return volumesAtPressurePsi(kPa / KPA_PER_PSI, tempC);
}
