import "server-only";
import { and, asc, desc, eq, gte, inArray, isNull, lt, sql } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { runs } from "../schema/runs";
import { workOrders } from "../schema/maintenance";
import { alerts, ovenHealth } from "../schema/drift";
import type { HealthState } from "@/lib/drift/health-state";

const RANK: Record<HealthState, number> = { down: 0, act: 1, watch: 2, steady: 3 };
const OPEN = ["open", "in_progress", "on_hold"] as const;

export type FleetOven = {
  id: number;
  tag: string;
  name: string;
  serviceState: "in_service" | "down" | "retired";
  line: { id: number; name: string };
  site: { id: number; name: string; timeZone: string };
  state: HealthState;
  reasons: string[];
  lastRun: { id: number; runAt: string; verdict: string; windowUse: number | null } | null;
  openAlerts: number;
  openWorkOrders: number;
  overdueWorkOrders: number;
  deltaT: { at: string; value: number }[];
  deltaTLimit: number | null;
};

/**
 * One row per oven for the fleet view, worst state first. Each figure is one indexed look-up per
 * oven (stored health, latest run, last 30 days of ΔT), so the cost follows the fleet's size,
 * not the length of its history.
 */
export async function fleetView(db: DbOrTx, filter: { siteId?: number; lineId?: number }, now: Date): Promise<FleetOven[]> {
  const where = [filter.siteId ? eq(sites.id, filter.siteId) : undefined, filter.lineId ? eq(lines.id, filter.lineId) : undefined].filter(Boolean);
  const base = await db
    .select({ oven: ovens, line: { id: lines.id, name: lines.name }, site: { id: sites.id, name: sites.name, timeZone: sites.timeZone }, health: ovenHealth })
    .from(ovens)
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .leftJoin(ovenHealth, eq(ovenHealth.ovenId, ovens.id))
    .where(where.length ? and(...(where as NonNullable<(typeof where)[number]>[])) : undefined)
    .orderBy(asc(ovens.tag));
  const ids = base.map((b) => b.oven.id);
  if (!ids.length) return [];
  const alertCounts = await db.select({ ovenId: alerts.ovenId, n: sql<number>`count(*)` }).from(alerts).where(and(inArray(alerts.ovenId, ids), isNull(alerts.acknowledgedAt))).groupBy(alerts.ovenId);
  const woCounts = await db
    .select({ ovenId: workOrders.ovenId, open: sql<number>`count(*)`, overdue: sql<number>`sum(case when ${workOrders.dueAt} < ${now.getTime()} then 1 else 0 end)` })
    .from(workOrders)
    .where(and(inArray(workOrders.ovenId, ids), inArray(workOrders.state, [...OPEN])))
    .groupBy(workOrders.ovenId);
  const since = new Date(now.getTime() - 30 * 86_400_000);
  const out: FleetOven[] = [];
  for (const b of base) {
    const [last] = await db
      .select({ id: runs.id, runAt: runs.runAt, verdict: runs.verdictStatus, windowUse: runs.windowUse, window: runs.windowValues })
      .from(runs)
      .where(and(eq(runs.ovenId, b.oven.id), isNull(runs.deletedAt), lt(runs.runAt, new Date(now.getTime() + 60_000))))
      .orderBy(desc(runs.runAt))
      .limit(1);
    const spark = await db
      .select({ at: runs.runAt, value: runs.deltaTPeak })
      .from(runs)
      .where(and(eq(runs.ovenId, b.oven.id), isNull(runs.deletedAt), gte(runs.runAt, since)))
      .orderBy(asc(runs.runAt));
    const a = alertCounts.find((x) => x.ovenId === b.oven.id);
    const w = woCounts.find((x) => x.ovenId === b.oven.id);
    out.push({
      id: b.oven.id,
      tag: b.oven.tag,
      name: b.oven.name,
      serviceState: b.oven.serviceState,
      line: b.line,
      site: b.site,
      state: (b.health?.state as HealthState | undefined) ?? (b.oven.serviceState === "down" ? "down" : "steady"),
      reasons: b.health?.reasons ?? ["Health has not been worked out yet."],
      lastRun: last ? { id: last.id, runAt: last.runAt.toISOString(), verdict: last.verdict, windowUse: last.windowUse } : null,
      openAlerts: Number(a?.n ?? 0),
      openWorkOrders: Number(w?.open ?? 0),
      overdueWorkOrders: Number(w?.overdue ?? 0),
      deltaT: spark.map((s) => ({ at: s.at.toISOString(), value: s.value })),
      deltaTLimit: last ? ((last.window as { deltaTMax?: number }).deltaTMax ?? null) : null,
    });
  }
  return out.sort((x, y) => RANK[x.state] - RANK[y.state] || x.tag.localeCompare(y.tag));
}
