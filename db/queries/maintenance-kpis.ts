import "server-only";
import { eq } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { workOrders } from "../schema/maintenance";
import { fleetKpis, type KpiOrder } from "@/lib/maintenance/kpis";

/** Every order in KPI form (a plant has thousands, not millions), with the ovens in service. */
export async function loadKpiInput(db: DbOrTx) {
  const [orders, ovenRows] = await Promise.all([
    db
      .select({
        id: workOrders.id, ovenId: workOrders.ovenId, kind: workOrders.kind, state: workOrders.state, createdAt: workOrders.createdAt,
        dueAt: workOrders.dueAt, completedAt: workOrders.completedAt, breakdown: workOrders.breakdown,
        failureStartedAt: workOrders.failureStartedAt, downtimeMinutes: workOrders.downtimeMinutes,
      })
      .from(workOrders),
    db
      .select({ id: ovens.id, tag: ovens.tag, state: ovens.serviceState, timeZone: sites.timeZone })
      .from(ovens)
      .innerJoin(lines, eq(lines.id, ovens.lineId))
      .innerJoin(sites, eq(sites.id, lines.siteId)),
  ]);
  const kpiOrders: KpiOrder[] = orders.map((o) => ({ ...o, id: String(o.id), ovenId: String(o.ovenId) }));
  return { orders: kpiOrders, ovens: ovenRows.filter((o) => o.state !== "retired") };
}

/** Preventive orders due in [from, min(to, now)): how many were done late or are still not done. */
export function pmBreakdown(orders: readonly KpiOrder[], from: Date, to: Date, now: Date) {
  const until = Math.min(to.getTime(), now.getTime());
  const due = orders.filter((o) => o.kind === "preventive" && o.state !== "cancelled" && o.dueAt && o.dueAt.getTime() >= from.getTime() && o.dueAt.getTime() < until);
  const doneLate = due.filter((o) => o.state === "done" && o.completedAt && o.completedAt > o.dueAt!).length;
  const notDone = due.filter((o) => o.state !== "done").length;
  return { doneLate, notDone };
}

export async function maintenanceKpis(db: DbOrTx, period: { from: Date; to: Date; now: Date }) {
  const input = await loadKpiInput(db);
  const result = fleetKpis({ ...period, ovens: input.ovens.map((o) => ({ ovenId: String(o.id) })), orders: input.orders });
  const perOven = result.perOven.map((k) => {
    const oven = input.ovens.find((o) => String(o.id) === k.ovenId)!;
    return { ...k, tag: oven.tag, ...pmBreakdown(input.orders.filter((o) => o.ovenId === k.ovenId), period.from, period.to, period.now) };
  });
  return { fleet: { ...result.fleet, ...pmBreakdown(input.orders, period.from, period.to, period.now) }, perOven, timeZone: input.ovens[0]?.timeZone ?? "UTC" };
}
