import { invalidOptions } from "./errors";

export interface Channel {
  name: string;
  values: ArrayLike<number>;
  /** The logger's scan position; defaults to the channel's position in the list. */
  scanIndex?: number;
  header?: string;
}

export interface Series<C extends Channel = Channel> {
  time: ArrayLike<number>;
  channels: C[];
  setPoint?: { name: string; values: ArrayLike<number> };
}

export interface AlignedSeries<C extends Channel = Channel> extends Series<C> {
  droppedLeading: number;
  droppedTrailing: number;
}

/**
 * Puts every channel on channel 0's time grid. A scanning logger read channel i at t + i·skew;
 * each channel is resampled at the grid times by linear interpolation between its own samples.
 * Grid rows that some channel could only reach by extrapolation are dropped: leading rows for a
 * positive skew (later channels start late), trailing rows for a negative one (they end early).
 * The set point is taken as sampled at the row time (a controller value, not a scanned input).
 */
export function alignChannels<C extends Channel>(series: Series<C>, skewSeconds: number): AlignedSeries<C> {
  const { time, channels } = series;
  const n = time.length;
  if (!Number.isFinite(skewSeconds)) throw invalidOptions("skewSeconds", "The scan skew must be a finite number of seconds.");
  const shifts = channels.map((c, i) => (c.scanIndex ?? i) * skewSeconds);
  if (skewSeconds === 0 || shifts.every((d) => d === 0) || n === 0) {
    return { ...series, droppedLeading: 0, droppedTrailing: 0 };
  }
  const maxShift = Math.max(...shifts);
  const minShift = Math.min(...shifts);
  const eps = 1e-9 * Math.max(1, Math.abs(time[0]), Math.abs(time[n - 1]));
  const lower = time[0] + maxShift - eps;
  const upper = time[n - 1] + minShift + eps;
  let first = 0;
  while (first < n && time[first] < lower) first++;
  let last = n - 1;
  while (last >= first && time[last] > upper) last--;
  const kept = last - first + 1;
  if (kept < 2) {
    throw invalidOptions("skewSeconds", `A scan skew of ${skewSeconds} s leaves no common time span for the probes. Check the instrument's scan skew.`);
  }
  const grid = Float64Array.from({ length: kept }, (_, k) => time[first + k]);
  const aligned = channels.map((channel, i) => {
    const d = shifts[i];
    const v = channel.values;
    const out = new Float64Array(kept);
    if (d === 0) {
      for (let k = 0; k < kept; k++) out[k] = v[first + k];
      return { ...channel, values: out };
    }
    let j = 0;
    for (let k = 0; k < kept; k++) {
      const g = grid[k];
      while (j < n - 2 && time[j + 1] + d <= g) j++;
      const s0 = time[j] + d;
      const s1 = time[j + 1] + d;
      let f = (g - s0) / (s1 - s0);
      if (f < 0) f = 0;
      else if (f > 1) f = 1;
      out[k] = v[j] + f * (v[j + 1] - v[j]);
    }
    return { ...channel, values: out };
  });
  const setPoint = series.setPoint
    ? { ...series.setPoint, values: Float64Array.from({ length: kept }, (_, k) => series.setPoint!.values[first + k]) }
    : undefined;
  return { time: grid, channels: aligned, setPoint, droppedLeading: first, droppedTrailing: n - 1 - last };
}

export interface OffsetResult<C extends Channel> {
  channels: C[];
  /** Offsets actually applied, by channel name. */
  applied: Record<string, number>;
  /** Offset keys that match no channel. */
  unmatched: string[];
}

/** Adds per-channel calibration offsets (°C), matched by channel name or header (case-insensitive). */
export function applyOffsets<C extends Channel>(channels: C[], offsets: Record<string, number> = {}): OffsetResult<C> {
  const applied: Record<string, number> = {};
  const unmatched: string[] = [];
  const byChannel = new Map<C, number>();
  for (const [key, offset] of Object.entries(offsets)) {
    if (typeof offset !== "number" || !Number.isFinite(offset) || Math.abs(offset) > 100) {
      throw invalidOptions("offsets", `The offset for "${key}" must be a number of °C between -100 and 100.`);
    }
    const k = key.trim().toLowerCase();
    const hit = channels.find((c) => c.name === key) ??
      channels.find((c) => c.name.toLowerCase() === k || (c.header ?? "").toLowerCase() === k);
    if (!hit) { unmatched.push(key); continue; }
    byChannel.set(hit, offset);
    applied[hit.name] = offset;
  }
  const corrected = channels.map((channel) => {
    const offset = byChannel.get(channel);
    if (!offset) return channel;
    const v = channel.values;
    const out = new Float64Array(v.length);
    for (let i = 0; i < v.length; i++) out[i] = v[i] + offset;
    return { ...channel, values: out };
  });
  return { channels: corrected, applied, unmatched };
}
