// Test helpers: invented series on a unit baseline (centre 0, σ 1) so each value reads in σ.
import { computeDriftSeries } from "@/lib/drift/drift-series";
import { initDriftState, stepDrift } from "@/lib/drift/drift-state";
import type { DriftBaseline, DriftParams, DriftPointResult, SignalName } from "@/lib/drift/drift-types";
import { DEFAULT_DRIFT_PARAMS } from "@/lib/drift/drift-types";

export const DAY = 86_400_000;
export const T0 = Date.UTC(2025, 0, 6, 7, 0, 0);

export function toPoints(values: readonly number[], stepMs = DAY) {
  return values.map((value, k) => ({ value, at: T0 + k * stepMs, runId: `r${k + 1}` }));
}

/** Both paths, so every rule test also checks the incremental form against the batch form. */
export function bothPaths(values: readonly number[], baseline: DriftBaseline = { mean: 0, sigma: 1 }, params: DriftParams = DEFAULT_DRIFT_PARAMS) {
  const batch = computeDriftSeries(baseline, toPoints(values), params).points;
  let state = initDriftState(baseline);
  const stepped: DriftPointResult[] = [];
  for (const p of toPoints(values)) {
    const r = stepDrift(state, p, params);
    state = r.state;
    stepped.push(r.pointResult);
  }
  return { batch, stepped };
}

/** 0-based indices at which `signal` fired, checked to agree between batch and incremental. */
export function firedAt(values: readonly number[], signal: SignalName, baseline?: DriftBaseline, params?: DriftParams): number[] {
  const { batch, stepped } = bothPaths(values, baseline, params);
  const idx = (rs: DriftPointResult[]) => rs.flatMap((r, k) => (r.signals.includes(signal) ? [k] : []));
  const a = idx(batch);
  const b = idx(stepped);
  if (JSON.stringify(a) !== JSON.stringify(b)) throw new Error(`batch ${a} and incremental ${b} disagree for ${signal}`);
  return a;
}
