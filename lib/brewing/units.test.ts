import { describe, expect, it } from 'vitest';
import { G_PER_OZ, KG_PER_LB, KPA_PER_PSI, L_PER_US_GALLON } from './constants';
import {
  celsiusToF,
  convertUnit,
  fahrenheitToC,
  fromDisplayUnits,
  gToOz,
  gallonsToLitres,
  kPaToPsi,
  kgToLb,
  lbToKg,
  litresPerKgToQuartsPerLb,
  litresToGallons,
  mgPerLToPpm,
  ozToG,
  psiToKPa,
  quartsPerLbToLitresPerKg,
  toDisplayUnits,
} from './units';

// Unit definitions: international yard and pound agreement (1959), US liquid gallon of 231 in³;
// the interface converts through the convert-units package, rounded there to about 6 significant figures.
describe('unit conversions for the interface', () => {
  it('agrees with the exact definitions', () => {
    expect(lbToKg(1)).toBeCloseTo(KG_PER_LB, 5);
    expect(kgToLb(KG_PER_LB)).toBeCloseTo(1, 5);
    expect(ozToG(1)).toBeCloseTo(G_PER_OZ, 3);
    expect(gToOz(G_PER_OZ)).toBeCloseTo(1, 5);
    expect(gallonsToLitres(1)).toBeCloseTo(L_PER_US_GALLON, 4);
    expect(litresToGallons(L_PER_US_GALLON)).toBeCloseTo(1, 5);
    expect(psiToKPa(1)).toBeCloseTo(KPA_PER_PSI, 3);
    expect(kPaToPsi(KPA_PER_PSI)).toBeCloseTo(1, 4);
  });

  it('converts temperatures', () => {
    expect(celsiusToF(100)).toBeCloseTo(212, 10);
    expect(fahrenheitToC(152)).toBeCloseTo(66.667, 3);
  });

  // Common practice: for dilute water, 1 mg/L is taken as 1 ppm.
  it('takes mg/L as ppm', () => {
    expect(mgPerLToPpm(150)).toBe(150);
  });

  // Common practice: a mash of 1.25 qt/lb is about 2.6 L/kg.
  it('converts mash thickness', () => {
    expect(quartsPerLbToLitresPerKg(1.25)).toBeCloseTo(2.608, 2);
    expect(litresPerKgToQuartsPerLb(quartsPerLbToLitresPerKg(1.5))).toBeCloseTo(1.5, 10);
  });

  it('converts to and from a member’s unit system', () => {
    expect(toDisplayUnits(20, 'volume', 'us')).toBeCloseTo(5.2834, 3);
    expect(fromDisplayUnits(5.2834, 'volume', 'us')).toBeCloseTo(20, 2);
    expect(toDisplayUnits(66, 'temperature', 'metric')).toBe(66);
    expect(toDisplayUnits(28.35, 'hopMass', 'us')).toBeCloseTo(1, 3);
  });

  it('refuses to mix kinds of unit', () => {
    expect(() => convertUnit(1, 'kg', 'l')).toThrow();
  });
});
