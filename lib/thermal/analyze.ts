import { alignChannels, applyOffsets } from "./align";
import type { LoggerFileInput } from "./decode";
import { invalidOptions } from "./errors";
import type { ThermocoupleType } from "./its90";
import { computeMetrics, type MetricSeries } from "./metrics";
import { parseLoggerFile } from "./parse-logger-file";
import type { AnalysisResult } from "./types";
import type { TemperatureUnit } from "./units";
import { judge } from "./verdict";
import { DEFAULT_WINDOW, processWindowSchema, type ProcessWindow } from "./windows";

export interface AnalyzeOptions {
  /** Defaults to the typical SAC305 window. */
  window?: ProcessWindow;
  /** Scan skew between consecutive probe channels, s. */
  skewSeconds?: number;
  /** Calibration offsets, °C, added to each named channel after unit conversion. */
  offsets?: Record<string, number>;
  /** For millivolt files; type K unless given. */
  thermocouple?: ThermocoupleType;
  /** Reference-junction temperature of millivolt readings, °C (0 unless given). */
  coldJunctionC?: number;
  /** Overrides units read from the headers. */
  units?: TemperatureUnit;
  setPointColumn?: string;
  /** Probe columns to analyse, by name or header, in this order. */
  columns?: string[];
}

export const MAX_SKEW_SECONDS = 10;

function checkedWindow(window: ProcessWindow | undefined): ProcessWindow {
  if (window === undefined) return DEFAULT_WINDOW;
  const parsed = processWindowSchema.safeParse(window);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const path = issue.path.map(String).join(".");
  throw invalidOptions(path ? `window.${path}` : "window", `Process window: ${issue.message}`);
}

/** Median spacing of the sample times. */
export function medianInterval(time: ArrayLike<number>): number {
  const n = time.length;
  if (n < 2) return 0;
  const d = new Float64Array(n - 1);
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 1; i < n; i++) {
    const x = time[i] - time[i - 1];
    d[i - 1] = x;
    if (x < lo) lo = x;
    if (x > hi) hi = x;
  }
  // Evenly sampled (to rounding): every spacing is the median; skip the sort.
  if (hi - lo <= 1e-9 * Math.max(1, hi)) return d[(n - 1) >> 1];
  d.sort();
  const mid = (n - 1) >> 1;
  return (n - 1) % 2 === 1 ? d[mid] : (d[mid - 1] + d[mid]) / 2;
}

/**
 * Reads a logger file and returns probe and board metrics and the verdict against the window.
 * Anything wrong with the file or the options is a ThermalFileError.
 */
export function analyzeLoggerFile(input: LoggerFileInput, options: AnalyzeOptions = {}): AnalysisResult {
  return analyzeWithSeries(input, options).result;
}

/** The same analysis, also handing back the aligned, corrected curves (for storing a run). */
export function analyzeWithSeries(input: LoggerFileInput, options: AnalyzeOptions = {}): { result: AnalysisResult; series: MetricSeries } {
  const window = checkedWindow(options.window);
  const skewSeconds = options.skewSeconds ?? 0;
  if (typeof skewSeconds !== "number" || !(Math.abs(skewSeconds) <= MAX_SKEW_SECONDS)) {
    throw invalidOptions("skewSeconds", `The scan skew must be a number of seconds between -${MAX_SKEW_SECONDS} and ${MAX_SKEW_SECONDS}.`);
  }
  const parsed = parseLoggerFile(input, {
    units: options.units,
    thermocouple: options.thermocouple,
    coldJunctionC: options.coldJunctionC,
    setPointColumn: options.setPointColumn,
    columns: options.columns,
  });
  const warnings = [...parsed.warnings];
  const corrected = applyOffsets(parsed.channels, options.offsets ?? {});
  for (const key of corrected.unmatched) warnings.push(`The calibration offset for "${key}" matches no probe column and was not applied.`);
  const aligned = alignChannels({ time: parsed.time, channels: corrected.channels, setPoint: parsed.setPoint }, skewSeconds);
  if (aligned.droppedLeading + aligned.droppedTrailing > 0) {
    warnings.push(
      `Time alignment for a ${skewSeconds} s scan skew dropped ${aligned.droppedLeading} leading and ${aligned.droppedTrailing} trailing row(s) that some probe had not yet (or no longer) sampled.`,
    );
  }
  const metrics = computeMetrics(aligned, window);
  warnings.push(...metrics.warnings);
  const time = aligned.time;
  const result: AnalysisResult = {
    channels: metrics.channels,
    board: metrics.board,
    verdict: judge(metrics.board, window),
    meta: {
      rows: time.length,
      channels: aligned.channels.length,
      durationSeconds: time[time.length - 1] - time[0],
      sampleInterval: medianInterval(time),
      units: parsed.units,
      warnings,
      skewSeconds,
      offsets: corrected.applied,
    },
  };
  if (parsed.units === "mV") {
    result.meta.thermocouple = options.thermocouple ?? "K";
    result.meta.coldJunctionC = options.coldJunctionC ?? 0;
  }
  return { result, series: { time: aligned.time, channels: aligned.channels } };
}
