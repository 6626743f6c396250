import type { Channel } from "./align";
import type { BoardMetrics, ChannelMetrics, TrackingError } from "./types";

type Pick = (m: ChannelMetrics) => number | null;

/** min/max over channels; null if any channel's value is null. */
function aggregate(metrics: ChannelMetrics[], pick: Pick, how: "min" | "max"): number | null {
  let out = how === "min" ? Infinity : -Infinity;
  for (const m of metrics) {
    const v = pick(m);
    if (v === null) return null;
    out = how === "min" ? Math.min(out, v) : Math.max(out, v);
  }
  return out;
}

/**
 * Largest max − min across channels at any sample time t with t_start ≤ t ≤ t_end, where
 * t_start is the earliest channel's first upward crossing of soakEnd (`soakEndCrossings`) and
 * t_end the latest channel's time at peak. Null when a channel never crosses soakEnd or no
 * sample lies between.
 */
export function criticalSpread(
  time: ArrayLike<number>,
  channels: Channel[],
  metrics: ChannelMetrics[],
  soakEndCrossings: Array<number | null>,
): number | null {
  let start = Infinity;
  for (const crossing of soakEndCrossings) {
    if (crossing === null) return null;
    start = Math.min(start, crossing);
  }
  let end = -Infinity;
  for (const m of metrics) end = Math.max(end, m.timeAtPeak);
  const m = channels.length;
  const columns = channels.map((c) => c.values);
  let spread = -Infinity;
  for (let k = 0; k < time.length; k++) {
    const t = time[k];
    if (t < start) continue;
    if (t > end) break;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i < m; i++) {
      const v = columns[i][k];
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    if (hi - lo > spread) spread = hi - lo;
  }
  return spread === -Infinity ? null : spread;
}

/** Mean and largest |board mean − set point| over all samples. */
export function trackingError(channels: Channel[], setPoint: ArrayLike<number>): TrackingError {
  const n = setPoint.length;
  const m = channels.length;
  let sum = 0;
  let max = 0;
  for (let k = 0; k < n; k++) {
    let mean = 0;
    for (let i = 0; i < m; i++) mean += channels[i].values[k];
    const e = Math.abs(mean / m - setPoint[k]);
    sum += e;
    if (e > max) max = e;
  }
  return { mean: n > 0 ? sum / n : 0, max };
}

/** Board statistics from the probes' metrics; `soakEndCrossings[i]` is probe i's first crossing of soakEnd. */
export function boardMetrics(
  series: { time: ArrayLike<number>; channels: Channel[]; setPoint?: { values: ArrayLike<number> } },
  metrics: ChannelMetrics[],
  soakEndCrossings: Array<number | null>,
  warnings: string[],
): BoardMetrics {
  let peakMin = Infinity;
  let peakMax = -Infinity;
  for (const m of metrics) {
    peakMin = Math.min(peakMin, m.peak);
    peakMax = Math.max(peakMax, m.peak);
  }
  const spread = criticalSpread(series.time, series.channels, metrics, soakEndCrossings);
  if (spread === null) warnings.push("The critical-phase spread is not available: not every probe reaches the soak end temperature.");
  const board: BoardMetrics = {
    peakMin,
    peakMax,
    deltaTPeak: peakMax - peakMin,
    criticalSpread: spread,
    heatUpRate: aggregate(metrics, (m) => m.heatUpRate, "min"),
    rampUpMax: aggregate(metrics, (m) => m.rampUpMax, "max"),
    rampDownMax: aggregate(metrics, (m) => m.rampDownMax, "max"),
    soakTimeMin: aggregate(metrics, (m) => m.soakTime, "min"),
    soakTimeMax: aggregate(metrics, (m) => m.soakTime, "max"),
    talMin: aggregate(metrics, (m) => m.tal, "min"),
    talMax: aggregate(metrics, (m) => m.tal, "max"),
    timeToPeakMax: aggregate(metrics, (m) => m.timeToPeak, "max"),
  };
  if (series.setPoint) board.trackingError = trackingError(series.channels, series.setPoint.values);
  return board;
}
