import { describe, expect, it } from 'vitest';
import { KG_PER_LB, L_PER_US_GALLON, POINTS_L_PER_KG_PER_PPG } from './constants';
import { gristGravityPoints, originalGravity } from './extract';

describe('extract from the grist', () => {
  // 1 ppg = 8.3454 points·L/kg (US gallon and pound definitions).
  it('uses 8.3454 points·L/kg per ppg', () => {
    expect(POINTS_L_PER_KG_PER_PPG).toBeCloseTo(8.3454, 4);
  });

  // John Palmer, How to Brew (3rd ed., 2006; edition and year from memory), ch. 12 method (points = Σ lb × ppg × efficiency / gal);
  // recomputed: 10 lb at 37 plus 1 lb at 34 in 5.5 gal at 75% → 1.0551.
  it('reproduces a worked grist', () => {
    const grist = [
      { amountKg: 10 * KG_PER_LB, potentialPpg: 37, kind: 'grain' as const },
      { amountKg: 1 * KG_PER_LB, potentialPpg: 34, kind: 'grain' as const },
    ];
    expect(originalGravity(grist, 5.5 * L_PER_US_GALLON, 75)).toBeCloseTo(1.0551, 4);
  });

  // Common practice: extracts and sugars dissolve whole, so they count at 100% whatever the mash efficiency.
  it('counts extracts and sugars at 100% and mashed grain and adjuncts at brewhouse efficiency', () => {
    const oneLbEach = (kind: 'grain' | 'adjunct' | 'extract' | 'sugar') => [
      { amountKg: KG_PER_LB, potentialPpg: 40, kind },
    ];
    const gallon = L_PER_US_GALLON;
    expect(gristGravityPoints(oneLbEach('sugar'), gallon, 50)).toBeCloseTo(40, 10);
    expect(gristGravityPoints(oneLbEach('extract'), gallon, 50)).toBeCloseTo(40, 10);
    expect(gristGravityPoints(oneLbEach('grain'), gallon, 50)).toBeCloseTo(20, 10);
    expect(gristGravityPoints(oneLbEach('adjunct'), gallon, 50)).toBeCloseTo(20, 10);
  });
});
