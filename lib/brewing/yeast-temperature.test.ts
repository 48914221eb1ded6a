import { describe, expect, it } from 'vitest';
import type { RecipeDocument } from './schema';
import { yeastTemperatureFlags } from './yeast-temperature';

type Doc = Pick<RecipeDocument, 'yeasts' | 'fermentation'>;

// Kveik ferments clean at about 29–35 °C and may stall cool (common practice, as the catalogue holds it).
const kveik = { name: 'Kveik', kind: 'kveik' as const, attenuationPct: 78, tempMinC: 29, tempMaxC: 35 };

function doc(steps: [tempC: number, days: number][], yeasts: Doc['yeasts'] = [kveik]): Doc {
  return { yeasts, fermentation: { steps: steps.map(([tempC, days]) => ({ tempC, days })) } };
}

describe('yeast temperature flags', () => {
  it('flags a step below and a step above the yeast’s range, and none inside it', () => {
    expect(yeastTemperatureFlags(doc([[32, 4]]))).toEqual([]);
    expect(
      yeastTemperatureFlags(
        doc([
          [20, 4],
          [38, 2],
        ]),
      ),
    ).toEqual([
      { stepIndex: 0, tempC: 20, yeastName: 'Kveik', side: 'below', limitC: 29 },
      { stepIndex: 1, tempC: 38, yeastName: 'Kveik', side: 'above', limitC: 35 },
    ]);
  });

  // Common practice: a cold crash at the end clears the beer after fermentation; it is not a ferment.
  it('leaves a cold last step alone, but not a cold only step', () => {
    expect(
      yeastTemperatureFlags(
        doc([
          [32, 4],
          [2, 2],
        ]),
      ),
    ).toEqual([]);
    expect(yeastTemperatureFlags(doc([[2, 4]]))).toHaveLength(1);
  });

  it('checks only the ranges the recipe states', () => {
    expect(yeastTemperatureFlags(doc([[40, 4]], [{ name: 'House ale', kind: 'ale', attenuationPct: 75 }]))).toEqual([]);
    expect(yeastTemperatureFlags(doc([[40, 4]], [{ ...kveik, tempMinC: undefined }]))).toHaveLength(1);
  });
});
