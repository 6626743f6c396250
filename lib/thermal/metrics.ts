import type { Channel } from "./align";
import { boardMetrics } from "./board";
import { scanCurve, slopeExtremes } from "./curve";
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

/** A probe's metrics plus its first crossing of soakEnd (where the board's critical phase may start). */
export interface ChannelFacts {
  metrics: ChannelMetrics;
  soakEndCrossing: number | null;
}

export function channelFacts(t: ArrayLike<number>, channel: Channel, window: ProcessWindow, warnings: string[]): ChannelFacts {
  const v = channel.values;
  const name = channel.name;
  const never = (x: number, label: string, stat: string) =>
    warnings.push(`Probe "${name}" never rises through ${fmt(x)} °C (${label}), so its ${stat} is not available and the run fails.`);
  const scan = scanCurve(t, v, [25, window.heatUpFrom, window.heatUpTo, window.soakStart, window.soakEnd], window.liquidus);
  const [c25, from, to, soakStart, soakEnd] = scan.crossings;
  const { peak, timeAtPeak } = scan;

  let tal: number | null = null;
  if (peak >= window.liquidus) tal = scan.timeAbove;
  else warnings.push(`Probe "${name}" never reaches ${fmt(window.liquidus)} °C (liquidus; its peak is ${fmt(peak)} °C), so its time above liquidus is not available and the run fails.`);

  let heatUpRate: number | null = null;
  if (from === null) never(window.heatUpFrom, "heat-up start", "heat-up rate");
  else if (to === null) never(window.heatUpTo, "heat-up end", "heat-up rate");
  else if (to > from) heatUpRate = (window.heatUpTo - window.heatUpFrom) / (to - from);

  let soakTime: number | null = null;
  if (soakStart === null) never(window.soakStart, "soak start", "soak time");
  else if (soakEnd === null) never(window.soakEnd, "soak end", "soak time");
  else soakTime = soakEnd - soakStart;

  // Time to peak counts from the first time at or above 25 °C: the first sample if it starts there.
  const t25 = v[0] >= 25 ? t[0] : c25;
  const timeToPeak = t25 === null ? null : timeAtPeak - t25;
  if (t25 === null) never(25, "start of time to peak", "time to peak");

  const slopes = slopeExtremes(t, v, window.rampWindow);
  if (!slopes) warnings.push(`Probe "${name}": the recording is too short for a ${fmt(window.rampWindow)} s ramp window, so its ramp rates are not available and the run fails.`);

  const metrics: ChannelMetrics = {
    name, peak, timeAtPeak, tal, heatUpRate,
    rampUpMax: slopes ? slopes.up : null,
    rampDownMax: slopes ? slopes.down : null,
    soakTime, timeToPeak,
  };
  return { metrics, soakEndCrossing: soakEnd };
}

/** One probe's metrics against a process window; reasons for null statistics go to `warnings`. */
export function channelMetrics(t: ArrayLike<number>, channel: Channel, window: ProcessWindow, warnings: string[]): ChannelMetrics {
  return channelFacts(t, channel, window, warnings).metrics;
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
  const facts = channels.map((c) => channelFacts(time, c, window, warnings));
  const perChannel = facts.map((f) => f.metrics);
  const board = boardMetrics(series, perChannel, facts.map((f) => f.soakEndCrossing), warnings);
  return { channels: perChannel, board, warnings };
}
