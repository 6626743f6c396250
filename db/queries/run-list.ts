import "server-only";
import { and, asc, desc, eq, gte, isNull, lt, sql, type SQL } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { ovens } from "../schema/fleet";
import { instruments } from "../schema/instruments";
import { runs } from "../schema/runs";
import { processWindows } from "../schema/windows";
import type { RunListQuery } from "@/lib/validation/runs";

const SORT_COLUMNS = {
  runAt: runs.runAt,
  deltaTPeak: runs.deltaTPeak,
  windowUse: runs.windowUse,
  peakMin: runs.peakMin,
  criticalSpread: runs.criticalSpread,
  talMin: runs.talMin,
} as const;

export type RunFilter = Omit<RunListQuery, "page" | "pageSize" | "sort">;

function whereOf(f: RunFilter): SQL | undefined {
  const w: SQL[] = [isNull(runs.deletedAt)];
  if (f.ovenId) w.push(eq(runs.ovenId, f.ovenId));
  if (f.windowId) w.push(eq(runs.windowId, f.windowId));
  if (f.instrumentId) w.push(eq(runs.instrumentId, f.instrumentId));
  if (f.boardId) w.push(eq(runs.boardId, f.boardId));
  if (f.verdict) w.push(eq(runs.verdictStatus, f.verdict));
  if (f.calibration) w.push(eq(runs.calibrationStatus, f.calibration));
  if (f.from) w.push(gte(runs.runAt, f.from));
  // A bare date as `to` includes that whole day.
  if (f.to) w.push(lt(runs.runAt, new Date(f.to.getTime() + (f.to.getUTCHours() === 0 && f.to.getUTCMinutes() === 0 ? 86_400_000 : 1))));
  return and(...w);
}

const listColumns = {
  id: runs.id, ovenId: runs.ovenId, ovenTag: ovens.tag, runAt: runs.runAt, verdict: runs.verdictStatus, windowUse: runs.windowUse,
  peakMin: runs.peakMin, peakMax: runs.peakMax, deltaTPeak: runs.deltaTPeak, criticalSpread: runs.criticalSpread,
  talMin: runs.talMin, talMax: runs.talMax, heatUpRate: runs.heatUpRate, timeToPeakMax: runs.timeToPeakMax,
  windowId: runs.windowId, windowName: processWindows.name, instrumentId: runs.instrumentId, instrumentName: instruments.name,
  calibration: runs.calibrationStatus, startState: runs.startState,
};

function baseQuery(db: DbOrTx, where: SQL | undefined) {
  return db
    .select(listColumns)
    .from(runs)
    .innerJoin(ovens, eq(ovens.id, runs.ovenId))
    .leftJoin(processWindows, eq(processWindows.id, runs.windowId))
    .leftJoin(instruments, eq(instruments.id, runs.instrumentId))
    .where(where);
}

function orderOf(sort: RunListQuery["sort"]) {
  const descending = sort.startsWith("-");
  const col = SORT_COLUMNS[(descending ? sort.slice(1) : sort) as keyof typeof SORT_COLUMNS];
  return descending ? [desc(col), desc(runs.id)] : [asc(col), asc(runs.id)];
}

export async function listRuns(db: DbOrTx, q: RunListQuery) {
  const where = whereOf(q);
  const [items, [{ total }]] = await Promise.all([
    baseQuery(db, where).orderBy(...orderOf(q.sort)).limit(q.pageSize).offset((q.page - 1) * q.pageSize),
    db.select({ total: sql<number>`count(*)` }).from(runs).where(where),
  ]);
  return { items, total: Number(total) };
}
export type RunListRow = Awaited<ReturnType<typeof listRuns>>["items"][number];

export function runListItemJson(r: RunListRow) {
  return { ...r, runAt: r.runAt.toISOString() };
}
export type RunListItemJson = ReturnType<typeof runListItemJson>;

export const EXPORT_LIMIT = 50_000;

export async function listRunsForExport(db: DbOrTx, q: RunListQuery) {
  return baseQuery(db, whereOf(q)).orderBy(...orderOf(q.sort)).limit(EXPORT_LIMIT);
}
