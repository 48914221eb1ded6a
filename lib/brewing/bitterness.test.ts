import { describe, expect, it } from 'vitest';
import {
  DEFAULT_HOP_STAND_TEMP_C,
  MASH_HOP_FRACTION,
  hopIbu,
  hopStandTemperatureFactor,
  ibuFromUtilisation,
  tinsethBignessFactor,
  tinsethTimeFactor,
  tinsethUtilisation,
} from './bitterness';
import { G_PER_OZ, L_PER_US_GALLON } from './constants';
import type { Hop } from './schema';

const hop = (overrides: Partial<Hop>): Hop => ({
  name: 'Test hop',
  amountG: 28,
  alphaPct: 10,
  use: 'boil',
  timeMin: 60,
  form: 'pellet',
  ...overrides,
});

describe('Tinseth utilisation', () => {
  // Glenn Tinseth, hop utilisation table (c. 1995–97), as reproduced in
  // John Palmer, How to Brew (3rd ed., 2006; edition and year from memory), ch. 5, Table 7 (printed to three decimals).
  it.each([
    [1.05, 30, 0.177],
    [1.06, 30, 0.162],
    [1.08, 60, 0.176],
    [1.08, 15, 0.087],
  ])('matches the printed table at gravity %s, %s min', (gravity, minutes, printed) => {
    expect(tinsethUtilisation(gravity, minutes)).toBeCloseTo(printed, 3);
  });

  // More cells of the same table (Glenn Tinseth, "Hop Utilization", 1997; reproduced in John Palmer,
  // How to Brew, 4th ed., 2017, ch. 5). These values are from memory of the printed table; each was
  // checked to agree with Tinseth's published equation at the printed three decimals.
  it.each([
    [1.03, 3, 0.034],
    [1.06, 6, 0.049],
    [1.04, 9, 0.084],
    [1.07, 15, 0.096],
    [1.12, 30, 0.094],
    [1.03, 60, 0.276],
    [1.05, 60, 0.231],
    [1.1, 60, 0.147],
    [1.05, 120, 0.252],
    [1.13, 120, 0.123],
  ])('matches the table at gravity %s, %s min', (gravity, minutes, printed) => {
    expect(tinsethUtilisation(gravity, minutes)).toBeCloseTo(printed, 3);
  });

  // The same table read as ratios (cells above): a column gives the boil-time factor's shape and a
  // row the gravity ("bigness") factor's, each within the table's three-decimal rounding.
  it('splits into a boil-time factor and a gravity factor whose ratios match the table', () => {
    // Column 1.050: 30 min 0.177, 60 min 0.231, 120 min 0.252.
    expect(tinsethTimeFactor(30) / tinsethTimeFactor(60)).toBeCloseTo(0.177 / 0.231, 2);
    expect(tinsethTimeFactor(120) / tinsethTimeFactor(60)).toBeCloseTo(0.252 / 0.231, 2);
    // Row 60 min: 1.030 0.276, 1.050 0.231, 1.100 0.147.
    expect(tinsethBignessFactor(1.03) / tinsethBignessFactor(1.05)).toBeCloseTo(0.276 / 0.231, 2);
    expect(tinsethBignessFactor(1.1) / tinsethBignessFactor(1.05)).toBeCloseTo(0.147 / 0.231, 2);
  });

  // Tinseth's metric form, mg/L of added alpha acid = AA × g × 1000 / L, times the table's U = 0.231
  // (1.050, 60 min), by hand: 0.231 × 0.10 × 28 × 1000 / 20 = 32.3 IBU.
  it('gives 32.3 IBU for 28 g of 10% hops boiled 60 min in 20 L at 1.050', () => {
    expect(hopIbu(hop({ amountG: 28, alphaPct: 10 }), 1.05, 20, 60)).toBeCloseTo(32.3, 1);
  });

  // Tinseth's US form, mg/L = AA × oz × 7490 / gal (the constant from memory), with the table's
  // U = 0.231, by hand: 0.231 × 0.10 × 1 × 7490 / 5 = 34.6 IBU for 1 oz at 10% in 5 gallons.
  it('agrees with the US form for 1 oz in 5 gallons', () => {
    const ibu = ibuFromUtilisation(tinsethUtilisation(1.05, 60), G_PER_OZ, 10, 5 * L_PER_US_GALLON);
    // The table's U is rounded to three decimals (±0.0005 → ±0.08 IBU here).
    expect(Math.abs(ibu - 34.6)).toBeLessThan(0.1);
  });

  // John Palmer, How to Brew (2006), ch. 5 worked example: 9.6 AAU at U 0.176 in 5 gal → 25 IBU;
  // 4.6 AAU at U 0.087 → 6 IBU (Palmer's IBU = AAU × U × 75 / gal).
  it("reproduces Palmer's worked example", () => {
    const gallons = 5 * L_PER_US_GALLON;
    expect(Math.round(ibuFromUtilisation(0.176, G_PER_OZ, 9.6, gallons))).toBe(25);
    expect(Math.round(ibuFromUtilisation(0.087, G_PER_OZ, 4.6, gallons))).toBe(6);
  });
});

describe('bitterness by hop use', () => {
  // Common practice: a 13% hop at 60, 20 and 10 min as 0.5, 0.5 and 0.75 oz
  // gives roughly 23 : 14 : 13 IBU (the shape of Tinseth's curve).
  it('keeps the proportions of a 60/20/10-minute schedule', () => {
    const gallons = 5 * L_PER_US_GALLON;
    const ibuAt = (oz: number, minutes: number) =>
      hopIbu(hop({ amountG: oz * G_PER_OZ, alphaPct: 13, timeMin: minutes }), 1.05, gallons, 60);
    const sixty = ibuAt(0.5, 60);
    expect(Math.abs(ibuAt(0.5, 20) / sixty - 14 / 23)).toBeLessThan(0.05);
    expect(Math.abs(ibuAt(0.75, 10) / sixty - 13 / 23)).toBeLessThan(0.05);
  });

  // Common practice: in plain Tinseth a flame-out addition with no hop stand adds about nothing.
  it('gives a flame-out boil addition no bitterness', () => {
    expect(hopIbu(hop({ timeMin: 0 }), 1.05, 20, 60)).toBe(0);
  });

  // Common practice: dry hops are never boiled, so they add no isomerised alpha acid.
  it('gives dry hops no bitterness', () => {
    expect(hopIbu(hop({ use: 'dry_hop', timeMin: 4320 }), 1.05, 20, 60)).toBe(0);
  });

  // Common practice: first-wort hops are credited like a boil addition of the full boil time.
  it('counts first-wort hops as a boil addition for their time', () => {
    expect(hopIbu(hop({ use: 'first_wort', timeMin: 60 }), 1.05, 20, 60)).toBe(hopIbu(hop({}), 1.05, 20, 60));
  });

  // Common practice: mash hops give a small fraction of a boil addition's bitterness (the fraction is our documented choice).
  it('credits mash hops the documented fraction of a full-boil addition', () => {
    const mash = hopIbu(hop({ use: 'mash', timeMin: 60 }), 1.05, 20, 90);
    expect(mash).toBeCloseTo(MASH_HOP_FRACTION * hopIbu(hop({ timeMin: 90 }), 1.05, 20, 90), 10);
  });

  // Common practice: isomerisation slows steeply below boiling and is negligible below about 75 °C.
  it('scales a hop stand by a temperature factor of 1 at 100 °C falling towards 0 below 75 °C', () => {
    expect(hopStandTemperatureFactor(100)).toBeCloseTo(1, 12);
    expect(hopStandTemperatureFactor(90)).toBeLessThan(0.5);
    expect(hopStandTemperatureFactor(75)).toBeLessThan(0.12);
    expect(hopStandTemperatureFactor(60)).toBeLessThan(0.03);
    for (let tempC = 40; tempC < 100; tempC += 5) {
      expect(hopStandTemperatureFactor(tempC)).toBeLessThan(hopStandTemperatureFactor(tempC + 5));
    }
    const stand = hop({ use: 'whirlpool', timeMin: 20, tempC: 85 });
    expect(hopIbu(stand, 1.05, 20, 60)).toBeCloseTo(
      hopIbu(hop({ timeMin: 20 }), 1.05, 20, 60) * hopStandTemperatureFactor(85),
      10,
    );
    const noTemp = hop({ use: 'whirlpool', timeMin: 20 });
    expect(hopIbu(noTemp, 1.05, 20, 60)).toBeCloseTo(
      hopIbu({ ...noTemp, tempC: DEFAULT_HOP_STAND_TEMP_C }, 1.05, 20, 60),
      12,
    );
  });
});
