import "server-only";
import { and, desc, eq, gte, inArray, lt, sql } from "drizzle-orm";
import { users } from "@/db/schema/users";
import { calibrations, instruments } from "@/db/schema/instruments";
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

// Calibration reminders at 30 and 7 days before an instrument's latest calibration lapses;
// each threshold has its own key, so each is sent once.
MAIL_EVENT_SOURCES.calibration_due.push(async ({ db, now }) => {
  const cals = await db
    .select({ id: calibrations.id, instrumentId: calibrations.instrumentId, dueAt: calibrations.dueAt, performedAt: calibrations.performedAt, name: instruments.name, serial: instruments.serial, retiredAt: instruments.retiredAt })
    .from(calibrations)
    .innerJoin(instruments, eq(instruments.id, calibrations.instrumentId))
    .orderBy(desc(calibrations.performedAt));
  const latest = new Map<number, (typeof cals)[number]>();
  for (const c of cals) if (!latest.has(c.instrumentId)) latest.set(c.instrumentId, c);
  return [...latest.values()]
    .filter((c) => !c.retiredAt)
    .flatMap((c) => {
      const daysLeft = Math.ceil((c.dueAt.getTime() - now.getTime()) / DAY);
      if (daysLeft <= 0 || daysLeft > 30) return [];
      const step = daysLeft <= 7 ? "7d" : "30d";
      return [{
        key: `calibration:${c.id}:${step}`,
        audience: "subscribers" as const,
        props: { instrument: c.name, serial: c.serial, dueLabel: c.dueAt.toISOString().slice(0, 10), daysLeft, instrumentUrl: `${appUrl()}/instruments/${c.instrumentId}` },
      }];
    });
});

// Overdue work: each assignee once a day; after a two-day grace, the managers too.
MAIL_EVENT_SOURCES.overdue_work.push(async ({ db, now }) => {
  const rows = await db
    .select({ order: workOrders, tag: ovens.tag, assignee: users.name, assigneeEmail: users.email })
    .from(workOrders)
    .innerJoin(ovens, eq(ovens.id, workOrders.ovenId))
    .leftJoin(users, eq(users.id, workOrders.assigneeId))
    .where(and(inArray(workOrders.state, ["open", "in_progress", "on_hold"]), lt(workOrders.dueAt, now)));
  const day = now.toISOString().slice(0, 10);
  const item = (r: (typeof rows)[number]) => ({
    ovenTag: r.tag,
    title: r.order.title,
    dueLabel: r.order.dueAt!.toISOString().slice(0, 10),
    overdueBy: `${Math.max(1, Math.floor((now.getTime() - r.order.dueAt!.getTime()) / DAY))} d`,
    assignee: r.assignee ?? r.assigneeEmail ?? "nobody",
    url: `${appUrl()}/work-orders/${r.order.id}`,
  });
  const byAssignee = new Map<string, typeof rows>();
  for (const r of rows) if (r.order.assigneeId) byAssignee.set(r.order.assigneeId, [...(byAssignee.get(r.order.assigneeId) ?? []), r]);
  type Ev = { key: string; audience: readonly string[]; props: { as: "assignee" | "manager"; orders: ReturnType<typeof item>[]; workOrdersUrl: string } };
  const events: Ev[] = [...byAssignee.entries()].map(([userId, list]) => ({ key: `overdue:${userId}:${day}`, audience: [userId], props: { as: "assignee", orders: list.map(item), workOrdersUrl: `${appUrl()}/my-work` } }));
  const late = rows.filter((r) => now.getTime() - r.order.dueAt!.getTime() > 2 * DAY);
  const managers = (await db.select({ id: users.id }).from(users).where(and(eq(users.role, "manager"), eq(users.active, true)))).map((m) => m.id);
  if (late.length && managers.length) events.push({ key: `overdue-team:${day}`, audience: managers, props: { as: "manager", orders: late.slice(0, 50).map(item), workOrdersUrl: `${appUrl()}/work-orders?overdue=true` } });
  return events;
});
