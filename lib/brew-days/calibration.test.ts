import { describe, expect, it } from 'vitest';
import { calibrate, RECENCY_DECAY, weightedFigure, type CalibrationBrew } from './calibration';

function brew(brewedOn: string, measured: Partial<CalibrationBrew> = {}): CalibrationBrew {
  return {
    brewDayId: brewedOn,
    brewedOn,
    recipeTitle: 'Millrace Pale',
    yeastKind: 'ale',
    predictedOg: 1.05,
    measuredOg: 1.05,
    predictedFg: 1.011,
    measuredFg: null,
    predictedEfficiencyPct: 72,
    measuredEfficiencyPct: null,
    measuredAttenuationPct: null,
    ...measured,
  };
}

describe('recency-weighted brewhouse figures', () => {
  it('offers nothing from fewer than two brews', () => {
    expect(weightedFigure([])).toBeNull();
    expect(weightedFigure([70])).toBeNull();
    const one = calibrate([brew('2026-05-01', { measuredEfficiencyPct: 70, measuredAttenuationPct: 76 })]);
    expect(one.calibration.efficiency).toBeNull();
    expect(one.calibration.attenuationByYeastKind).toEqual([]);
  });

  it('weighs the newest brew 1, the one before 0.8, then 0.64', () => {
    // Weighted mean Σw·x / Σw with w = 0.8^rank: (80·1 + 70·0.8 + 60·0.64) / 2.44.
    const figure = weightedFigure([80, 70, 60])!;
    expect(RECENCY_DECAY).toBe(0.8);
    expect(figure.weightedMeanPct).toBeCloseTo((80 + 56 + 38.4) / 2.44, 10);
    expect(figure.weightedMeanPct).toBeGreaterThan(70); // the plain mean: newer brews pull it up
    // Weighted variance Σw·(x − m)² / Σw.
    const m = figure.weightedMeanPct;
    const variance = ((80 - m) ** 2 + 0.8 * (70 - m) ** 2 + 0.64 * (60 - m) ** 2) / 2.44;
    expect(figure.spreadPct).toBeCloseTo(Math.sqrt(variance), 10);
    expect(figure).toMatchObject({ count: 3, minPct: 60, maxPct: 80 });
  });

  it('orders brews by date whatever order they come in, and keeps the plain means beside', () => {
    const result = calibrate([
      brew('2026-01-10', { measuredEfficiencyPct: 60 }),
      brew('2026-03-10', { measuredEfficiencyPct: 80 }),
      brew('2026-02-10', { measuredEfficiencyPct: 70 }),
    ]);
    expect(result.calibration.efficiency!.weightedMeanPct).toBeCloseTo(weightedFigure([80, 70, 60])!.weightedMeanPct);
    expect(result.efficiency).toEqual({ meanPct: 70, count: 3 });
    expect(result.brewDayCount).toBe(3);
    expect(result.history.map((b) => b.brewedOn)).toEqual(['2026-01-10', '2026-02-10', '2026-03-10']);
  });

  it('gives attenuation per yeast kind only where that kind has two brews', () => {
    const result = calibrate([
      brew('2026-01-01', { yeastKind: 'ale', measuredAttenuationPct: 75 }),
      brew('2026-02-01', { yeastKind: 'ale', measuredAttenuationPct: 80 }),
      brew('2026-03-01', { yeastKind: 'kveik', measuredAttenuationPct: 82 }),
    ]);
    expect(result.calibration.attenuationByYeastKind).toHaveLength(1);
    const ale = result.calibration.attenuationByYeastKind[0];
    expect(ale.yeastKind).toBe('ale');
    expect(ale.weightedMeanPct).toBeCloseTo((80 + 0.8 * 75) / 1.8, 10);
    // The plain means still list every kind, as the earlier answer did.
    expect(result.attenuationByYeastKind.map((a) => a.yeastKind).sort()).toEqual(['ale', 'kveik']);
  });

  it('leaves brews without a measured OG out of the chart history', () => {
    const result = calibrate([brew('2026-01-01'), brew('2026-02-01', { measuredOg: null })]);
    expect(result.history).toHaveLength(1);
  });
});
