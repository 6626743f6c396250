// Theil–Sen slope (Theil 1950; Sen 1968): the median of all pairwise slopes, pairs with
// equal x left out. Confidence interval by the normal approximation to Kendall's S
// (Sen 1968 eq. 2.6, as in Hollander & Wolfe): C = z·√Var(S), M1 = (N − C)/2,
// M2 = (N + C)/2, interval [slope₍M1₎, slope₍M2+1₎] of the sorted slopes (1-based), with
// Var(S) = [n(n−1)(2n+5) − Σ over tie groups in x and in y of t(t−1)(2t+5)] / 18.
import { normalQuantile } from "./normal-quantile";
import { median, medianSorted } from "./stats";

export type InterceptMethod = "median-residual" | "medians";

export interface TheilSenFit {
  slope: number;
  /** "median-residual": median(y − b·x); "medians": median(y) − b·median(x). */
  intercept: number;
  /** Null when there are too few pairs for the interval's ranks. */
  ci: [number, number] | null;
  confidence: number;
  /** N, the number of pairwise slopes used. */
  pairs: number;
  n: number;
}

function tieTerm(values: readonly number[]): number {
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  let sum = 0;
  for (const t of counts.values()) if (t > 1) sum += t * (t - 1) * (2 * t + 5);
  return sum;
}

/** Null when no two points have different x. */
export function theilSen(
  x: readonly number[],
  y: readonly number[],
  options: { confidence?: number; intercept?: InterceptMethod } = {},
): TheilSenFit | null {
  if (x.length !== y.length) throw new RangeError("theilSen: x and y differ in length");
  const confidence = options.confidence ?? 0.95;
  const n = x.length;
  const slopes: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) if (x[j] !== x[i]) slopes.push((y[j] - y[i]) / (x[j] - x[i]));
  }
  if (slopes.length === 0) return null;
  slopes.sort((a, b) => a - b);
  const slope = medianSorted(slopes);
  const intercept =
    (options.intercept ?? "median-residual") === "medians"
      ? median(y) - slope * median(x)
      : median(y.map((yi, k) => yi - slope * x[k]));

  const N = slopes.length;
  const varS = (n * (n - 1) * (2 * n + 5) - tieTerm(x) - tieTerm(y)) / 18;
  const C = normalQuantile(1 - (1 - confidence) / 2) * Math.sqrt(Math.max(varS, 0));
  // 0-based positions of slope₍M1₎ and slope₍M2+1₎.
  const lowIdx = Math.round((N - C) / 2) - 1;
  const highIdx = Math.round((N + C) / 2);
  const ci: [number, number] | null = lowIdx >= 0 && highIdx <= N - 1 ? [slopes[lowIdx], slopes[highIdx]] : null;
  return { slope, intercept, ci, confidence, pairs: N, n };
}
