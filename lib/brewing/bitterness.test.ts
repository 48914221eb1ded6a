import { describe, expect, it } from 'vitest';
import {
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

  // Aaron Justus, "Tracking IBU Through the Brewing Process: The Quest for Consistency", MBAA
  // Technical Quarterly 55 (3), 2018, pp. 67–74: measured at brewery scale, mash hops averaged 9.1%
  // utilisation against 44.0% for 60-minute additions, a ratio of 0.21 (the rule of thumb "about a
  // fifth", common practice). By hand for 28 g of 10% hops in 20 L at 1.050 and a 60-minute boil:
  // a boil addition gives U(1.050, 60) 0.2307 × 140 mg/L = 32.3 IBU, so a mash addition about 6.5.
  it('credits mash hops about a fifth of a full-boil addition', () => {
    const boil = hopIbu(hop({}), 1.05, 20, 60);
    const mash = hopIbu(hop({ use: 'mash', timeMin: 60 }), 1.05, 20, 60);
    expect(mash / boil).toBeCloseTo(9.1 / 44.0, 1);
    expect(mash).toBeCloseTo(6.46, 1);
    // The hops then go through the whole boil: a 90-minute boil, U(1.050, 90) 0.2468 × 140 × 0.2 = 6.9 IBU.
    expect(hopIbu(hop({ use: 'mash', timeMin: 60 }), 1.05, 20, 90)).toBeCloseTo(6.91, 1);
  });

  // Mark Malowicki and Thomas Shellhammer, "Isomerization and Degradation Kinetics of Hop (Humulus
  // lupulus) Acids in a Model Wort-Boiling System", J. Agric. Food Chem. 53, 2005, pp. 4434–4439:
  // isomerisation goes at k1 = 7.9 × 10^11 e^(−11858/T) per minute (T in K; activation energy
  // 98.6 kJ/mol), measured from 90 to 130 °C. A stand's factor is k1 at its temperature over k1 at
  // 100 °C; by hand e^(−11858 (1/363.15 − 1/373.15)) = 0.417 at 90 °C, 0.165 at 80 °C and 0.102 at
  // 75 °C (the last two extrapolate below the measured range). The rate constants are cited from
  // memory of the paper, not checked against a copy here.
  it('scales a hop stand by the isomerisation rate at its temperature against a 100 °C boil', () => {
    expect(hopStandTemperatureFactor(100)).toBeCloseTo(1, 12);
    expect(hopStandTemperatureFactor(90)).toBeCloseTo(0.417, 3);
    expect(hopStandTemperatureFactor(80)).toBeCloseTo(0.165, 3);
    expect(hopStandTemperatureFactor(75)).toBeCloseTo(0.102, 3);
    // The same from the paper's activation energy: 98,600 J/mol over R = 8.314 J/(mol·K).
    for (const tempC of [95, 85, 70]) {
      const fromEnergy = Math.exp((-98600 / 8.314) * (1 / (tempC + 273.15) - 1 / 373.15));
      expect(hopStandTemperatureFactor(tempC)).toBeCloseTo(fromEnergy, 3);
    }
    // Wort in an open kettle does not get hotter than its boil (common practice): no factor above 1.
    expect(hopStandTemperatureFactor(104)).toBe(1);
    // By hand: 28 g of 10% hops in 20 L at 1.050 would give U(1.050, 20) 0.1397 × 140 = 19.56 IBU in
    // a 20-minute boil; standing 20 minutes at 85 °C gives that × 0.264 = 5.17 IBU.
    expect(hopIbu(hop({ use: 'whirlpool', timeMin: 20, tempC: 85 }), 1.05, 20, 60)).toBeCloseTo(5.17, 1);
    // A stand with no temperature is taken at 80 °C (our documented choice; common practice for a
    // whirlpool rest): 19.56 × 0.165 = 3.23 IBU.
    expect(hopIbu(hop({ use: 'whirlpool', timeMin: 20 }), 1.05, 20, 60)).toBeCloseTo(3.23, 1);
  });
});
