// npm run bench — every benchmark, written to bench/RESULTS.md as a table against its target.
import { writeFileSync } from 'node:fs';
import os from 'node:os';
import type { BenchRow } from './types';

type Bench = { name: string; load: () => Promise<() => Promise<BenchRow[]>> };

const benches: Bench[] = [
  { name: 'engine', load: async () => (await import('./engine')).benchEngine },
  { name: 'compare', load: async () => (await import('./compare')).benchCompare },
  { name: 'search', load: async () => (await import('./search')).benchSearch },
  { name: 'uploads', load: async () => (await import('./uploads')).benchUploads },
  { name: 'recipes', load: async () => (await import('./recipes')).benchRecipes },
  { name: 'load', load: async () => (await import('./load')).benchLoad },
];

function verdict(row: BenchRow): string {
  if (!row.target) return '';
  const ok = row.target.op === '<' ? row.value < row.target.value : row.value > row.target.value;
  return ok ? 'met' : '**missed**';
}

const only = process.argv.slice(2);
const rows: BenchRow[] = [];
for (const bench of benches) {
  if (only.length && !only.includes(bench.name)) continue;
  const started = Date.now();
  console.log(`bench: ${bench.name}…`);
  try {
    rows.push(...(await (await bench.load())()));
  } catch (err) {
    console.error(`bench ${bench.name} failed:`, err);
    rows.push({ area: bench.name, metric: 'failed to run', value: Number.NaN, unit: '', note: (err as Error).message });
  }
  console.log(`bench: ${bench.name} done in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

const lines = [
  '# Benchmark results',
  '',
  `Measured ${new Date().toISOString().slice(0, 10)} on ${os.cpus().length} cores (${os.cpus()[0]?.model ?? 'unknown CPU'}), ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.version}. Medians and percentiles as each row says.`,
  '',
  '| area | measure | value | target | |',
  '|---|---|---|---|---|',
  ...rows.map(
    (r) =>
      `| ${r.area} | ${r.metric}${r.note ? ` (${r.note})` : ''} | ${r.value} ${r.unit} | ${r.target ? `${r.target.op} ${r.target.value} ${r.unit}` : ''} | ${verdict(r)} |`,
  ),
  '',
];
writeFileSync(new URL('./RESULTS.md', import.meta.url), lines.join('\n'));
console.log(lines.join('\n'));
process.exit(0);
