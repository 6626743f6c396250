// Oven health (pure): Down > Act > Watch > Steady.
//  - Down: the oven is down (or retired), or a breakdown work order is open.
//  - Act: the last run was out of window (verdict "fail"), or a metric is projected to reach
//    its limit within 7 days (already beyond counts as 0 days).
//  - Watch: a drift rule fired recently, or a projection within 30 days, or verification is
//    overdue, or the logger's calibration has lapsed.
// Reasons list every finding, most severe first, as plain sentences for the oven page.
import type { SignalName } from "./drift-types";

export type HealthState = "steady" | "watch" | "act" | "down";
export type OvenServiceState = "in_service" | "down" | "retired";
export type RunVerdict = "pass" | "marginal" | "fail";

export interface MetricProjection {
  /** As shown to people, e.g. "Critical-phase spread". */
  metricLabel: string;
  limit: number;
  unit: string;
  direction: "above" | "below";
  daysToLimit: number | null;
}

export interface HealthInputs {
  ovenServiceState: OvenServiceState;
  openBreakdown: boolean;
  lastRunVerdict: RunVerdict | null;
  signalsFiredRecently: { metricLabel: string; signal: SignalName }[];
  projections: MetricProjection[];
  verificationOverdue: boolean;
  loggerCalibrationLapsed: boolean;
}

export interface Health {
  state: HealthState;
  reasons: string[];
}

export const ACT_WITHIN_DAYS = 7;
export const WATCH_WITHIN_DAYS = 30;

const RANK: Record<HealthState, number> = { steady: 0, watch: 1, act: 2, down: 3 };

const SIGNAL_SENTENCE: Record<SignalName, string> = {
  beyond3Sigma: "a run fell outside the baseline's 3-sigma limits",
  twoOfThree: "two of the last three runs are beyond 2 sigma on the same side",
  sixTrending: "six runs in a row have moved steadily in one direction",
  nineOneSide: "nine runs in a row are on the same side of the baseline centre",
  ewma: "the EWMA chart is outside its control limits",
  cusum: "the CUSUM has passed its decision limit",
};

function formatDays(days: number): string {
  if (days < 1) return "within a day";
  const d = Math.round(days);
  return `in about ${d} ${d === 1 ? "day" : "days"}`;
}

function projectionSentence(p: MetricProjection & { daysToLimit: number }): string {
  const limit = `${p.limit.toFixed(1)} ${p.unit}`.trim();
  if (p.daysToLimit <= 0) return `${p.metricLabel} has reached ${limit} on its trend line.`;
  const moving = p.direction === "above" ? "rising" : "falling";
  return `${p.metricLabel} is ${moving}; projected to reach ${limit} ${formatDays(p.daysToLimit)}.`;
}

export function healthState(inputs: HealthInputs): Health {
  const found: { level: HealthState; text: string }[] = [];
  const add = (level: HealthState, text: string) => found.push({ level, text });

  if (inputs.ovenServiceState === "down") add("down", "The oven is marked down.");
  if (inputs.ovenServiceState === "retired") add("down", "The oven is retired.");
  if (inputs.openBreakdown) add("down", "A breakdown work order is open.");
  if (inputs.lastRunVerdict === "fail") add("act", "The last verification run was out of window.");

  const projections = inputs.projections
    .filter((p): p is MetricProjection & { daysToLimit: number } => p.daysToLimit !== null && p.daysToLimit <= WATCH_WITHIN_DAYS)
    .sort((a, b) => a.daysToLimit - b.daysToLimit);
  for (const p of projections) add(p.daysToLimit <= ACT_WITHIN_DAYS ? "act" : "watch", projectionSentence(p));

  const seen = new Set<string>();
  for (const s of inputs.signalsFiredRecently) {
    const key = `${s.metricLabel}\u0000${s.signal}`;
    if (seen.has(key)) continue;
    seen.add(key);
    add("watch", `${s.metricLabel}: ${SIGNAL_SENTENCE[s.signal]}.`);
  }
  if (inputs.verificationOverdue) add("watch", "A verification run is overdue.");
  if (inputs.loggerCalibrationLapsed) add("watch", "The logger's calibration has lapsed; its runs are flagged.");

  if (found.length === 0) {
    return { state: "steady", reasons: ["No drift rule has fired, the last run was in window, and no limit is projected within 30 days."] };
  }
  // Stable sort keeps the order above within a level.
  found.sort((a, b) => RANK[b.level] - RANK[a.level]);
  return { state: found[0].level, reasons: found.map((f) => f.text) };
}

/** True when `next` is more severe than `prev` (an alert is raised). No previous state counts as steady. */
export function worsened(prev: HealthState | null | undefined, next: HealthState): boolean {
  return RANK[next] > RANK[prev ?? "steady"];
}
