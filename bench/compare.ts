// Compare with attribution as the server runs it for the compare page and the API: two
// 20-ingredient versions diffed item by item, every moved number traced to the changes behind it.
import { availableParallelism, loadavg } from 'node:os';
import { recipeDocumentSchema, type RecipeDocument } from '../lib/brewing';
import { compareDocuments } from '../lib/recipes/compare';
import { twentyIngredientDocument } from './generate';
import { quantile, round } from './stats';
import type { BenchRow } from './types';

const COMPARES = 600;
const WARM_UP = 100;

/** A fork's usual few edits: a yeast swap, a hotter mash, a hop moved later and more of one malt. */
function edited(doc: RecipeDocument): RecipeDocument {
  const next = structuredClone(doc);
  next.yeasts[0] = { name: 'Kveik', kind: 'kveik', attenuationPct: 80, tempMinC: 25, tempMaxC: 37 };
  next.mash.steps[0].tempC += 2;
  next.hops[3].timeMin = 5;
  next.fermentables[1].amountKg += 0.3;
  return recipeDocumentSchema.parse(next);
}

/** Milliseconds per comparison of each pair, after a warm-up; the checksum keeps the work from being dropped. */
function time(pairs: [RecipeDocument, RecipeDocument][]): { ms: number[]; cpuMs: number[]; checksum: number } {
  let checksum = 0;
  for (let i = 0; i < WARM_UP; i++) {
    const [a, b] = pairs[i % pairs.length];
    checksum += compareDocuments(a, b, { units: 'metric' }).attribution.length;
  }
  const ms: number[] = [];
  const cpuMs: number[] = [];
  for (let i = 0; i < COMPARES; i++) {
    const [a, b] = pairs[i % pairs.length];
    const cpu = process.cpuUsage();
    const started = performance.now();
    checksum += compareDocuments(a, b, { units: i % 2 ? 'us' : 'metric' }).attribution.length;
    ms.push(performance.now() - started);
    const used = process.cpuUsage(cpu);
    cpuMs.push((used.user + used.system) / 1000);
  }
  return { ms, cpuMs, checksum };
}

export async function benchCompare(): Promise<BenchRow[]> {
  const docs = Array.from({ length: 40 }, (_, i) => recipeDocumentSchema.parse(twentyIngredientDocument(i)));
  const fork = time(docs.map((d) => [d, edited(d)]));
  // Two unrelated recipes: every amount differs, the worst case for attribution.
  const apart = time(docs.map((d, i) => [d, docs[(i + 7) % docs.length]]));
  const load = loadavg()[0].toFixed(1);
  return [
    {
      area: 'compare',
      metric: 'compare with attribution, a 20-ingredient version and its fork (four edits) p95',
      value: round(quantile(fork.ms, 0.95), 2),
      unit: 'ms',
      target: { op: '<', value: 15 },
      note: `wall clock; ${COMPARES} compares after ${WARM_UP} unmeasured, in process as the server runs it, metric and US in turn; p50 ${round(quantile(fork.ms, 0.5), 2)} ms; load average ${load} on ${availableParallelism()} cores (checksum ${fork.checksum})`,
    },
    {
      area: 'compare',
      metric: 'compare with attribution, a version and its fork: CPU time per compare p95',
      value: round(quantile(fork.cpuMs, 0.95), 2),
      unit: 'ms',
      note: `the process's own CPU time, which waiting for a busy machine's cores does not add to; p50 ${round(quantile(fork.cpuMs, 0.5), 2)} ms`,
    },
    {
      area: 'compare',
      metric: 'compare with attribution, two unrelated 20-ingredient versions p95',
      value: round(quantile(apart.ms, 0.95), 2),
      unit: 'ms',
      target: { op: '<', value: 15 },
      note: `wall clock; every amount differs; p50 ${round(quantile(apart.ms, 0.5), 2)} ms (checksum ${apart.checksum})`,
    },
    {
      area: 'compare',
      metric: 'compare with attribution, two unrelated versions: CPU time per compare p95',
      value: round(quantile(apart.cpuMs, 0.95), 2),
      unit: 'ms',
      note: `p50 ${round(quantile(apart.cpuMs, 0.5), 2)} ms`,
    },
  ];
}
