// Incremental drift detection: the app stores a DriftState per oven + metric and takes one
// step per saved run. A new baseline, a changed parameter, or an edited / inserted past run
// invalidates the stored state: rebuild it with computeDriftSeries over the monitored runs.
import { cusumNext } from "./cusum";
import { ewmaExactLimits, ewmaNext } from "./ewma";
import { stepRunRules } from "./run-rules";
import {
  DEFAULT_DRIFT_PARAMS,
  HISTORY_LENGTH,
  sigmaUsable,
  validateParams,
  type DriftBaseline,
  type DriftParams,
  type DriftPoint,
  type DriftPointResult,
  type DriftState,
  type SignalName,
} from "./drift-types";

function baselineCopy(b: DriftBaseline): DriftBaseline {
  if (!Number.isFinite(b.mean) || !Number.isFinite(b.sigma) || b.sigma < 0) {
    throw new RangeError(`baseline needs a finite mean and a finite σ ≥ 0 (got ${b.mean}, ${b.sigma})`);
  }
  const copy: DriftBaseline = { mean: b.mean, sigma: b.sigma };
  if (b.n !== undefined) copy.n = b.n;
  if (b.fromRunId !== undefined) copy.fromRunId = b.fromRunId;
  if (b.toRunId !== undefined) copy.toRunId = b.toRunId;
  return copy;
}

/** The state before the first monitored run: z₀ = baseline mean, CUSUM sums 0. */
export function initDriftState(baseline: DriftBaseline): DriftState {
  return {
    version: 1,
    baseline: baselineCopy(baseline),
    ewma: { z: baseline.mean, i: 0 },
    cusum: { high: 0, low: 0 },
    recent: [],
    sideRun: { side: 0, length: 0 },
    trendRun: { direction: 0, steps: 0 },
    history: [],
    lastAt: null,
  };
}

export function checkPoint(point: DriftPoint, lastAt: number | null): void {
  if (!Number.isFinite(point.value)) throw new RangeError(`run ${point.runId}: value must be a finite number`);
  if (!Number.isFinite(point.at)) throw new RangeError(`run ${point.runId}: time must be epoch milliseconds`);
  if (lastAt !== null && point.at < lastAt) {
    // An older run arriving late changes history: the caller must recompute.
    throw new RangeError(`run ${point.runId} is older than the last monitored run; recompute the series`);
  }
}

/** EWMA/CUSUM signals for a step; silent when σ = 0 (no usable limits). */
export function detectorSignals(
  z: number,
  limits: { ucl: number; lcl: number },
  sums: { high: number; low: number },
  sigma: number,
  params: DriftParams,
): SignalName[] {
  if (!sigmaUsable(sigma)) return [];
  const out: SignalName[] = [];
  if (z > limits.ucl || z < limits.lcl) out.push("ewma");
  const h = params.cusumH * sigma;
  if (sums.high > h || sums.low > h) out.push("cusum");
  return out;
}

/** Take one run into the stored state. Returns a new state; the input is not modified. */
export function stepDrift(
  state: DriftState,
  point: DriftPoint,
  params: DriftParams = DEFAULT_DRIFT_PARAMS,
): { state: DriftState; pointResult: DriftPointResult } {
  validateParams(params);
  checkPoint(point, state.lastAt);
  const { mean, sigma } = state.baseline;
  const x = point.value;

  const i = state.ewma.i + 1;
  const z = ewmaNext(state.ewma.z, x, params.lambda);
  const limits = ewmaExactLimits(mean, sigma, params.lambda, params.L, i);
  const sums = cusumNext(state.cusum, x, mean, params.cusumK * sigma);
  const rules = stepRunRules(state, x, state.baseline);
  const signals = [...rules.signals, ...detectorSignals(z, limits, sums, sigma, params)];

  const history = [...state.history, { runId: point.runId, at: point.at, value: x }].slice(-HISTORY_LENGTH);
  const next: DriftState = {
    version: 1,
    baseline: state.baseline,
    ewma: { z, i },
    cusum: sums,
    recent: rules.tail.recent,
    sideRun: rules.tail.sideRun,
    trendRun: rules.tail.trendRun,
    history,
    lastAt: point.at,
  };
  return {
    state: next,
    pointResult: {
      runId: point.runId,
      at: point.at,
      value: x,
      i,
      ewma: z,
      ewmaUcl: limits.ucl,
      ewmaLcl: limits.lcl,
      cusumHigh: sums.high,
      cusumLow: sums.low,
      signals,
    },
  };
}
