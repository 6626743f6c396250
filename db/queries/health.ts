import "server-only";
import { and, desc, eq, inArray, isNull } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { ovens } from "../schema/fleet";
import { runs } from "../schema/runs";
import { workOrders } from "../schema/maintenance";
import { alerts, driftPoints, driftStates, ovenHealth } from "../schema/drift";
import { healthState, worsened, type Health, type HealthState, type MetricProjection } from "@/lib/drift/health-state";
import { projectCrossing } from "@/lib/drift/time-to-limit";
import type { DriftState, SignalName } from "@/lib/drift/drift-types";
import { METRIC_INFO, isTrackedMetric } from "@/lib/tracked-metrics";
import type { ProcessWindow } from "@/lib/thermal/windows";
import { systemUncertainty } from "./impact";
import { runSummaries } from "./run-summary";
import type { BaselineStats } from "@/lib/drift/baseline";

/**
 * The smallest shift of a metric that the measurement system can tell from its own error
 * (expanded uncertainty, k = 2). A rate inherits the temperature uncertainty over its band.
 */
async function shiftFloor(db: DbOrTx, metric: string, last: { instrumentId: number | null; sampleInterval: number; window: ProcessWindow }, baselineMean: number) {
  if (!isTrackedMetric(metric)) return 0;
  if (metric === "heatUpRate") {
    const t = await systemUncertainty(db, "deltaTPeak", last.instrumentId, last.sampleInterval);
    const band = last.window.heatUpTo - last.window.heatUpFrom;
    return t && band > 0 ? (Math.SQRT2 * t.expanded * Math.abs(baselineMean)) / band : 0;
  }
  return (await systemUncertainty(db, metric, last.instrumentId, last.sampleInterval))?.expanded ?? 0;
}

const DAY = 86_400_000;
const SIGNAL_PRIORITY: SignalName[] = ["ewma", "cusum", "beyond3Sigma", "twoOfThree", "sixTrending", "nineOneSide"];
/** How old the last run may be before verification counts as overdue: daily on lines, weekly in the lab, with a day's grace. */
const expectedEveryDays = (kind: string) => (kind === "convection" ? 2 : 8);

export type OvenHealthDetail = Health & { projections: (MetricProjection & { metric: string; crossesAt: number | null })[] };

/** Works out an oven's health from its service state, orders, last run and stored drift state. */
export async function computeOvenHealth(db: DbOrTx, ovenId: number, now: Date): Promise<OvenHealthDetail> {
  const [oven] = await db.select().from(ovens).where(eq(ovens.id, ovenId));
  const [breakdown] = await db
    .select({ id: workOrders.id })
    .from(workOrders)
    .where(and(eq(workOrders.ovenId, ovenId), eq(workOrders.breakdown, true), inArray(workOrders.state, ["open", "in_progress", "on_hold"])))
    .limit(1);
  const [last] = await db
    .select({ runAt: runs.runAt, verdict: runs.verdictStatus, calibration: runs.calibrationStatus, window: runs.windowValues, instrumentId: runs.instrumentId, sampleInterval: runs.sampleInterval })
    .from(runs)
    .where(and(eq(runs.ovenId, ovenId), isNull(runs.deletedAt)))
    .orderBy(desc(runs.runAt), desc(runs.id))
    .limit(1);
  const states = await db.select().from(driftStates).where(eq(driftStates.ovenId, ovenId));
  const signals: { metricLabel: string; signal: SignalName }[] = [];
  const projections: OvenHealthDetail["projections"] = [];
  for (const s of states) {
    if (!isTrackedMetric(s.metric)) continue;
    const info = METRIC_INFO[s.metric];
    const [latest] = await db
      .select({ signals: driftPoints.signals, ewma: driftPoints.ewma })
      .from(driftPoints)
      .where(and(eq(driftPoints.ovenId, ovenId), eq(driftPoints.metric, s.metric)))
      .orderBy(desc(driftPoints.at))
      .limit(1);
    // A rule that fired on a shift smaller than the measurement can resolve is statistics, not drift:
    // with months of runs and a ten-run baseline, CUSUM finds hundredth-of-a-degree offsets.
    const baseline = s.baseline as BaselineStats;
    const floor = last && latest?.signals.length ? await shiftFloor(db, s.metric, { ...last, window: last.window as ProcessWindow }, baseline.mean) : 0;
    if (latest && Math.abs(latest.ewma - baseline.mean) > floor) {
      // One sentence per metric: the most telling rule that fired.
      const top = SIGNAL_PRIORITY.find((sig) => latest.signals.includes(sig));
      if (top) signals.push({ metricLabel: info.label, signal: top });
    }
    const limit = last ? info.limit(last.window as ProcessWindow) : null;
    const history = (s.state as DriftState | null)?.history;
    if (limit && history && history.length) {
      const p = projectCrossing({ points: history, limit: limit.value, direction: limit.direction, now: now.getTime() });
      if (p) projections.push({ metric: s.metric, metricLabel: info.label, unit: info.unit, limit: limit.value, direction: limit.direction, daysToLimit: p.daysToLimit, crossesAt: p.crossesAt });
    }
  }
  const health = healthState({
    ovenServiceState: oven.serviceState,
    openBreakdown: Boolean(breakdown),
    lastRunVerdict: last?.verdict ?? null,
    signalsFiredRecently: signals,
    projections,
    verificationOverdue: !last || now.getTime() - last.runAt.getTime() > expectedEveryDays(oven.kind) * DAY,
    loggerCalibrationLapsed: last?.calibration === "lapsed",
  });
  return { ...health, projections };
}

/** Recomputes and stores an oven's health; raises an alert when it worsened. Returns the alert, if any. */
export async function refreshHealth(tx: DbOrTx, ovenId: number, now: Date, runId: number | null = null) {
  const next = await computeOvenHealth(tx, ovenId, now);
  const runSummary = (await runSummaries(tx, [ovenId], now)).get(ovenId)!;
  const [prev] = await tx.select().from(ovenHealth).where(eq(ovenHealth.ovenId, ovenId));
  await tx
    .insert(ovenHealth)
    .values({ ovenId, state: next.state, reasons: next.reasons, runSummary, updatedAt: now })
    .onConflictDoUpdate({ target: ovenHealth.ovenId, set: { state: next.state, reasons: next.reasons, runSummary, updatedAt: now } });
  if (!worsened(prev?.state as HealthState | undefined, next.state)) return null;
  const [alert] = await tx
    .insert(alerts)
    .values({ ovenId, fromState: (prev?.state as HealthState | undefined) ?? null, toState: next.state, reasons: next.reasons, runId, raisedAt: now })
    .returning();
  return alert;
}

export async function refreshAllHealth(tx: DbOrTx, now: Date) {
  const all = await tx.select({ id: ovens.id }).from(ovens);
  for (const o of all) await refreshHealth(tx, o.id, now);
}


export async function getStoredHealth(db: DbOrTx, ovenId: number) {
  const [row] = await db.select().from(ovenHealth).where(eq(ovenHealth.ovenId, ovenId));
  return row ? { state: row.state as HealthState, reasons: row.reasons, updatedAt: row.updatedAt } : null;
}
