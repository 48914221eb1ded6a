import { describe, expect, it } from 'vitest';
import {
  brixToGravity,
  computeStats,
  correctHydrometerReading,
  fermentingGravityFromBrix,
  sgToPlato,
} from '@/lib/brewing';
import { examplePaleAle } from '@/lib/brewing/test-fixtures';
import { compareWithPrediction, gravityFromEntry, originalBrix } from './measure';

const ok = (r: ReturnType<typeof gravityFromEntry>) => {
  if ('error' in r) throw new Error(r.error);
  return r.gravity;
};

describe('gravities from what the brewer typed', () => {
  it('corrects a hydrometer reading for its sample temperature (Burch, Brewing Quality Beers, 1986)', () => {
    expect(
      ok(gravityFromEntry({ method: 'hydrometer', value: 1.05, sampleTempC: 15.56 }, { afterOg: false, ogBrix: null })),
    ).toBeCloseTo(1.05, 4);
    expect(
      ok(gravityFromEntry({ method: 'hydrometer', value: 1.05, sampleTempC: 38 }, { afterOg: false, ogBrix: null })),
    ).toBeCloseTo(correctHydrometerReading(1.05, 38), 9);
    expect(ok(gravityFromEntry({ method: 'hydrometer', value: 1.05 }, { afterOg: false, ogBrix: null }))).toBe(1.05);
  });

  it('reads unfermented wort from °Brix, and fermenting beer with the Terrill correction (Terrill, Refractometer FG Results, 2011)', () => {
    expect(ok(gravityFromEntry({ method: 'refractometer', value: 12 }, { afterOg: false, ogBrix: null }))).toBeCloseTo(
      brixToGravity(12),
      9,
    );
    expect(ok(gravityFromEntry({ method: 'refractometer', value: 6 }, { afterOg: true, ogBrix: 12 }))).toBeCloseTo(
      fermentingGravityFromBrix(12, 6),
      9,
    );
    // Without the correction a fermenting sample reads far too high (alcohol raises the refractive index).
    expect(fermentingGravityFromBrix(12, 6)).toBeLessThan(brixToGravity(6));
  });

  it('needs an OG for a refractometer reading of fermenting beer, and refuses corrected values out of range', () => {
    expect(gravityFromEntry({ method: 'refractometer', value: 6 }, { afterOg: true, ogBrix: null })).toHaveProperty(
      'error',
    );
    expect(
      gravityFromEntry({ method: 'hydrometer', value: 1.199, sampleTempC: 95 }, { afterOg: false, ogBrix: null }),
    ).toHaveProperty('error');
  });

  it('takes the original Brix from a hydrometer OG as the refractometer would read it (Brix ≈ °P × the wort correction factor, common practice)', () => {
    expect(originalBrix({ method: 'refractometer', value: 13.1 }, 1.05)).toBe(13.1);
    expect(originalBrix({ method: 'hydrometer', value: 1.05 }, 1.05)).toBeCloseTo(sgToPlato(1.05) * 1.04, 9);
    expect(originalBrix(null, null)).toBeNull();
  });
});

describe('measured against predicted', () => {
  it('gives each difference as measured less predicted, and flags keg pressure above a typical rating (common practice)', () => {
    const doc = examplePaleAle();
    const stats = computeStats(doc);
    const none = {
      preBoilGravity: null,
      preBoilVolumeL: null,
      postBoilVolumeL: null,
      fermenterVolumeL: null,
      strikeTempC: null,
      mashTempC: null,
      mashPh: null,
      pitchTempC: null,
    };
    const outcome = compareWithPrediction(
      { ...none, og: stats.og - 0.004, fg: stats.fg + 0.002, kegPressureKPa: 250 },
      doc,
      stats,
    );
    const og = outcome.comparisons.find((c) => c.key === 'og')!;
    expect(og.difference).toBeCloseTo(-0.004, 9);
    expect(outcome.comparisons.find((c) => c.key === 'fg')!.difference).toBeCloseTo(0.002, 9);
    // Less sugar in the same volume: lower efficiency than planned.
    expect(outcome.efficiencyPct!).toBeLessThan(doc.batch.efficiencyPct);
    expect(outcome.kegPressureAboveTypicalRating).toBe(true);
    expect(
      compareWithPrediction({ ...none, og: null, fg: null, kegPressureKPa: 120 }, doc, stats)
        .kegPressureAboveTypicalRating,
    ).toBe(false);
  });

  // A measured mash pH lies beside the engine's prediction (Troester 2009 model, see lib/brewing/mash-ph.ts).
  it('lays the measured mash pH beside the predicted one, and leaves it unpredicted for stats saved before', () => {
    const doc = examplePaleAle();
    const stats = computeStats(doc);
    const day = {
      preBoilGravity: null,
      preBoilVolumeL: null,
      postBoilVolumeL: null,
      fermenterVolumeL: null,
      strikeTempC: null,
      mashTempC: null,
      mashPh: 5.3,
      pitchTempC: null,
      og: null,
      fg: null,
      kegPressureKPa: null,
    };
    const row = compareWithPrediction(day, doc, stats).comparisons.find((c) => c.key === 'mashPh')!;
    expect(row.predicted).toBe(stats.mash.predictedPh);
    expect(row.difference).toBeCloseTo(5.3 - stats.mash.predictedPh!, 9);
    const { mash: _dropped, ...older } = stats;
    const oldRow = compareWithPrediction(day, doc, older as typeof stats).comparisons.find((c) => c.key === 'mashPh')!;
    expect(oldRow.predicted).toBeNull();
  });
});
