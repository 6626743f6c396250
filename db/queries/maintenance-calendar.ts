import "server-only";
import { and, gte, lt } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { workOrders } from "../schema/maintenance";
import { listPlans } from "./plans";
import { forecastCalendar } from "@/lib/maintenance/calendar";

/** Days of the site's calendar in [from, to): orders that exist and occurrences still to come. */
export async function loadCalendar(db: DbOrTx, { from, to, now, timeZone, ovenId }: { from: Date; to: Date; now: Date; timeZone: string; ovenId?: number }) {
  const [plans, orders] = await Promise.all([
    listPlans(db, { ovenId }),
    db.select().from(workOrders).where(and(gte(workOrders.dueAt, from), lt(workOrders.dueAt, to))),
  ]);
  const mine = ovenId ? orders.filter((o) => o.ovenId === ovenId) : orders;
  const tags = new Map(plans.map((p) => [String(p.plan.ovenId), p.ovenTag]));
  const days = forecastCalendar({
    plans: plans
      .filter((p) => p.plan.active && p.plan.rrule && p.plan.dtstartLocal)
      .map((p) => ({ id: String(p.plan.id), title: p.plan.title, ovenId: String(p.plan.ovenId), rrule: p.plan.rrule!, dtstartLocal: p.plan.dtstartLocal!, timeZone: p.timeZone, lookAheadDays: p.plan.lookAheadDays, createdAt: p.plan.createdAt })),
    existingOrders: mine.map((o) => ({ id: String(o.id), title: o.title, dueAt: o.dueAt!, state: o.state, planId: o.planId ? String(o.planId) : null, occurrenceKey: o.occurrenceKey, ovenId: String(o.ovenId) })),
    from,
    to,
    now,
    timeZone,
  });
  return { days, tags };
}
