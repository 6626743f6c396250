// Shared types and defaults for drift detection on one oven + metric.

export const SIGNAL_NAMES = ["beyond3Sigma", "twoOfThree", "sixTrending", "nineOneSide", "ewma", "cusum"] as const;
export type SignalName = (typeof SIGNAL_NAMES)[number];

export type RunId = string | number;

/** Settings of the detectors. CUSUM k and h are in units of the baseline σ. */
export interface DriftParams {
  lambda: number;
  L: number;
  cusumK: number;
  cusumH: number;
}

export const DEFAULT_DRIFT_PARAMS: Readonly<DriftParams> = { lambda: 0.2, L: 3, cusumK: 0.5, cusumH: 5 };

/** What the detectors need from a baseline; `BaselineStats` satisfies it. */
export interface DriftBaseline {
  mean: number;
  sigma: number;
  n?: number;
  fromRunId?: RunId | null;
  toRunId?: RunId | null;
}

export interface DriftPoint {
  value: number;
  /** Epoch milliseconds (UTC). */
  at: number;
  runId: RunId;
}

export interface DriftPointResult {
  runId: RunId;
  at: number;
  value: number;
  /** 1 for the first run after the baseline. */
  i: number;
  ewma: number;
  ewmaUcl: number;
  ewmaLcl: number;
  cusumHigh: number;
  cusumLow: number;
  signals: SignalName[];
}

export interface DriftHistoryEntry {
  runId: RunId;
  at: number;
  value: number;
}

/** Everything needed to take the next step; JSON-safe (finite numbers, strings, arrays). */
export interface DriftState {
  version: 1;
  baseline: DriftBaseline;
  ewma: { z: number; i: number };
  cusum: { high: number; low: number };
  /** Last ≤ 9 monitored values, oldest first (the run rules look back at most nine). */
  recent: number[];
  /** Current run of points strictly on one side of the centre (side 0: last point on it). */
  sideRun: { side: -1 | 0 | 1; length: number };
  /** Current run of strict steps in one direction (0: last step flat or no step yet). */
  trendRun: { direction: -1 | 0 | 1; steps: number };
  /** Last ≤ 20 runs with times, for the Theil–Sen trend. */
  history: DriftHistoryEntry[];
  lastAt: number | null;
}

export const RECENT_LENGTH = 9;
export const HISTORY_LENGTH = 20;

export function validateParams(params: DriftParams): void {
  if (!(params.lambda > 0 && params.lambda <= 1)) throw new RangeError(`EWMA λ must be in (0, 1], got ${params.lambda}`);
  if (!(params.L > 0)) throw new RangeError(`EWMA L must be > 0, got ${params.L}`);
  if (!(params.cusumK >= 0)) throw new RangeError(`CUSUM k must be ≥ 0, got ${params.cusumK}`);
  if (!(params.cusumH > 0)) throw new RangeError(`CUSUM h must be > 0, got ${params.cusumH}`);
}

/** σ = 0 (a perfectly flat baseline) gives no usable σ-based limits; those rules stay silent. */
export function sigmaUsable(sigma: number): boolean {
  return Number.isFinite(sigma) && sigma > 0;
}
