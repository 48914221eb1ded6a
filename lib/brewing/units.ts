import convert from 'convert-units';

/**
 * Unit conversions for the interface: the document is metric, a member may
 * read and type US units. Mass, volume, temperature and pressure go through
 * the convert-units package; mg/L of an ion in water is taken as ppm (dilute
 * solution, density 1 kg/L — common practice).
 */

type MassUnit = 'kg' | 'g' | 'lb' | 'oz';
type VolumeUnit = 'l' | 'ml' | 'gal' | 'qt';
type TemperatureUnit = 'C' | 'F';
type PressureUnit = 'kPa' | 'psi' | 'bar';
type ConcentrationUnit = 'mg/L' | 'ppm';
export type UnitName = MassUnit | VolumeUnit | TemperatureUnit | PressureUnit | ConcentrationUnit;

export type Quantity = 'mass' | 'hopMass' | 'volume' | 'temperature' | 'pressure' | 'concentration';
export type UnitSystem = 'metric' | 'us';

/** The unit each quantity is shown in, per system; the document stores the metric column. */
export const DISPLAY_UNITS: Record<UnitSystem, Record<Quantity, UnitName>> = {
  metric: { mass: 'kg', hopMass: 'g', volume: 'l', temperature: 'C', pressure: 'kPa', concentration: 'mg/L' },
  us: { mass: 'lb', hopMass: 'oz', volume: 'gal', temperature: 'F', pressure: 'psi', concentration: 'ppm' },
};

function libraryUnit(unit: UnitName): string {
  return unit === 'mg/L' ? 'ppm' : unit;
}

/** Converts between two units of the same kind; throws on a mass-to-volume mix-up. */
export function convertUnit(value: number, from: UnitName, to: UnitName): number {
  // Metric readers see stored values as they are; the library's unit lookup is the costly part.
  if (libraryUnit(from) === libraryUnit(to)) return value;
  return convert(value).from(libraryUnit(from)).to(libraryUnit(to));
}

/** Converts a stored metric value into the member's unit system. */
export function toDisplayUnits(value: number, quantity: Quantity, system: UnitSystem): number {
  return convertUnit(value, DISPLAY_UNITS.metric[quantity], DISPLAY_UNITS[system][quantity]);
}

/** Converts a value typed in the member's unit system back to the stored metric unit. */
export function fromDisplayUnits(value: number, quantity: Quantity, system: UnitSystem): number {
  return convertUnit(value, DISPLAY_UNITS[system][quantity], DISPLAY_UNITS.metric[quantity]);
}

export const kgToLb = (kg: number): number => convertUnit(kg, 'kg', 'lb');
export const lbToKg = (lb: number): number => convertUnit(lb, 'lb', 'kg');
export const gToOz = (g: number): number => convertUnit(g, 'g', 'oz');
export const ozToG = (oz: number): number => convertUnit(oz, 'oz', 'g');
export const litresToGallons = (litres: number): number => convertUnit(litres, 'l', 'gal');
export const gallonsToLitres = (gallons: number): number => convertUnit(gallons, 'gal', 'l');
export const celsiusToF = (tempC: number): number => convertUnit(tempC, 'C', 'F');
export const fahrenheitToC = (tempF: number): number => convertUnit(tempF, 'F', 'C');
export const kPaToPsi = (kPa: number): number => convertUnit(kPa, 'kPa', 'psi');
export const psiToKPa = (psi: number): number => convertUnit(psi, 'psi', 'kPa');
export const mgPerLToPpm = (mgPerL: number): number => convertUnit(mgPerL, 'mg/L', 'ppm');

/** Mash thickness: litres per kg ↔ US quarts per lb. */
export function litresPerKgToQuartsPerLb(litresPerKg: number): number {
  return convertUnit(litresPerKg, 'l', 'qt') / convertUnit(1, 'kg', 'lb');
}

export function quartsPerLbToLitresPerKg(quartsPerLb: number): number {
  return convertUnit(quartsPerLb, 'qt', 'l') / convertUnit(1, 'lb', 'kg');
}
