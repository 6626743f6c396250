// Baseline selection for one oven + metric.
//
// Default rule: the first `size` (10) runs of the current configuration, i.e. at or after
// the latest change. When that segment has fewer than `size` runs but at least `minSize` (2),
// those runs are used and the baseline is marked provisional (it grows, and the stored drift
// state must be rebuilt, as each new run arrives until it is complete). When the segment has
// fewer than `minSize` runs, we step back to the segment before that change (and further if
// needed) and use its first `size` runs — the baseline the oven was monitored against until
// the change — also marked provisional. With no change logged, the segment is the whole
// history, so the result is the first ten runs ever. An explicit run range overrides all this.
// Runs with a non-finite value (metric not computable) are ignored.
import { individualsStats } from "./individuals-chart";
import type { DriftBaseline, RunId } from "./drift-types";

export interface BaselineRun {
  runId: RunId;
  at: number;
  value: number;
}

export interface ChangeMarker {
  at: number;
}

export interface BaselineOptions {
  size?: number;
  minSize?: number;
  /** Engineer-picked range, inclusive, by run id (order of the two ids does not matter). */
  range?: { fromRunId: RunId; toRunId: RunId };
}

export type BaselineSource = "range" | "first-runs" | "after-latest-change" | "earlier-segment";

export interface BaselineStats extends DriftBaseline {
  mean: number;
  /** MR̄ / 1.128; 0 when all baseline values are equal (σ-based rules then stay silent). */
  sigma: number;
  mrBar: number;
  n: number;
  fromRunId: RunId;
  toRunId: RunId;
  fromAt: number;
  toAt: number;
  source: BaselineSource;
  /** Fewer runs than asked for, or borrowed from an earlier configuration. */
  provisional: boolean;
  /** Time of the change that opens the baseline's segment; null for the first segment or a range. */
  segmentStart: number | null;
}

/** Mean, σ = MR̄/1.128 and ids of a run list (oldest first); needs two or more runs. */
export function baselineStats(
  runs: readonly BaselineRun[],
  meta: Pick<BaselineStats, "source" | "provisional" | "segmentStart">,
): BaselineStats {
  const s = individualsStats(runs.map((r) => r.value));
  const first = runs[0];
  const last = runs[runs.length - 1];
  return {
    mean: s.mean,
    sigma: s.sigma,
    mrBar: s.mrBar,
    n: s.n,
    fromRunId: first.runId,
    toRunId: last.runId,
    fromAt: first.at,
    toAt: last.at,
    ...meta,
  };
}

/** `runs` must be sorted by time, oldest first. Returns null when fewer than `minSize` usable runs exist. */
export function selectBaseline(
  runs: readonly BaselineRun[],
  changes: readonly ChangeMarker[],
  options: BaselineOptions = {},
): BaselineStats | null {
  const size = options.size ?? 10;
  const minSize = Math.max(2, options.minSize ?? 2);
  const usable = runs.filter((r) => Number.isFinite(r.value));
  for (let k = 1; k < usable.length; k++) {
    if (usable[k].at < usable[k - 1].at) throw new RangeError("selectBaseline: runs must be sorted by time");
  }

  if (options.range) {
    const a = usable.findIndex((r) => r.runId === options.range!.fromRunId);
    const b = usable.findIndex((r) => r.runId === options.range!.toRunId);
    if (a < 0 || b < 0) throw new RangeError("selectBaseline: range names a run that is not in the list");
    const picked = usable.slice(Math.min(a, b), Math.max(a, b) + 1);
    if (picked.length < 2) return null;
    return baselineStats(picked, { source: "range", provisional: false, segmentStart: null });
  }

  const starts = [...changes.map((c) => c.at)].sort((x, y) => x - y);
  // Segment j (j = 0 … starts.length) holds runs in [starts[j − 1], starts[j]).
  for (let j = starts.length; j >= 0; j--) {
    const from = j === 0 ? -Infinity : starts[j - 1];
    const to = j === starts.length ? Infinity : starts[j];
    const segment = usable.filter((r) => r.at >= from && r.at < to);
    if (segment.length < minSize) continue;
    const picked = segment.slice(0, size);
    const latest = j === starts.length;
    const source: BaselineSource = !latest ? "earlier-segment" : starts.length === 0 ? "first-runs" : "after-latest-change";
    return baselineStats(picked, {
      source,
      provisional: !latest || picked.length < size,
      segmentStart: j === 0 ? null : from,
    });
  }
  return null;
}

/** The runs monitored against a baseline: every usable run after its last run, in order. */
export function runsAfterBaseline<T extends BaselineRun>(runs: readonly T[], baseline: Pick<BaselineStats, "toRunId">): T[] {
  const usable = runs.filter((r) => Number.isFinite(r.value));
  const idx = usable.findIndex((r) => r.runId === baseline.toRunId);
  return idx < 0 ? [] : usable.slice(idx + 1);
}
