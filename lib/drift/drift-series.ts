// Batch drift computation over all monitored runs (those after the baseline, oldest first).
// It is written independently of stepDrift — whole-array passes and look-back run rules —
// so that the property "folding stepDrift equals the batch" checks one against the other.
import { cusumSeries } from "./cusum";
import { detectorSignals, checkPoint, initDriftState } from "./drift-state";
import { ewmaExactLimits, ewmaSeries } from "./ewma";
import { runRuleSignalsAt, runRuleTailAt } from "./run-rules";
import {
  DEFAULT_DRIFT_PARAMS,
  HISTORY_LENGTH,
  validateParams,
  type DriftBaseline,
  type DriftParams,
  type DriftPoint,
  type DriftPointResult,
  type DriftState,
} from "./drift-types";

export function computeDriftSeries(
  baseline: DriftBaseline,
  points: readonly DriftPoint[],
  params: DriftParams = DEFAULT_DRIFT_PARAMS,
): { state: DriftState; points: DriftPointResult[] } {
  validateParams(params);
  const start = initDriftState(baseline);
  const { mean, sigma } = start.baseline;
  points.forEach((p, idx) => checkPoint(p, idx === 0 ? null : points[idx - 1].at));

  const values = points.map((p) => p.value);
  const zs = ewmaSeries(values, mean, params.lambda);
  const sums = cusumSeries(values, mean, params.cusumK * sigma);

  const results: DriftPointResult[] = points.map((p, idx) => {
    const i = idx + 1;
    const limits = ewmaExactLimits(mean, sigma, params.lambda, params.L, i);
    return {
      runId: p.runId,
      at: p.at,
      value: p.value,
      i,
      ewma: zs[idx],
      ewmaUcl: limits.ucl,
      ewmaLcl: limits.lcl,
      cusumHigh: sums[idx].high,
      cusumLow: sums[idx].low,
      signals: [
        ...runRuleSignalsAt(values, idx, start.baseline),
        ...detectorSignals(zs[idx], limits, sums[idx], sigma, params),
      ],
    };
  });

  const n = points.length;
  if (n === 0) return { state: start, points: results };
  const tail = runRuleTailAt(values, start.baseline);
  const state: DriftState = {
    version: 1,
    baseline: start.baseline,
    ewma: { z: zs[n - 1], i: n },
    cusum: { high: sums[n - 1].high, low: sums[n - 1].low },
    recent: tail.recent,
    sideRun: tail.sideRun,
    trendRun: tail.trendRun,
    history: points.slice(-HISTORY_LENGTH).map((p) => ({ runId: p.runId, at: p.at, value: p.value })),
    lastAt: points[n - 1].at,
  };
  return { state, points: results };
}
