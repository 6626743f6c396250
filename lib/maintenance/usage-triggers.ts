/*
 * Usage triggers: a plan falls due every N verification runs, or every N heater hours on an
 * oven's hour meter. Thresholds are fixed multiples of N counted from the plan's start
 * (N, 2N, 3N …), not from when the last order was closed, so each threshold has a stable key
 * and a late order does not push the whole schedule back.
 */

const DAY_MS = 86_400_000;
const EPS = 1e-9;
const MAX_CROSSED = 1000;
export const DEFAULT_RATE_WINDOW_DAYS = 30;

export type UsagePoint = { at: Date; value: number };
export type MeterReading = { at: Date; value: number };

export type CrossedThreshold = {
  /** `${planId}:runs:${threshold}` or `${planId}:hours:${threshold}`. */
  occurrenceKey: string;
  /** Usage since the plan's start at which this order falls due (a multiple of N). */
  threshold: number;
  /** When the usage was first seen at or beyond the threshold. */
  reachedAt: Date;
};

export type UsageForecast =
  | { at: Date; ratePerDay: number }
  | { at: null; reason: string };

export type UsageDue = {
  /** Usage since the plan's start. */
  used: number;
  /** Usage since the threshold of the last order (or since the start, if none). */
  usedSinceLastOrder: number;
  /** Thresholds crossed since the last order, lowest first. Usually one. */
  crossed: CrossedThreshold[];
  nextThreshold: number;
  /** When the next threshold is expected, by linear extrapolation of the recent usage rate. */
  forecast: UsageForecast;
};

function keyNumber(n: number): string {
  return String(Number(n.toFixed(6)));
}

/**
 * Linear extrapolation: the rate is the change over the readings in the last `windowDays`
 * before the latest one (or the last two readings, if fewer lie in the window). A forecast
 * that lands before `now` means readings are late; it is reported as `now`.
 */
export function forecastThreshold(
  points: readonly UsagePoint[],
  target: number,
  now: Date,
  windowDays = DEFAULT_RATE_WINDOW_DAYS,
): UsageForecast {
  if (points.length < 2) return { at: null, reason: "At least two readings are needed to estimate the usage rate." };
  const last = points[points.length - 1];
  const windowStart = last.at.getTime() - windowDays * DAY_MS;
  let inWindow = points.filter((p) => p.at.getTime() >= windowStart);
  if (inWindow.length < 2) inWindow = points.slice(-2);
  const first = inWindow[0];
  const dt = last.at.getTime() - first.at.getTime();
  const dv = last.value - first.value;
  if (dt <= 0 || dv <= EPS) {
    return { at: null, reason: `Usage has not increased over the readings used (${inWindow.length}); no forecast.` };
  }
  const rate = dv / dt;
  const at = last.at.getTime() + (target - last.value) / rate;
  return { at: new Date(Math.max(at, now.getTime())), ratePerDay: rate * DAY_MS };
}

function evaluate(args: {
  planId: string;
  unit: "runs" | "hours";
  every: number;
  points: UsagePoint[];
  lastTriggeredThreshold: number | null;
  now: Date;
  rateWindowDays?: number;
}): UsageDue {
  const { every, points } = args;
  const used = points.length ? points[points.length - 1].value : 0;
  const last = args.lastTriggeredThreshold ?? 0;
  if (!(last >= 0)) throw new Error("lastTriggeredThreshold must be 0 or more, or null.");
  const kFrom = Math.floor(last / every + EPS) + 1;
  const kTo = Math.floor(used / every + EPS);
  const crossed: CrossedThreshold[] = [];
  for (let k = kFrom; k <= kTo && crossed.length < MAX_CROSSED; k++) {
    const threshold = k * every;
    const reached = points.find((p) => p.value >= threshold - EPS)!;
    crossed.push({
      occurrenceKey: `${args.planId}:${args.unit}:${keyNumber(threshold)}`,
      threshold: Number(threshold.toFixed(6)),
      reachedAt: reached.at,
    });
  }
  const nextThreshold = Number((Math.max(kTo, kFrom - 1) + 1) * every);
  return {
    used,
    usedSinceLastOrder: Math.max(0, used - last),
    crossed,
    nextThreshold: Number(nextThreshold.toFixed(6)),
    forecast: forecastThreshold(points, nextThreshold, args.now, args.rateWindowDays),
  };
}

/**
 * Due every `everyRuns` verification runs. `runs` are the times of the oven's runs; those
 * before `since` (the plan's start) or after `now` are not counted. `lastTriggeredThreshold` is
 * the run count of the last order this plan produced (null when none yet).
 */
export function dueByRuns(input: {
  planId: string;
  everyRuns: number;
  runs: readonly Date[];
  since?: Date;
  lastTriggeredThreshold: number | null;
  now: Date;
  rateWindowDays?: number;
}): UsageDue {
  if (!Number.isInteger(input.everyRuns) || input.everyRuns < 1) {
    throw new Error(`everyRuns must be a whole number of 1 or more; got ${input.everyRuns}.`);
  }
  const since = input.since?.getTime() ?? -Infinity;
  const times = input.runs
    .map((d) => d.getTime())
    .filter((t) => t >= since && t <= input.now.getTime())
    .sort((a, b) => a - b);
  const points: UsagePoint[] = times.map((t, i) => ({ at: new Date(t), value: i + 1 }));
  // The plan's start is a known zero, which gives a rate from the very first run.
  if (input.since && input.since <= input.now) points.unshift({ at: input.since, value: 0 });
  return evaluate({ ...input, unit: "runs", every: input.everyRuns, points });
}

/**
 * Due every `everyHours` heater hours. `readings` are hour-meter values; `baselineValue` is the
 * meter's value at the plan's start. `lastTriggeredThreshold` is the hours-since-baseline of the
 * last order this plan produced (null when none yet). Throws on an inconsistent reading series.
 */
export function dueByMeter(input: {
  planId: string;
  everyHours: number;
  readings: readonly MeterReading[];
  baselineValue: number;
  lastTriggeredThreshold: number | null;
  now: Date;
  rateWindowDays?: number;
}): UsageDue {
  if (!(input.everyHours > 0) || !Number.isFinite(input.everyHours)) {
    throw new Error(`everyHours must be a number above 0; got ${input.everyHours}.`);
  }
  const sorted = [...input.readings].sort((a, b) => a.at.getTime() - b.at.getTime());
  sorted.forEach((r, i) => {
    const problem = validateMeterReading(i === 0 ? null : sorted[i - 1], r, input.now);
    if (problem) throw new Error(`Meter reading ${i + 1}: ${problem}`);
  });
  const points = sorted.map((r) => ({ at: r.at, value: Math.max(0, r.value - input.baselineValue) }));
  return evaluate({ ...input, unit: "hours", every: input.everyHours, points });
}

function stamp(d: Date): string {
  return d.toISOString().slice(0, 16).replace("T", " ") + " UTC";
}

/** Error message for a new hour-meter reading, or null when it is acceptable. */
export function validateMeterReading(
  previous: MeterReading | null,
  next: MeterReading,
  now: Date,
): string | null {
  if (!(next.at instanceof Date) || Number.isNaN(next.at.getTime())) return "The reading has no valid date and time.";
  if (typeof next.value !== "number" || !Number.isFinite(next.value) || next.value < 0) {
    return "A meter reading must be a number of 0 or more.";
  }
  if (next.at > now) {
    return `The reading is dated ${stamp(next.at)}, which is in the future; record readings when they are taken.`;
  }
  if (!previous) return null;
  if (next.at <= previous.at) {
    return `The reading is dated ${stamp(next.at)}, not after the previous reading (${stamp(previous.at)}).`;
  }
  if (next.value < previous.value) {
    return `The reading ${next.value} h is lower than the previous reading ${previous.value} h on ${stamp(previous.at)}; an hour meter only counts up. If the meter was replaced or reset, set a new baseline on the plan.`;
  }
  return null;
}
