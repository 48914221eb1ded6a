import { describe, expect, it } from 'vitest';
import {
  SUGAR_G_PER_G_CO2,
  kegPressureKPa,
  kegPressurePsi,
  primingSugarGrams,
  residualCO2Volumes,
  volumesAtPressureKPa,
  volumesAtPressurePsi,
} from './carbonation';
import { KPA_PER_PSI, fahrenheitToCelsius } from './constants';

describe('keg pressure', () => {
  // Common practice: the regression behind the widely printed force-carbonation tables; printed values (from memory):
  // 32 °F/2.0 vol → 3.5 psi; 40/2.5 → 12.3; 50/2.6 → 18.8; 60/3.0 → 30.2 (psi → kPa × 6.894757).
  it.each([
    [32, 2.0, 3.5],
    [40, 2.5, 12.3],
    [50, 2.6, 18.8],
    [60, 3.0, 30.2],
  ])('at %s °F and %s volumes holds %s psi', (tempF, volumes, psi) => {
    const tempC = fahrenheitToCelsius(tempF);
    expect(Math.abs(kegPressurePsi(volumes, tempC) - psi)).toBeLessThan(0.1);
    expect(Math.abs(kegPressureKPa(volumes, tempC) - psi * KPA_PER_PSI)).toBeLessThan(0.7);
  });

  it('needs no pressure for very low carbonation in cold beer', () => {
    expect(kegPressurePsi(1, -2)).toBe(0);
  });
});

describe('priming', () => {
  // CO2 solubility fit (secondary source); printed about 1.7 vol at 0 °C, 1.2 at 10 °C, 0.88 at 20 °C.
  it.each([
    [0, 1.7],
    [10, 1.2],
    [20, 0.88],
  ])('leaves about the printed CO2 after fermentation at %s °C', (tempC, volumes) => {
    expect(Math.abs(residualCO2Volumes(tempC) - volumes)).toBeLessThan(0.05);
  });

  // Fermentation stoichiometry with IUPAC atomic weights: 2.047 g glucose, 2.251 g dextrose
  // monohydrate, 1.944 g sucrose per g of CO2.
  it('uses sugar-per-CO2 factors from the fermentation equation', () => {
    expect(SUGAR_G_PER_G_CO2.glucose).toBeCloseTo(2.047, 3);
    expect(SUGAR_G_PER_G_CO2.dextrose_monohydrate).toBeCloseTo(2.251, 3);
    expect(SUGAR_G_PER_G_CO2.sucrose).toBeCloseTo(1.944, 3);
  });

  // grams = (V target − V residual) × 1.977 g/L × factor × litres; recomputed: 2.5 vol, 20 °C, 19 L →
  // about 139 g dextrose monohydrate or 120 g sucrose.
  it('computes priming sugar for a 19 L batch', () => {
    expect(Math.abs(primingSugarGrams(2.5, 20, 19, 'dextrose_monohydrate') - 139)).toBeLessThan(1.5);
    expect(Math.abs(primingSugarGrams(2.5, 20, 19, 'sucrose') - 120)).toBeLessThan(1.5);
    expect(primingSugarGrams(1, 0, 19, 'sucrose')).toBe(0);
  });
});

describe('spunding', () => {
  // The regression behind the widely printed force-carbonation tables, solved for volumes (from
  // memory of the printed tables): 15 psi at 85 °F holds about 1.3 volumes, the same 15 psi at 2 °C about 3.0.
  it('reads the volumes held at a valve setting from the carbonation tables', () => {
    expect(Math.abs(volumesAtPressurePsi(15, fahrenheitToCelsius(85)) - 1.3)).toBeLessThan(0.05);
    expect(Math.abs(volumesAtPressurePsi(15, 2) - 3.0)).toBeLessThan(0.05);
    expect(volumesAtPressureKPa(15 * KPA_PER_PSI, 2)).toBeCloseTo(volumesAtPressurePsi(15, 2), 10);
  });

  // Same printed table points as the keg check, read the other way round.
  it.each([
    [40, 12.3, 2.5],
    [50, 18.8, 2.6],
    [60, 30.2, 3.0],
  ])('at %s °F, %s psi holds about %s volumes', (tempF, psi, volumes) => {
    expect(Math.abs(volumesAtPressurePsi(psi, fahrenheitToCelsius(tempF)) - volumes)).toBeLessThan(0.03);
  });

  it('inverts the keg pressure exactly and holds more CO2 at higher pressure or colder beer', () => {
    for (const [v, t] of [
      [2.4, 4],
      [1.6, 20],
      [2.8, 12],
    ]) {
      expect(volumesAtPressurePsi(kegPressurePsi(v, t), t)).toBeCloseTo(v, 8);
    }
    expect(volumesAtPressurePsi(20, 18)).toBeGreaterThan(volumesAtPressurePsi(10, 18));
    expect(volumesAtPressurePsi(10, 5)).toBeGreaterThan(volumesAtPressurePsi(10, 20));
    expect(volumesAtPressurePsi(0, 20)).toBeCloseTo(residualCO2Volumes(20), 10);
  });
});
