// Throughput of the brewing engine: full computeStats calls per second on one core.
import { computeStats, planWaterSalts, recipeDocumentSchema, type RecipeDocument } from '../lib/brewing';
import type { BenchRow } from './types';

const RUNS = 7;
const CALLS_PER_RUN = 50_000;

/**
 * An invented 12-ingredient recipe (5 fermentables, 6 hops, 1 yeast) with water and a target profile
 * (so the salt plan and predicted mash pH are in every call), spunding, carbonation and a style.
 */
function benchRecipe(): RecipeDocument {
  return recipeDocumentSchema.parse({
    title: 'Benchmark amber',
    batch: { volumeL: 23, boilTimeMin: 60, efficiencyPct: 74 },
    fermentables: [
      { name: 'Pale ale malt', amountKg: 4.5, potentialPpg: 38, colorLovibond: 3, kind: 'grain' },
      { name: 'Munich malt', amountKg: 0.8, potentialPpg: 35, colorLovibond: 10, kind: 'grain' },
      { name: 'Crystal malt 60 °L', amountKg: 0.35, potentialPpg: 34, colorLovibond: 60, kind: 'grain' },
      { name: 'Flaked oats', amountKg: 0.3, potentialPpg: 32, colorLovibond: 1, kind: 'adjunct' },
      { name: 'Table sugar', amountKg: 0.2, potentialPpg: 46, colorLovibond: 0, kind: 'sugar' },
    ],
    hops: [
      { name: 'Magnum', amountG: 18, alphaPct: 13, use: 'first_wort', timeMin: 60, form: 'pellet' },
      { name: 'Northern Brewer', amountG: 10, alphaPct: 8.5, use: 'mash', timeMin: 60, form: 'pellet' },
      { name: 'Cascade', amountG: 20, alphaPct: 6, use: 'boil', timeMin: 15, form: 'pellet' },
      { name: 'Centennial', amountG: 20, alphaPct: 10, use: 'boil', timeMin: 5, form: 'leaf' },
      { name: 'Chinook', amountG: 30, alphaPct: 13, use: 'whirlpool', timeMin: 20, form: 'pellet', tempC: 85 },
      { name: 'Cascade', amountG: 60, alphaPct: 6, use: 'dry_hop', timeMin: 5760, form: 'pellet' },
    ],
    yeasts: [{ name: 'Clean ale yeast', kind: 'ale', attenuationPct: 76 }],
    mash: {
      steps: [
        { tempC: 67, timeMin: 60 },
        { tempC: 76, timeMin: 10 },
      ],
    },
    fermentation: { steps: [{ tempC: 19, days: 12 }], spunding: { pressureKPa: 100, tempC: 19 } },
    water: {
      volumeL: 35,
      source: { calcium: 30, magnesium: 5, sodium: 12, chloride: 20, sulfate: 25, bicarbonate: 90 },
      salts: [
        { salt: 'gypsum', grams: 5 },
        { salt: 'calcium_chloride', grams: 4 },
      ],
      target: { calcium: 110, magnesium: 10, sodium: 20, chloride: 90, sulfate: 200, bicarbonate: 60 },
    },
    carbonation: { volumesCO2: 2.4, servingTempC: 4 },
    style: { code: '19A', name: 'American Amber Ale' },
  });
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** Calls per second of one timed run; the checksum keeps the work from being optimised away. */
function timeRun(doc: RecipeDocument): { callsPerSecond: number; checksum: number } {
  let checksum = 0;
  const started = performance.now();
  for (let i = 0; i < CALLS_PER_RUN; i++) checksum += computeStats(doc).ibu;
  const elapsedMs = performance.now() - started;
  return { callsPerSecond: (CALLS_PER_RUN / elapsedMs) * 1000, checksum };
}

/** Milliseconds per salt plan solved from scratch: each call has a new target, so nothing is reused. */
function timeSaltPlans(doc: RecipeDocument, plans: number): number {
  const water = doc.water!;
  const started = performance.now();
  for (let i = 0; i < plans; i++) {
    planWaterSalts(water.source, { ...water.target!, calcium: 100 + (i % 1000) * 0.01 }, water.volumeL);
  }
  return (performance.now() - started) / plans;
}

export async function benchEngine(): Promise<BenchRow[]> {
  const doc = benchRecipe();
  timeRun(doc);
  const rates: number[] = [];
  let checksum = 0;
  for (let run = 0; run < RUNS; run++) {
    const result = timeRun(doc);
    rates.push(result.callsPerSecond);
    checksum += result.checksum;
  }
  return [
    {
      area: 'brewing',
      metric: 'computeStats calls per second (12-ingredient recipe, one core)',
      value: Math.round(median(rates)),
      unit: 'calls/s',
      target: { op: '>', value: 50000 },
      note: `median of ${RUNS} runs of ${CALLS_PER_RUN} calls after a warm-up run (checksum ${checksum.toFixed(0)})`,
    },
    {
      area: 'brewing',
      metric: 'salt plan solved from scratch (five salts, six ions)',
      value: Number(median(Array.from({ length: RUNS }, () => timeSaltPlans(doc, 2000))).toFixed(4)),
      unit: 'ms',
      target: { op: '<', value: 5 },
      note: `median of ${RUNS} runs of 2000 plans, each for a different target`,
    },
  ];
}
