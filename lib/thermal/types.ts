import type { ThermocoupleType } from "./its90";
import type { TemperatureUnit } from "./units";

/** Per-probe statistics. Temperatures °C, times s (from the file's start), rates °C/s. */
export interface ChannelMetrics {
  name: string;
  peak: number;
  timeAtPeak: number;
  tal: number | null;
  heatUpRate: number | null;
  rampUpMax: number | null;
  rampDownMax: number | null;
  soakTime: number | null;
  timeToPeak: number | null;
}

export interface TrackingError {
  /** Mean of |board mean − set point| over the samples, °C. */
  mean: number;
  /** Largest |board mean − set point|, °C. */
  max: number;
}

/** Board statistics; an aggregate over channels is null when any channel's value is null. */
export interface BoardMetrics {
  peakMin: number;
  peakMax: number;
  deltaTPeak: number;
  criticalSpread: number | null;
  heatUpRate: number | null;
  rampUpMax: number | null;
  rampDownMax: number | null;
  soakTimeMin: number | null;
  soakTimeMax: number | null;
  talMin: number | null;
  talMax: number | null;
  timeToPeakMax: number | null;
  trackingError?: TrackingError;
}

export type VerdictStatus = "pass" | "marginal" | "fail";

/** Window use per item, in % of the allowed half-window (two-sided) or of the limit (one-sided). */
export interface VerdictItems {
  peak: number | null;
  tal: number | null;
  soakTime: number | null;
  rampUp: number | null;
  rampDown: number | null;
  deltaT: number | null;
  timeToPeak: number | null;
  criticalSpread?: number | null;
}

export interface Verdict {
  status: VerdictStatus;
  /** The largest item (null only when every item is null). */
  windowUse: number | null;
  items: VerdictItems;
}

export interface AnalysisMeta {
  /** Data rows analysed (after time alignment). */
  rows: number;
  channels: number;
  durationSeconds: number;
  /** Median time between samples, s. */
  sampleInterval: number;
  /** Unit the probe values were written in; results are always °C. */
  units: TemperatureUnit;
  warnings: string[];
  skewSeconds: number;
  /** Calibration offsets applied, °C by channel name. */
  offsets: Record<string, number>;
  thermocouple?: ThermocoupleType;
  coldJunctionC?: number;
}

export interface AnalysisResult {
  channels: ChannelMetrics[];
  board: BoardMetrics;
  verdict: Verdict;
  meta: AnalysisMeta;
}
