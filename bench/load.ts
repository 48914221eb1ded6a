// The mixed-traffic run (tests/load/mixed.ts) as benchmark rows: p95 and 5xx per route against
// their targets, plus the totals; the full report still goes to bench/LOAD.md.
import { writeFileSync } from 'node:fs';
import { runMixedLoad } from '../tests/load/mixed';
import type { BenchRow } from './types';

export async function benchLoad(): Promise<BenchRow[]> {
  const result = await runMixedLoad({ log: (line) => console.log(line) });
  writeFileSync(new URL('./LOAD.md', import.meta.url), result.markdown);
  const label = `${result.clients.total} clients for ${result.seconds} s, ${result.dataset.recipes.toLocaleString('en-GB')} recipes; see LOAD.md`;
  const rows: BenchRow[] = [
    {
      area: 'load',
      metric: `mixed traffic, all routes: requests per second (${label})`,
      value: result.total.perSecond,
      unit: 'req/s',
    },
    {
      area: 'load',
      metric: 'mixed traffic, 5xx answers',
      value: result.total.serverErrors,
      unit: 'count',
      target: { op: '<', value: 1 },
    },
    {
      area: 'load',
      metric: 'mixed traffic, saves that answered 2xx and are missing from the database',
      value: result.saves.answered2xx - result.saves.found,
      unit: 'count',
      target: { op: '<', value: 1 },
    },
  ];
  for (const row of result.rows) {
    rows.push({
      area: 'load',
      metric: `${row.route} p95 (p50 ${row.p50} ms, p99 ${row.p99} ms, ${row.count} requests)`,
      value: row.p95,
      unit: 'ms',
      ...(row.targetP95Ms === null ? {} : { target: { op: '<' as const, value: row.targetP95Ms } }),
    });
  }
  return rows;
}
