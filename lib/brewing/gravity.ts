import { celsiusToFahrenheit } from './constants';

/**
 * Specific gravity ↔ degrees Plato, hydrometer and refractometer readings.
 */

/** SG → °P. ASBC polynomial as printed in Noonan, New Brewing Lager Beer (1996). */
export function sgToPlato(sg: number): number {
  return ((135.997 * sg - 630.272) * sg + 1111.14) * sg - 616.868;
}

/** °P → SG, the common inverse approximation (within about 0.0005 SG of the ASBC tables up to 25 °P). */
export function platoToSg(plato: number): number {
  return 1 + plato / (258.6 - (plato / 258.2) * 227.1);
}

/** Water density ratio fit used by the hydrometer correction (x in °F); a fit to water density, common practice. */
function hydrometerDensityFit(tempF: number): number {
  return 1.00130346 - 1.34722124e-4 * tempF + 2.04052596e-6 * tempF ** 2 - 2.32820948e-9 * tempF ** 3;
}

/**
 * Corrects a hydrometer reading taken at `sampleTempC` for an instrument
 * calibrated at `calibrationTempC` (15.6 °C = 60 °F is the usual calibration).
 * Check values: Burch, Brewing Quality Beers (1986).
 */
export function correctHydrometerReading(readingSg: number, sampleTempC: number, calibrationTempC = 15.56): number {
  const sample = hydrometerDensityFit(celsiusToFahrenheit(sampleTempC));
  const calibration = hydrometerDensityFit(celsiusToFahrenheit(calibrationTempC));
  return (readingSg * sample) / calibration;
}

/** The usual wort correction factor between refractometer Brix and wort °P (common practice, 1.02–1.06). */
export const DEFAULT_WORT_CORRECTION_FACTOR = 1.04;

/** Gravity of unfermented wort from a refractometer reading in °Brix. */
export function brixToGravity(brix: number, wortCorrectionFactor = DEFAULT_WORT_CORRECTION_FACTOR): number {
  return platoToSg(brix / wortCorrectionFactor);
}

/**
 * Current gravity of fermenting beer from the original and the current
 * refractometer readings (°Brix). Cubic fit from Sean Terrill, "Refractometer
 * FG Results" (2011); alcohol bends the refractometer reading, so the raw
 * current Brix alone overstates the gravity's fall.
 */
export function fermentingGravityFromBrix(
  originalBrix: number,
  currentBrix: number,
  wortCorrectionFactor = DEFAULT_WORT_CORRECTION_FACTOR,
): number {
  const ri = originalBrix / wortCorrectionFactor;
  const rf = currentBrix / wortCorrectionFactor;
  return (
    1 -
    0.0044993 * ri +
    0.011774 * rf +
    0.00027581 * ri ** 2 -
    0.0012717 * rf ** 2 -
    0.00000728 * ri ** 3 +
    0.000063293 * rf ** 3
  );
}
