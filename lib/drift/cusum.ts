// Tabular (two-sided) CUSUM (Page 1954; NIST/SEMATECH e-Handbook 6.3.2.3):
// S_hi = max(0, S_hi + x − μ − k), S_lo = max(0, S_lo + μ − k − x), both starting at 0.
// A side signals while its sum exceeds h. Sums are not reset after a signal (as in the
// handbook's table, where every group from the first signal on stays flagged).

export interface CusumSums {
  high: number;
  low: number;
}

export function cusumNext(prev: CusumSums, x: number, target: number, k: number): CusumSums {
  return {
    high: Math.max(0, prev.high + x - target - k),
    low: Math.max(0, prev.low + target - k - x),
  };
}

export function cusumSignals(sums: CusumSums, h: number): { high: boolean; low: boolean } {
  return { high: sums.high > h, low: sums.low > h };
}

export function cusumSeries(values: readonly number[], target: number, k: number): CusumSums[] {
  const out: CusumSums[] = [];
  let s: CusumSums = { high: 0, low: 0 };
  for (const x of values) {
    s = cusumNext(s, x, target, k);
    out.push(s);
  }
  return out;
}
