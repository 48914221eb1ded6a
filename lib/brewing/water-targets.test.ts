import { describe, expect, it } from 'vitest';
import { ION_NAMES } from './constants';
import { residualAlkalinity, sulfateToChlorideRatio, SULFATE_CHLORIDE_READING, planWaterSalts } from './water';
import { SOURCE_WATER_PRESETS, WATER_TARGET_PRESETS, matchingPreset } from './water-targets';

const byId = (id: string) => WATER_TARGET_PRESETS.find((preset) => preset.id === id)!.profile;

describe('water target starting points', () => {
  // Palmer & Kaminski, "Water: A Comprehensive Guide for Brewers" (2013), ch. 7; Palmer, "How to Brew"
  // (4th ed., 2017), ch. 21 (from memory): pale beers want at least about 50 mg/L calcium, magnesium
  // under about 30 mg/L, sodium under about 100 mg/L and little or no alkalinity.
  it('stays inside the ranges the sources give for pale beers', () => {
    for (const preset of WATER_TARGET_PRESETS) {
      expect(preset.profile.calcium).toBeGreaterThanOrEqual(50);
      expect(preset.profile.magnesium).toBeLessThanOrEqual(30);
      expect(preset.profile.sodium).toBeLessThanOrEqual(100);
      expect(residualAlkalinity(preset.profile)).toBeLessThan(0);
      expect(preset.source).toMatch(/Palmer & Kaminski/);
    }
  });

  // The reading of the sulfate-to-chloride ratio (common practice): soft below about 0.8, bitter above about 2.
  it('reads as its name says by the sulfate-to-chloride ratio', () => {
    expect(sulfateToChlorideRatio(byId('soft-round'))).toBeLessThan(SULFATE_CHLORIDE_READING.maltyBelow);
    const balanced = sulfateToChlorideRatio(byId('balanced'));
    expect(balanced).toBeGreaterThanOrEqual(SULFATE_CHLORIDE_READING.maltyBelow);
    expect(balanced).toBeLessThanOrEqual(SULFATE_CHLORIDE_READING.bitterAbove);
    expect(sulfateToChlorideRatio(byId('crisp-bitter'))).toBeGreaterThan(SULFATE_CHLORIDE_READING.bitterAbove);
  });

  // Salts only add ions (common practice): every target sits above the soft spring water in every ion
  // but bicarbonate, so salts reach each one except that bicarbonate stays as the source has it.
  it('can be reached from the soft spring water except its bicarbonate', () => {
    const spring = SOURCE_WATER_PRESETS.find((preset) => preset.id === 'soft-spring')!.profile;
    for (const ion of ION_NAMES) if (ion !== 'bicarbonate') expect(spring[ion]).toBeLessThan(10);
    for (const preset of WATER_TARGET_PRESETS) {
      const plan = planWaterSalts(spring, preset.profile, 30);
      expect(plan.misses.filter((miss) => miss.ion !== 'bicarbonate')).toEqual([]);
    }
  });

  it('names the preset a profile matches', () => {
    expect(matchingPreset(WATER_TARGET_PRESETS, { ...byId('balanced') })?.name).toBe('Balanced');
    expect(matchingPreset(WATER_TARGET_PRESETS, { ...byId('balanced'), sodium: 16 })).toBeUndefined();
    expect(matchingPreset(WATER_TARGET_PRESETS, undefined)).toBeUndefined();
  });
});
