import "server-only";
import { and, asc, eq, isNull, gt } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { runs } from "../schema/runs";
import { changes } from "../schema/changes";
import { driftBaselines, driftPoints, driftSettings, driftStates } from "../schema/drift";
import { selectBaseline, runsAfterBaseline, type BaselineStats } from "@/lib/drift/baseline";
import { computeDriftSeries } from "@/lib/drift/drift-series";
import { stepDrift } from "@/lib/drift/drift-state";
import { DEFAULT_DRIFT_PARAMS, type DriftParams, type DriftState } from "@/lib/drift/drift-types";
import { TRACKED_METRICS, type TrackedMetric } from "@/lib/tracked-metrics";

type StoredBaseline = BaselineStats;

/** The oven's detector settings (EWMA λ and L, CUSUM k and h in σ), or the defaults. */
export async function driftParams(db: DbOrTx, ovenId: number): Promise<DriftParams> {
  const [row] = await db.select().from(driftSettings).where(eq(driftSettings.ovenId, ovenId));
  return row ? { lambda: row.lambda, L: row.L, cusumK: row.cusumK, cusumH: row.cusumH } : { ...DEFAULT_DRIFT_PARAMS };
}

/** The metric's values over the oven's live runs, oldest first (runs where it is undefined are left out). */
export async function metricSeries(db: DbOrTx, ovenId: number, metric: TrackedMetric) {
  const col = runs[metric];
  const rows = await db
    .select({ runId: runs.id, at: runs.runAt, value: col })
    .from(runs)
    .where(and(eq(runs.ovenId, ovenId), isNull(runs.deletedAt)))
    .orderBy(asc(runs.runAt), asc(runs.id));
  return rows.filter((r): r is { runId: number; at: Date; value: number } => r.value !== null && Number.isFinite(r.value)).map((r) => ({ runId: r.runId, at: r.at.getTime(), value: r.value }));
}

async function changeMarkers(db: DbOrTx, ovenId: number) {
  const rows = await db.select({ at: changes.at }).from(changes).where(eq(changes.ovenId, ovenId)).orderBy(asc(changes.at));
  return rows.map((r) => ({ at: r.at.getTime() }));
}

/**
 * Rebuilds one oven+metric from its whole history: baseline, every drift point and the stored
 * state. Used when a baseline or a past run changes, and by the seed; new runs take one step.
 */
export async function recomputeDrift(tx: DbOrTx, ovenId: number, metric: TrackedMetric) {
  const series = await metricSeries(tx, ovenId, metric);
  const [manual] = await tx.select().from(driftBaselines).where(and(eq(driftBaselines.ovenId, ovenId), eq(driftBaselines.metric, metric)));
  // An engineer's range whose runs were since deleted no longer exists; the default applies again.
  const ids = new Set(series.map((r) => r.runId));
  const range = manual && ids.has(manual.fromRunId) && ids.has(manual.toRunId) ? { range: { fromRunId: manual.fromRunId, toRunId: manual.toRunId } } : {};
  const baseline = selectBaseline(series, await changeMarkers(tx, ovenId), range);
  await tx.delete(driftPoints).where(and(eq(driftPoints.ovenId, ovenId), eq(driftPoints.metric, metric)));
  if (!baseline) {
    await tx.delete(driftStates).where(and(eq(driftStates.ovenId, ovenId), eq(driftStates.metric, metric)));
    return null;
  }
  const monitored = runsAfterBaseline(series, baseline);
  const { state, points } = computeDriftSeries(baseline, monitored, await driftParams(tx, ovenId));
  const rows = points.map((p) => ({ runId: Number(p.runId), metric, ovenId, at: new Date(p.at), value: p.value, ewma: p.ewma, ewmaUcl: p.ewmaUcl, ewmaLcl: p.ewmaLcl, cusumHigh: p.cusumHigh, cusumLow: p.cusumLow, signals: p.signals }));
  for (let i = 0; i < rows.length; i += 200) await tx.insert(driftPoints).values(rows.slice(i, i + 200));
  const last = series[series.length - 1];
  await tx
    .insert(driftStates)
    .values({ ovenId, metric, baseline, state, lastRunId: last.runId, lastRunAt: new Date(last.at), updatedAt: new Date() })
    .onConflictDoUpdate({ target: [driftStates.ovenId, driftStates.metric], set: { baseline, state, lastRunId: last.runId, lastRunAt: new Date(last.at), updatedAt: new Date() } });
  return { baseline, state };
}

/**
 * Takes one incremental step per tracked metric for a newly saved run. Falls back to a rebuild
 * when there is no stored state yet, the baseline is still filling up, or the run is not the
 * newest (a back-dated upload).
 */
export async function applyRunToDrift(tx: DbOrTx, run: { id: number; ovenId: number; runAt: Date } & Partial<Record<TrackedMetric, number | null>>) {
  // The same for every metric: is the run the oven's newest, and the oven's detector settings.
  const later = await tx
    .select({ id: runs.id })
    .from(runs)
    .where(and(eq(runs.ovenId, run.ovenId), isNull(runs.deletedAt), gt(runs.runAt, run.runAt)))
    .limit(1);
  const params = await driftParams(tx, run.ovenId);
  const states = new Map((await tx.select().from(driftStates).where(eq(driftStates.ovenId, run.ovenId))).map((s) => [s.metric, s]));
  for (const metric of TRACKED_METRICS) {
    const value = run[metric];
    const stored = states.get(metric);
    const baseline = stored?.baseline as StoredBaseline | undefined;
    const canStep = stored?.state && baseline && !baseline.provisional && later.length === 0 && value != null && Number.isFinite(value);
    if (!canStep) {
      await recomputeDrift(tx, run.ovenId, metric);
      continue;
    }
    const { state, pointResult: p } = stepDrift(stored.state as DriftState, { value: value!, at: run.runAt.getTime(), runId: run.id }, params);
    await tx.insert(driftPoints).values({ runId: run.id, metric, ovenId: run.ovenId, at: run.runAt, value: p.value, ewma: p.ewma, ewmaUcl: p.ewmaUcl, ewmaLcl: p.ewmaLcl, cusumHigh: p.cusumHigh, cusumLow: p.cusumLow, signals: p.signals });
    await tx.update(driftStates).set({ state, lastRunId: run.id, lastRunAt: run.runAt, updatedAt: new Date() }).where(and(eq(driftStates.ovenId, run.ovenId), eq(driftStates.metric, metric)));
  }
}

export async function recomputeOven(tx: DbOrTx, ovenId: number) {
  for (const metric of TRACKED_METRICS) await recomputeDrift(tx, ovenId, metric);
}

export async function getDriftState(db: DbOrTx, ovenId: number, metric: TrackedMetric) {
  const [row] = await db.select().from(driftStates).where(and(eq(driftStates.ovenId, ovenId), eq(driftStates.metric, metric)));
  return row ? { baseline: row.baseline as StoredBaseline, state: row.state as DriftState | null, lastRunAt: row.lastRunAt } : null;
}
