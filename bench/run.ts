// npm run bench — every benchmark, written to bench/RESULTS.md as a table against its target.
// `npm run bench -- pages search` runs only those; the rows of the others stay as last measured.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import type { BenchRow } from './types';

type Bench = { name: string; load: () => Promise<() => Promise<BenchRow[]>> };

const benches: Bench[] = [
  { name: 'engine', load: async () => (await import('./engine')).benchEngine },
  { name: 'compare', load: async () => (await import('./compare')).benchCompare },
  { name: 'search', load: async () => (await import('./search')).benchSearch },
  { name: 'uploads', load: async () => (await import('./uploads')).benchUploads },
  { name: 'recipes', load: async () => (await import('./recipes')).benchRecipes },
  { name: 'pages', load: async () => (await import('./pages')).benchPages },
  { name: 'load', load: async () => (await import('./load')).benchLoad },
];

const RESULTS = new URL('./RESULTS.md', import.meta.url);
const HEADER = ['| bench | area | measure | value | target | | measured |', '|---|---|---|---|---|---|---|'];

/** A note fit for one table cell: no line breaks or pipes, and not a whole stack trace. */
const oneLine = (text: string) => text.replace(/\s+/g, ' ').replace(/\|/g, '/').slice(0, 400);

function verdict(row: BenchRow): string {
  if (!row.target) return '';
  const ok = row.target.op === '<' ? row.value < row.target.value : row.value > row.target.value;
  return ok ? 'met' : '**missed**';
}

/** Rows kept from the last RESULTS.md, by bench; a table from before the bench column counts as the engine's. */
function earlierRows(): { bench: string; line: string }[] {
  if (!existsSync(RESULTS)) return [];
  const text = readFileSync(RESULTS, 'utf8');
  const withBench = text.includes(HEADER[0]);
  const when = text.match(/^Measured (\d{4}-\d{2}-\d{2}) on (\d+) cores/m);
  return text
    .split('\n')
    .filter((l) => l.startsWith('| ') && !l.startsWith('| bench |') && !l.startsWith('| area |'))
    .map((line) => {
      if (withBench) return { bench: line.split('|')[1].trim(), line };
      const area = line.split('|')[1].trim();
      const bench = area === 'brewing' ? 'engine' : area;
      return { bench, line: `| ${bench} ${line}${when ? ` ${when[1]}, ${when[2]} cores |` : ' |'}` };
    });
}

const only = process.argv.slice(2);
const unknown = only.filter((name) => !benches.some((b) => b.name === name));
if (unknown.length) {
  console.error(`no such bench: ${unknown.join(', ')} (there are ${benches.map((b) => b.name).join(', ')})`);
  process.exit(2);
}
const measured = `${new Date().toISOString().slice(0, 10)}, ${os.cpus().length} cores`;
const ran: { bench: string; line: string }[] = [];
for (const bench of benches) {
  if (only.length && !only.includes(bench.name)) continue;
  const started = Date.now();
  console.log(`bench: ${bench.name}…`);
  let rows: BenchRow[];
  try {
    rows = await (await bench.load())();
  } catch (err) {
    console.error(`bench ${bench.name} failed:`, err);
    rows = [{ area: bench.name, metric: 'failed to run', value: Number.NaN, unit: '', note: (err as Error).message }];
  }
  for (const r of rows) {
    ran.push({
      bench: bench.name,
      line: `| ${bench.name} | ${r.area} | ${r.metric}${r.note ? ` (${oneLine(r.note)})` : ''} | ${r.value} ${r.unit} | ${r.target ? `${r.target.op} ${r.target.value} ${r.unit}` : ''} | ${verdict(r)} | ${measured} |`,
    });
  }
  console.log(`bench: ${bench.name} done in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

const fresh = new Set(ran.map((r) => r.bench));
const order = (name: string) => benches.findIndex((b) => b.name === name);
const kept = earlierRows().filter((r) => !fresh.has(r.bench));
const all = [...kept, ...ran].sort((a, b) => order(a.bench) - order(b.bench));
const lines = [
  '# Benchmark results',
  '',
  `Measured ${measured} (${os.cpus()[0]?.model ?? 'unknown CPU'}), ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.version}: ${[...fresh].join(', ') || 'nothing'}; each row says when it was measured. Medians and percentiles as each row says.`,
  '',
  ...HEADER,
  ...all.map((r) => r.line),
  '',
];
writeFileSync(RESULTS, lines.join('\n'));
console.log(lines.join('\n'));
process.exit(0);
