/** One line of the benchmark report. `pass` compares `value` with `target` in the stated direction. */
export interface BenchRow {
  area: string;
  metric: string;
  value: number;
  unit: string;
  target?: { op: '<' | '>'; value: number };
  note?: string;
}
