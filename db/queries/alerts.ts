import "server-only";
import { and, desc, eq, isNull, isNotNull, type SQL } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { alerts } from "../schema/drift";
import { ovens } from "../schema/fleet";
import { users } from "../schema/users";
import { recordAudit } from "./audit";
import { createWorkOrder } from "./work-orders";
import type { Actor } from "@/lib/actor";
import { AppError, notFound } from "@/lib/errors";

export async function listAlerts(db: DbOrTx, f: { ovenId?: number; status?: "open" | "acknowledged" | "all"; limit?: number } = {}) {
  const where: SQL[] = [];
  if (f.ovenId) where.push(eq(alerts.ovenId, f.ovenId));
  if ((f.status ?? "open") === "open") where.push(isNull(alerts.acknowledgedAt));
  if (f.status === "acknowledged") where.push(isNotNull(alerts.acknowledgedAt));
  return db
    .select({ alert: alerts, oven: { id: ovens.id, tag: ovens.tag, name: ovens.name }, by: { name: users.name, email: users.email } })
    .from(alerts)
    .innerJoin(ovens, eq(ovens.id, alerts.ovenId))
    .leftJoin(users, eq(users.id, alerts.acknowledgedBy))
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(alerts.raisedAt), desc(alerts.id))
    .limit(f.limit ?? 200);
}
export type AlertListRow = Awaited<ReturnType<typeof listAlerts>>[number];

export function alertJson(r: AlertListRow) {
  const a = r.alert;
  return {
    id: a.id,
    ovenId: a.ovenId,
    ovenTag: r.oven.tag,
    fromState: a.fromState,
    toState: a.toState,
    reasons: a.reasons,
    runId: a.runId,
    raisedAt: a.raisedAt.toISOString(),
    acknowledgedAt: a.acknowledgedAt?.toISOString() ?? null,
    acknowledgedBy: r.by?.name ?? r.by?.email ?? null,
    note: a.note,
    workOrderId: a.workOrderId,
  };
}
export type AlertJson = ReturnType<typeof alertJson>;

/** Acknowledges an alert with a note; optionally opens a drift-investigation work order for it. */
export async function acknowledgeAlert(db: Db, id: number, input: { note: string; openWorkOrder?: boolean }, actor: Actor) {
  const updated = await db.transaction(async (tx) => {
    const [before] = await tx.select().from(alerts).where(eq(alerts.id, id));
    if (!before) throw notFound("That alert");
    if (before.acknowledgedAt) throw new AppError("conflict", "This alert was already acknowledged.", { current: before });
    const [after] = await tx.update(alerts).set({ acknowledgedAt: new Date(), acknowledgedBy: actor.userId, note: input.note }).where(and(eq(alerts.id, id), isNull(alerts.acknowledgedAt))).returning();
    if (!after) throw new AppError("conflict", "This alert was acknowledged by someone else a moment ago.");
    await recordAudit(tx, { actor, action: "alert.acknowledge", entity: "alert", entityId: id, before, after });
    return after;
  });
  if (!input.openWorkOrder) return { alert: updated, workOrderId: null };
  const wo = await createWorkOrder(db, { ovenId: updated.ovenId, title: `Drift investigation: ${updated.reasons[0] ?? "health worsened"}`.slice(0, 200), kind: "drift_investigation", priority: updated.toState === "act" ? "high" : "normal", notes: `${input.note}\n\nFrom alert #${id}: ${updated.reasons.join(" ")}`, breakdown: false }, actor);
  await db.update(alerts).set({ workOrderId: wo.id }).where(eq(alerts.id, id));
  return { alert: updated, workOrderId: wo.id };
}
