// Time to limit: a Theil–Sen trend over the most recent runs, projected to a window limit.
// Times are epoch ms; slopes are per day. x is measured in days from the oldest point used,
// which keeps the arithmetic well conditioned.
import { DAY_MS } from "./constants";
import { theilSen } from "./theil-sen";

export interface TimedValue {
  at: number;
  value: number;
}

export interface TimeTrend {
  slopePerDay: number;
  /** 95 % interval of the slope per day; null when too few pairs. */
  slopeCi: [number, number] | null;
  /** Trend-line value at `refAt`. */
  intercept: number;
  refAt: number;
  n: number;
}

export const TREND_WINDOW = 20;
export const TREND_MIN_POINTS = 8;

/** Trend over the last `window` (20) points; null with fewer than `minPoints` (8) or all at one time. */
export function timeTrend(
  points: readonly TimedValue[],
  options: { window?: number; minPoints?: number } = {},
): TimeTrend | null {
  const window = options.window ?? TREND_WINDOW;
  const minPoints = options.minPoints ?? TREND_MIN_POINTS;
  const usable = points.filter((p) => Number.isFinite(p.value) && Number.isFinite(p.at));
  const recent = [...usable].sort((a, b) => a.at - b.at).slice(-window);
  if (recent.length < minPoints) return null;
  const refAt = recent[0].at;
  const fit = theilSen(
    recent.map((p) => (p.at - refAt) / DAY_MS),
    recent.map((p) => p.value),
  );
  if (!fit) return null;
  return { slopePerDay: fit.slope, slopeCi: fit.ci, intercept: fit.intercept, refAt, n: recent.length };
}

export interface CrossingProjection {
  slopePerDay: number;
  slopeCi: [number, number] | null;
  limit: number;
  direction: "above" | "below";
  /** Trend-line value at `now`. */
  valueNow: number;
  /** When the trend line reaches the limit; `now` if it is already there; null if it never will. */
  crossesAt: number | null;
  daysToLimit: number | null;
  alreadyBeyond: boolean;
  n: number;
}

/**
 * Project when the trend crosses `limit` ("above": an upper limit, "below": a lower one).
 * If the trend line at `now` is already at or beyond the limit, crossesAt = now and
 * daysToLimit = 0 whatever the slope. Otherwise a slope that is zero or heads away from the
 * limit gives crossesAt = daysToLimit = null. Null overall when there is no trend (too few runs).
 */
export function projectCrossing(args: {
  points: readonly TimedValue[];
  limit: number;
  direction: "above" | "below";
  now: number;
  window?: number;
  minPoints?: number;
}): CrossingProjection | null {
  const trend = timeTrend(args.points, args);
  if (!trend) return null;
  const { limit, direction, now } = args;
  const valueNow = trend.intercept + (trend.slopePerDay * (now - trend.refAt)) / DAY_MS;
  const base = { slopePerDay: trend.slopePerDay, slopeCi: trend.slopeCi, limit, direction, valueNow, n: trend.n };
  const beyond = direction === "above" ? valueNow >= limit : valueNow <= limit;
  if (beyond) return { ...base, crossesAt: now, daysToLimit: 0, alreadyBeyond: true };
  const towards = direction === "above" ? trend.slopePerDay > 0 : trend.slopePerDay < 0;
  if (!towards) return { ...base, crossesAt: null, daysToLimit: null, alreadyBeyond: false };
  const daysToLimit = (limit - valueNow) / trend.slopePerDay;
  return { ...base, crossesAt: now + daysToLimit * DAY_MS, daysToLimit, alreadyBeyond: false };
}
