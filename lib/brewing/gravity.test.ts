import { describe, expect, it } from 'vitest';
import { fahrenheitToCelsius } from './constants';
import { brixToGravity, correctHydrometerReading, fermentingGravityFromBrix, platoToSg, sgToPlato } from './gravity';

describe('gravity and Plato', () => {
  // ASBC polynomial as printed in Greg Noonan, New Brewing Lager Beer (1996);
  // recomputed: 1.040 → 9.99, 1.050 → 12.39, 1.080 → 19.33 °P.
  it.each([
    [1.04, 9.99],
    [1.05, 12.39],
    [1.08, 19.33],
  ])('converts SG %s to %s °P', (sg, plato) => {
    expect(sgToPlato(sg)).toBeCloseTo(plato, 2);
  });

  // Cross-check: Buhl, "Physical Equations Relating Extract and Relative Density" (2023 preprint),
  // °P = 260.4 − 260.4 / SG, within 0.02 °P of the ASBC tables.
  // The two part by up to 0.05 °P up to 1.080 (checked here) and more beyond.
  it('agrees with Buhl across the usual wort range', () => {
    for (let sg = 1.0; sg <= 1.08; sg += 0.005) {
      expect(Math.abs(sgToPlato(sg) - (260.4 - 260.4 / sg))).toBeLessThan(0.05);
    }
  });

  // The common inverse, SG = 1 + P / (258.6 − (P / 258.2) × 227.1); recomputed: 10 °P → 1.0400, 20 °P → 1.0830.
  it('converts Plato back to SG', () => {
    expect(platoToSg(10)).toBeCloseTo(1.04, 4);
    expect(platoToSg(20)).toBeCloseTo(1.083, 4);
    for (let plato = 2; plato <= 25; plato += 1) {
      expect(Math.abs(platoToSg(sgToPlato(platoToSg(plato))) - platoToSg(plato))).toBeLessThan(0.0006);
    }
  });
});

describe('hydrometer temperature correction', () => {
  // Dave Burch, Brewing Quality Beers (1986): a 1.050 reading on a 60 °F hydrometer
  // reads +1.0 point at 68 °F, +2.2 at 77 °F, +3.5 at 86 °F, +5.0 at 95 °F.
  it.each([
    [68, 1.0],
    [77, 2.2],
    [86, 3.5],
    [95, 5.0],
  ])('adds about the printed points at %s °F', (tempF, points) => {
    const corrected = correctHydrometerReading(1.05, fahrenheitToCelsius(tempF), fahrenheitToCelsius(60));
    expect(Math.abs((corrected - 1.05) * 1000 - points)).toBeLessThan(0.25);
  });

  // Common practice: a hydrometer reads true at the temperature it was calibrated at.
  it('changes nothing at the calibration temperature', () => {
    expect(correctHydrometerReading(1.05, 20, 20)).toBeCloseTo(1.05, 12);
  });
});

describe('refractometer', () => {
  // Brix / 1.04 (wort correction factor, common practice), then the inverse Plato formula; recomputed: 12.5 °Bx → 1.0485.
  it('converts Brix of unfermented wort to gravity', () => {
    expect(brixToGravity(12.5)).toBeCloseTo(1.0485, 4);
    expect(brixToGravity(12.5, 1)).toBeCloseTo(platoToSg(12.5), 12);
  });

  // Sean Terrill, "Refractometer FG Results" (2011), cubic fit: printed 23 → 12 °Bx gives 1.0204.
  it('corrects a reading taken after fermentation started (Terrill)', () => {
    expect(fermentingGravityFromBrix(23, 12)).toBeCloseTo(1.0204, 4);
  });
});
