import type { WaterProfile } from './schema';

/**
 * Named starting points for a water target and for the water a brewer starts
 * from. The target values are single points picked inside the ranges the
 * sources give for pale beers; they are our own picks, quoted from memory of
 * those sources, not copied from a printed table. Each is a profile salts can
 * make from distilled water (its charges balance), so a plan can reach it.
 */

export interface WaterTargetPreset {
  id: 'soft-round' | 'balanced' | 'crisp-bitter';
  name: string;
  /** What the water does to the beer, in a brewer's words. */
  reading: string;
  profile: WaterProfile;
  source: string;
}

const PALE_BEER_RANGES =
  'Ranges for pale beers in Palmer & Kaminski, "Water: A Comprehensive Guide for Brewers" (2013), ch. 7, and Palmer, "How to Brew" (4th ed., 2017), ch. 21; our own single values inside them, from memory.';

export const WATER_TARGET_PRESETS: readonly WaterTargetPreset[] = [
  {
    id: 'soft-round',
    name: 'Soft and round',
    reading: 'Chloride ahead of sulfate: fuller malt, softer bitterness.',
    profile: { calcium: 51, magnesium: 5, sodium: 15, chloride: 100, sulfate: 37, bicarbonate: 0 },
    source: PALE_BEER_RANGES,
  },
  {
    id: 'balanced',
    name: 'Balanced',
    reading: 'Sulfate and chloride about even: neither malt nor hops pushed forward.',
    profile: { calcium: 55, magnesium: 5, sodium: 15, chloride: 76, sulfate: 78, bicarbonate: 0 },
    source: PALE_BEER_RANGES,
  },
  {
    id: 'crisp-bitter',
    name: 'Crisp and bitter',
    reading: 'Sulfate well ahead of chloride: a drier, sharper hop finish.',
    profile: { calcium: 86, magnesium: 8, sodium: 10, chloride: 45, sulfate: 200, bicarbonate: 0 },
    source: PALE_BEER_RANGES,
  },
];

export interface SourceWaterPreset {
  id: 'distilled' | 'soft-spring';
  name: string;
  profile: WaterProfile;
  note: string;
}

export const SOURCE_WATER_PRESETS: readonly SourceWaterPreset[] = [
  {
    id: 'distilled',
    name: 'Distilled or reverse-osmosis water',
    profile: { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 },
    note: 'No ions to speak of: the salts make the whole profile.',
  },
  {
    id: 'soft-spring',
    name: 'Soft spring water',
    profile: { calcium: 6, magnesium: 2, sodium: 4, chloride: 5, sulfate: 4, bicarbonate: 18 },
    note: 'A few mg/L of each ion: a typical low-mineral spring water, not a particular one. Use your own report when you have it.',
  },
];

/** The preset a profile matches exactly, for showing which one a saved recipe uses. */
export function matchingPreset<T extends { profile: WaterProfile }>(
  presets: readonly T[],
  profile: WaterProfile | undefined,
): T | undefined {
  if (!profile) return undefined;
  return presets.find((preset) =>
    (Object.keys(preset.profile) as (keyof WaterProfile)[]).every((ion) => preset.profile[ion] === profile[ion]),
  );
}
