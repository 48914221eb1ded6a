/** The q-th quantile (0–1) of a list of numbers, by nearest rank. */
export function quantile(values: number[], q: number): number {
  if (!values.length) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
}

export function median(values: number[]): number {
  return quantile(values, 0.5);
}

export const round = (value: number, digits = 1): number => Math.round(value * 10 ** digits) / 10 ** digits;
