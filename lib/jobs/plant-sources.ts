import "server-only";
import { and, eq, gte, inArray, lt, sql } from "drizzle-orm";
import { ovens } from "@/db/schema/fleet";
import { runs } from "@/db/schema/runs";
import { workOrders } from "@/db/schema/maintenance";
import { alerts } from "@/db/schema/drift";
import { generateWorkOrders } from "@/db/queries/work-order-generation";
import { listMyWork } from "@/db/queries/work-orders";
import { maintenanceKpis } from "@/db/queries/maintenance-kpis";
import { appUrl } from "@/lib/env";
import { formatDateTime } from "@/lib/format";
import { FLEET_DIGEST_SECTIONS, MAIL_EVENT_SOURCES, MY_WORK_SOURCE } from "./mail-sources";
import { TICK_STEPS } from "./tick-steps";

// Connects the plant's data to the scheduler: maintenance generation on every tick, and the
// work orders, runs and alerts that the digests and alert e-mails report.
const DAY = 86_400_000;

TICK_STEPS.push({ name: "maintenance-generation", run: async ({ db, now }) => (await generateWorkOrders(db, { now, actor: null })).created });

MY_WORK_SOURCE.load = async ({ db, now, recipient }) => {
  const rows = await listMyWork(db, recipient.id, now, 1);
  return rows.map((r) => ({
    ovenTag: r.ovenTag,
    title: r.order.title,
    dueLabel: r.order.dueAt ? formatDateTime(r.order.dueAt, r.timeZone) : "no due date",
    overdue: Boolean(r.order.dueAt && r.order.dueAt < now),
    url: `${appUrl()}/work-orders/${r.order.id}`,
  }));
};

FLEET_DIGEST_SECTIONS.runsOutOfWindow = async ({ db, now }) => {
  const rows = await db
    .select({ tag: ovens.tag, n: sql<number>`count(*)` })
    .from(runs)
    .innerJoin(ovens, eq(ovens.id, runs.ovenId))
    .where(and(eq(runs.verdictStatus, "fail"), gte(runs.runAt, new Date(now.getTime() - 7 * DAY)), sql`${runs.deletedAt} is null`))
    .groupBy(ovens.tag);
  return { tracked: true, items: rows.map((r) => ({ label: r.tag, value: Number(r.n) })) };
};

FLEET_DIGEST_SECTIONS.overdueWork = async ({ db, now }) => {
  const rows = await db
    .select({ tag: ovens.tag, n: sql<number>`count(*)` })
    .from(workOrders)
    .innerJoin(ovens, eq(ovens.id, workOrders.ovenId))
    .where(and(inArray(workOrders.state, ["open", "in_progress", "on_hold"]), lt(workOrders.dueAt, now)))
    .groupBy(ovens.tag);
  return { tracked: true, items: rows.map((r) => ({ label: r.tag, value: Number(r.n) })) };
};

FLEET_DIGEST_SECTIONS.pmCompliance = async ({ db, now }) => {
  const k = (await maintenanceKpis(db, { from: new Date(now.getTime() - 28 * DAY), to: now, now })).fleet.pmCompliance;
  return { tracked: true, percent: k.value === null ? null : k.value * 100, doneOnTime: k.doneOnTime, due: k.due };
};

// An alert raised in the last two days becomes one drift-alert e-mail per subscriber (the key is
// the alert, so a later tick never sends it again).
MAIL_EVENT_SOURCES.drift_alert.push(async ({ db, now }) => {
  const rows = await db
    .select({ alert: alerts, oven: { tag: ovens.tag, name: ovens.name } })
    .from(alerts)
    .innerJoin(ovens, eq(ovens.id, alerts.ovenId))
    .where(and(gte(alerts.raisedAt, new Date(now.getTime() - 2 * DAY)), inArray(alerts.toState, ["watch", "act"])));
  return rows.map(({ alert: a, oven }) => ({
    key: `alert:${a.id}`,
    audience: "subscribers" as const,
    props: {
      ovenTag: oven.tag,
      ovenName: oven.name,
      health: a.toState as "watch" | "act",
      metric: a.reasons[0]?.split(/[:;]/)[0] ?? "health",
      reason: a.reasons[0] ?? "Health worsened.",
      details: a.reasons.slice(1).join(" "),
      detectedLabel: a.raisedAt.toISOString().slice(0, 16).replace("T", " ") + " UTC",
      alertUrl: `${appUrl()}/alerts?ovenId=${a.ovenId}`,
    },
  }));
});
