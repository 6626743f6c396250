// Shewhart control-chart constants for subgroup size n (REFERENCES §4d; standard tables).
// d2: E[range]/σ; d3: sd[range]/σ; D3/D4: range-chart limit factors (D3 = 0 for n ≤ 6).

export interface ChartConstants {
  d2: number;
  d3: number | null;
  D3: number | null;
  D4: number | null;
}

/** d₂ for n = 2, the divisor turning an average moving range into σ. */
export const D2 = 1.128;

/** D₄ for n = 2: the moving-range chart's UCL is D4_MOVING_RANGE · MR̄. */
export const D4_MOVING_RANGE = 3.267;

export const CONTROL_CHART_CONSTANTS: Readonly<Record<number, ChartConstants>> = {
  2: { d2: 1.128, d3: 0.853, D3: 0, D4: 3.267 },
  3: { d2: 1.693, d3: 0.888, D3: 0, D4: 2.574 },
  4: { d2: 2.059, d3: 0.88, D3: 0, D4: 2.282 },
  5: { d2: 2.326, d3: 0.864, D3: 0, D4: 2.114 },
  6: { d2: 2.534, d3: 0.848, D3: 0, D4: 2.004 },
  7: { d2: 2.704, d3: null, D3: null, D4: null },
  8: { d2: 2.847, d3: null, D3: null, D4: null },
  9: { d2: 2.97, d3: null, D3: null, D4: null },
  10: { d2: 3.078, d3: null, D3: null, D4: null },
};

export const DAY_MS = 86_400_000;
