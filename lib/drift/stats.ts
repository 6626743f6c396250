// Small descriptive helpers shared by the drift modules.

export function mean(values: readonly number[]): number {
  if (values.length === 0) return NaN;
  let sum = 0;
  for (const v of values) sum += v;
  return sum / values.length;
}

/** Sample standard deviation (n − 1 denominator). NaN for fewer than two values. */
export function sampleSd(values: readonly number[]): number {
  if (values.length < 2) return NaN;
  const m = mean(values);
  let ss = 0;
  for (const v of values) ss += (v - m) * (v - m);
  return Math.sqrt(ss / (values.length - 1));
}

/** Median of an already sorted array. */
export function medianSorted(sorted: readonly number[]): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const mid = n >> 1;
  return n % 2 === 1 ? sorted[mid] : 0.5 * (sorted[mid - 1] + sorted[mid]);
}

export function median(values: readonly number[]): number {
  return medianSorted([...values].sort((a, b) => a - b));
}
