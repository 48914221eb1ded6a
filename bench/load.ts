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
  const { speed } = result;
  const each = (name: 'static asset' | '/about' | 'busiest head page' | 'busiest version 1 page') =>
    `${speed.targets[name].rps} req/s, p97.5 ${speed.targets[name].p975} ms`;
  const setup = `20 signed-out clients with gzip, ${speed.seconds} s each, one after another; the busiest demo recipe is ${speed.busiest.slug} with ${speed.busiest.activity} brew days, comments and proposals`;
  rows.push(
    {
      area: 'pages',
      metric: `busiest recipe's version 1 page against a built script file, throughput ratio (${each('busiest version 1 page')} against ${each('static asset')}; ${setup})`,
      value: speed.versionToStatic,
      unit: '×',
      target: { op: '>', value: 0.5 },
    },
    {
      area: 'pages',
      metric: `busiest recipe's head page against /about, throughput ratio (${each('busiest head page')} against ${each('/about')})`,
      value: speed.headToAbout,
      unit: '×',
      target: { op: '>', value: 0.8 },
    },
    {
      area: 'pages',
      metric: 'non-2xx answers while measuring the ratios',
      value: Object.values(speed.targets).reduce((n, t) => n + t.non2xx, 0),
      unit: 'count',
      target: { op: '<', value: 1 },
    },
  );
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
