/**
 * Exact unit definitions the engine's formulas use internally (international
 * yard and pound agreement, 1959; US liquid gallon = 231 cubic inches).
 * The interface converts through `units.ts`; these keep the hot path plain arithmetic.
 */
export const KG_PER_LB = 0.45359237;
export const L_PER_US_GALLON = 3.785411784;
export const G_PER_OZ = 28.349523125;
export const KPA_PER_PSI = 6.894757293168361;

/** 1 ppg (gravity points per lb per US gal) = 8.3454 points per kg per litre. */
export const POINTS_L_PER_KG_PER_PPG = L_PER_US_GALLON / KG_PER_LB;

export function celsiusToFahrenheit(tempC: number): number {
  return (tempC * 9) / 5 + 32;
}

export function fahrenheitToCelsius(tempF: number): number {
  return ((tempF - 32) * 5) / 9;
}

/** Gravity points: 1.050 → 50. */
export function gravityToPoints(sg: number): number {
  return (sg - 1) * 1000;
}

export function pointsToGravity(points: number): number {
  return 1 + points / 1000;
}

export function clamp(value: number, min: number, max: number): number {
  return value < min ? min : value > max ? max : value;
}

/** The ions a water profile carries, in the order they are shown. */
export const ION_NAMES = ['calcium', 'magnesium', 'sodium', 'chloride', 'sulfate', 'bicarbonate'] as const;
