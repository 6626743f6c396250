import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { workOrders } from "../schema/maintenance";
import { alerts, ovenHealth } from "../schema/drift";
import type { HealthState } from "@/lib/drift/health-state";
import { runSummaries } from "./run-summary";

const RANK: Record<HealthState, number> = { down: 0, act: 1, watch: 2, steady: 3 };
const OPEN = ["open", "in_progress", "on_hold"] as const;
/** localeCompare's order, with one collator: localeCompare made one per call (7 ms per 200 ovens). */
const TAGS = new Intl.Collator();

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
 * One row per oven for the fleet view, worst state first. Four statements whatever the fleet's
 * size or history: the ovens with their stored health and run summary (latest run, 30 days of
 * ΔT; see run-summary.ts), and the open alerts and unfinished orders counted per oven. Reading
 * each oven's runs here, one statement per oven, was most of the time on a 200-oven plant.
 */
export async function fleetView(db: DbOrTx, filter: { siteId?: number; lineId?: number }, now: Date): Promise<FleetOven[]> {
  const where = [filter.siteId ? eq(sites.id, filter.siteId) : undefined, filter.lineId ? eq(lines.id, filter.lineId) : undefined].filter(Boolean);
  const base = await db
    .select({
      oven: { id: ovens.id, tag: ovens.tag, name: ovens.name, serviceState: ovens.serviceState },
      line: { id: lines.id, name: lines.name },
      site: { id: sites.id, name: sites.name, timeZone: sites.timeZone },
      health: { state: ovenHealth.state, reasons: ovenHealth.reasons, runSummary: ovenHealth.runSummary },
    })
    .from(ovens)
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .leftJoin(ovenHealth, eq(ovenHealth.ovenId, ovens.id))
    .where(where.length ? and(...(where as NonNullable<(typeof where)[number]>[])) : undefined)
    .orderBy(asc(ovens.tag));
  const ids = base.map((b) => b.oven.id);
  if (!ids.length) return [];
  // An oven whose health was last refreshed before run summaries were stored: work it out now.
  const computed = await runSummaries(db, base.filter((b) => !b.health?.runSummary).map((b) => b.oven.id), now);
  const alertCounts = new Map(
    (await db.select({ ovenId: alerts.ovenId, n: sql<number>`count(*)` }).from(alerts).where(and(inArray(alerts.ovenId, ids), isNull(alerts.acknowledgedAt))).groupBy(alerts.ovenId)).map((a) => [a.ovenId, Number(a.n)]),
  );
  // Unfinished orders are few beside the history; counting them all (on the state index) and
  // picking the fleet's ovens here is cheaper than an oven-by-oven walk of every order.
  const woCounts = new Map(
    (
      await db
        .select({ ovenId: workOrders.ovenId, open: sql<number>`count(*)`, overdue: sql<number>`sum(case when ${workOrders.dueAt} < ${now.getTime()} then 1 else 0 end)` })
        .from(workOrders)
        .where(inArray(workOrders.state, [...OPEN]))
        .groupBy(workOrders.ovenId)
    ).map((w) => [w.ovenId, w]),
  );
  // ISO times of one format compare as strings.
  const since = new Date(now.getTime() - 30 * 86_400_000).toISOString();
  const out: FleetOven[] = base.map((b) => {
    const summary = b.health?.runSummary ?? computed.get(b.oven.id)!;
    const last = summary.lastRun;
    const w = woCounts.get(b.oven.id);
    return {
      id: b.oven.id,
      tag: b.oven.tag,
      name: b.oven.name,
      serviceState: b.oven.serviceState,
      line: b.line,
      site: b.site,
      state: (b.health?.state as HealthState | undefined) ?? (b.oven.serviceState === "down" ? "down" : "steady"),
      reasons: b.health?.reasons ?? ["Health has not been worked out yet."],
      lastRun: last ? { id: last.id, runAt: last.runAt, verdict: last.verdict, windowUse: last.windowUse } : null,
      openAlerts: alertCounts.get(b.oven.id) ?? 0,
      openWorkOrders: Number(w?.open ?? 0),
      overdueWorkOrders: Number(w?.overdue ?? 0),
      deltaT: summary.deltaT.filter((p) => p.at >= since),
      deltaTLimit: last ? last.deltaTMax : null,
    };
  });
  return out.sort((x, y) => RANK[x.state] - RANK[y.state] || TAGS.compare(x.tag, y.tag));
}
