import type { Channel } from "./align";
import { boardMetrics } from "./board";
import { firstUpCrossing, peakOf, slopeExtremes, timeAbove } from "./curve";
import type { BoardMetrics, ChannelMetrics } from "./types";
import type { ProcessWindow } from "./windows";

/** Curves ready for metrics: aligned and corrected, t in s (strictly increasing), values in °C. */
export interface MetricSeries {
  time: ArrayLike<number>;
  channels: Channel[];
  setPoint?: { name: string; values: ArrayLike<number> };
}

export interface MetricsResult {
  channels: ChannelMetrics[];
  board: BoardMetrics;
  warnings: string[];
}

const fmt = (x: number) => `${Number(x.toFixed(3))}`;

/** Time at which the probe first reaches 25 °C: its first upward crossing, or its first sample if it starts there. */
export function timeReaching25(t: ArrayLike<number>, v: ArrayLike<number>): number | null {
  if (v[0] >= 25) return t[0];
  return firstUpCrossing(t, v, 25);
}

export function channelMetrics(
  t: ArrayLike<number>,
  channel: Channel,
  window: ProcessWindow,
  warnings: string[],
): ChannelMetrics {
  const v = channel.values;
  const name = channel.name;
  const never = (x: number, label: string, stat: string) =>
    warnings.push(`Probe "${name}" never rises through ${fmt(x)} °C (${label}), so its ${stat} is not available and the run fails.`);
  const { peak, timeAtPeak } = peakOf(t, v);

  let tal: number | null = null;
  if (peak >= window.liquidus) tal = timeAbove(t, v, window.liquidus);
  else warnings.push(`Probe "${name}" never reaches ${fmt(window.liquidus)} °C (liquidus; its peak is ${fmt(peak)} °C), so its time above liquidus is not available and the run fails.`);

  const from = firstUpCrossing(t, v, window.heatUpFrom);
  const to = firstUpCrossing(t, v, window.heatUpTo);
  let heatUpRate: number | null = null;
  if (from === null) never(window.heatUpFrom, "heat-up start", "heat-up rate");
  else if (to === null) never(window.heatUpTo, "heat-up end", "heat-up rate");
  else if (to > from) heatUpRate = (window.heatUpTo - window.heatUpFrom) / (to - from);

  const soakStart = firstUpCrossing(t, v, window.soakStart);
  const soakEnd = firstUpCrossing(t, v, window.soakEnd);
  let soakTime: number | null = null;
  if (soakStart === null) never(window.soakStart, "soak start", "soak time");
  else if (soakEnd === null) never(window.soakEnd, "soak end", "soak time");
  else soakTime = soakEnd - soakStart;

  const t25 = timeReaching25(t, v);
  const timeToPeak = t25 === null ? null : timeAtPeak - t25;
  if (t25 === null) never(25, "start of time to peak", "time to peak");

  const slopes = slopeExtremes(t, v, window.rampWindow);
  if (!slopes) warnings.push(`Probe "${name}": the recording is too short for a ${fmt(window.rampWindow)} s ramp window, so its ramp rates are not available and the run fails.`);

  return {
    name, peak, timeAtPeak, tal, heatUpRate,
    rampUpMax: slopes ? slopes.up : null,
    rampDownMax: slopes ? slopes.down : null,
    soakTime, timeToPeak,
  };
}

/** Probe and board metrics of aligned, corrected curves against a process window. */
export function computeMetrics(series: MetricSeries, window: ProcessWindow): MetricsResult {
  const { time, channels } = series;
  if (channels.length === 0) throw new RangeError("computeMetrics needs at least one channel.");
  if (time.length < 2) throw new RangeError("computeMetrics needs at least two samples.");
  for (let i = 1; i < time.length; i++) {
    if (!(time[i] > time[i - 1])) throw new RangeError(`computeMetrics: time must increase (index ${i}).`);
  }
  for (const c of channels) {
    if (c.values.length !== time.length) throw new RangeError(`computeMetrics: channel "${c.name}" has ${c.values.length} values for ${time.length} times.`);
  }
  const warnings: string[] = [];
  const perChannel = channels.map((c) => channelMetrics(time, c, window, warnings));
  const board = boardMetrics(series, perChannel, window, warnings);
  return { channels: perChannel, board, warnings };
}
