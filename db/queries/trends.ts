import "server-only";
import { and, asc, desc, eq, gte, lte, isNull, isNotNull, type SQL } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { runs } from "../schema/runs";
import { changes } from "../schema/changes";
import { workOrders } from "../schema/maintenance";
import { driftPoints } from "../schema/drift";
import { getDriftState } from "./drift";
import { projectCrossing } from "@/lib/drift/time-to-limit";
import { downsampleForChart } from "@/lib/drift/lttb";
import { METRIC_INFO, type TrackedMetric } from "@/lib/tracked-metrics";
import type { ProcessWindow } from "@/lib/thermal/windows";

export type TrendPoint = {
  runId: number;
  runAt: string;
  value: number;
  ewma: number | null;
  ewmaUcl: number | null;
  ewmaLcl: number | null;
  cusumHigh: number | null;
  cusumLow: number | null;
  signals: string[];
};

export type TrendResponse = {
  metric: TrackedMetric;
  label: string;
  unit: string;
  baseline: { mean: number; sigma: number; n: number; fromRunId: number; toRunId: number; ucl: number; lcl: number; provisional: boolean } | null;
  points: TrendPoint[];
  totalPoints: number;
  windowLimit: { value: number; direction: "above" | "below" } | null;
  projection: { slopePerDay: number; limit: number; crossesAt: string | null; daysToLimit: number | null } | null;
  changes: { id: number; at: string; area: string; summary: string }[];
  workOrders: { id: number; number: string; at: string; title: string }[];
};

/** A metric's trend for the chart and the API: every run's value, the drift results after the baseline, markers and the projection. */
export async function getTrend(db: DbOrTx, ovenId: number, metric: TrackedMetric, range: { from?: Date; to?: Date }, now: Date): Promise<TrendResponse> {
  const col = runs[metric];
  const where: SQL[] = [eq(runs.ovenId, ovenId), isNull(runs.deletedAt), isNotNull(col)];
  if (range.from) where.push(gte(runs.runAt, range.from));
  if (range.to) where.push(lte(runs.runAt, range.to));
  // Every run's value, then the drift results (stored only for the runs after the baseline),
  // matched here: joining them in SQL sent nine mostly empty columns for each of the years of
  // runs, and reading those rows was most of the request.
  const rows = await db.select({ runId: runs.id, at: runs.runAt, value: col }).from(runs).where(and(...where)).orderBy(asc(runs.runAt), asc(runs.id));
  const drift = new Map(
    (
      await db
        .select({ runId: driftPoints.runId, ewma: driftPoints.ewma, ewmaUcl: driftPoints.ewmaUcl, ewmaLcl: driftPoints.ewmaLcl, cusumHigh: driftPoints.cusumHigh, cusumLow: driftPoints.cusumLow, signals: driftPoints.signals })
        .from(driftPoints)
        .where(and(eq(driftPoints.ovenId, ovenId), eq(driftPoints.metric, metric), ...(range.from ? [gte(driftPoints.at, range.from)] : []), ...(range.to ? [lte(driftPoints.at, range.to)] : [])))
    ).map((d) => [d.runId, d]),
  );
  const all: (TrendPoint & { at: number })[] = rows.map((r) => {
    const d = drift.get(r.runId);
    return {
      runId: r.runId,
      at: r.at.getTime(),
      runAt: r.at.toISOString(),
      value: r.value as number,
      ewma: d?.ewma ?? null,
      ewmaUcl: d?.ewmaUcl ?? null,
      ewmaLcl: d?.ewmaLcl ?? null,
      cusumHigh: d?.cusumHigh ?? null,
      cusumLow: d?.cusumLow ?? null,
      signals: d?.signals ?? [],
    };
  });
  // Keep every point that carries a signal; thin the rest to what a chart can show.
  const points = all.length > 1000 ? mergeSignals(downsampleForChart(all, 1000), all) : all;

  const stored = await getDriftState(db, ovenId, metric);
  const [lastRun] = await db.select({ window: runs.windowValues }).from(runs).where(and(eq(runs.ovenId, ovenId), isNull(runs.deletedAt))).orderBy(desc(runs.runAt)).limit(1);
  const info = METRIC_INFO[metric];
  const windowLimit = lastRun ? info.limit(lastRun.window as ProcessWindow) : null;
  let projection: TrendResponse["projection"] = null;
  if (windowLimit && stored?.state?.history.length) {
    const p = projectCrossing({ points: stored.state.history, limit: windowLimit.value, direction: windowLimit.direction, now: now.getTime() });
    // A crossing decades away is no crossing at all (and past what a date can hold).
    const far = p?.daysToLimit != null && p.daysToLimit > 3650;
    if (p) projection = { slopePerDay: p.slopePerDay, limit: p.limit, crossesAt: p.crossesAt && !far ? new Date(p.crossesAt).toISOString() : null, daysToLimit: far ? null : p.daysToLimit };
  }
  const b = stored?.baseline;
  const changeRows = await db.select().from(changes).where(eq(changes.ovenId, ovenId)).orderBy(asc(changes.at));
  const orders = await db
    .select({ id: workOrders.id, number: workOrders.number, at: workOrders.completedAt, title: workOrders.title })
    .from(workOrders)
    .where(and(eq(workOrders.ovenId, ovenId), eq(workOrders.state, "done"), isNotNull(workOrders.completedAt), ...(range.from ? [gte(workOrders.completedAt, range.from)] : [])))
    .orderBy(asc(workOrders.completedAt));
  return {
    metric,
    label: info.label,
    unit: info.unit,
    baseline: b ? { mean: b.mean, sigma: b.sigma, n: b.n, fromRunId: Number(b.fromRunId), toRunId: Number(b.toRunId), ucl: b.mean + 3 * b.sigma, lcl: b.mean - 3 * b.sigma, provisional: b.provisional } : null,
    points: points.map(({ at: _at, ...p }) => p),
    totalPoints: all.length,
    windowLimit,
    projection,
    changes: changeRows.map((c) => ({ id: c.id, at: c.at.toISOString(), area: c.area, summary: c.summary })),
    workOrders: orders.map((o) => ({ id: o.id, number: o.number, at: o.at!.toISOString(), title: o.title })),
  };
}

function mergeSignals<T extends { runId: number; at: number; signals: string[] }>(thinned: T[], all: T[]): T[] {
  const ids = new Set(thinned.map((p) => p.runId));
  const extra = all.filter((p) => p.signals.length && !ids.has(p.runId));
  return [...thinned, ...extra].sort((a, b) => a.at - b.at || a.runId - b.runId);
}
