import { describe, expect, it } from 'vitest';
import { fitTargetFor } from './fit-target';

const settings = { batchVolumeL: 23, efficiencyPct: 70 };

describe('the brewhouse a recipe is fitted to', () => {
  // Common practice: one brew day's efficiency is noise; an average of two or more is worth using.
  it('uses measured efficiency from two brew days or more, else the member’s setting', () => {
    expect(fitTargetFor(settings, { meanPct: 64.27, count: 2 })).toEqual({
      target: { volumeL: 23, efficiencyPct: 64.3 },
      efficiencyFrom: 'measured',
      measuredBrews: 2,
    });
    expect(fitTargetFor(settings, { meanPct: 64, count: 1 }).target.efficiencyPct).toBe(70);
    expect(fitTargetFor(settings, null).efficiencyFrom).toBe('settings');
  });

  it('refuses a measured mean the recipe schema would refuse', () => {
    expect(fitTargetFor(settings, { meanPct: 104, count: 5 }).target.efficiencyPct).toBe(70);
  });

  it('carries the losses set, and leaves the rest to the recipe', () => {
    const { target } = fitTargetFor({ ...settings, boilOffLPerHour: 3.5, trubLossL: null, mashWaterLPerKg: 2.7 }, null);
    expect(target).toEqual({ volumeL: 23, efficiencyPct: 70, boilOffLPerHour: 3.5, mashWaterLPerKg: 2.7 });
  });
});
