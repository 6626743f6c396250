import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { maintenancePlans, workOrders, type PlanRow } from "../schema/maintenance";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, notFound } from "@/lib/errors";
import { validateRecurrence } from "@/lib/maintenance/recurrence";
import { regenerateAfterPlanEdit } from "@/lib/maintenance/generation";
import { insertOrdersIdempotent, pendingNumber } from "./work-order-generation";
import type { PlanCreateInput, PlanUpdateInput } from "@/lib/validation/maintenance";

export async function listPlans(db: DbOrTx, { ovenId }: { ovenId?: number } = {}) {
  return db
    .select({ plan: maintenancePlans, ovenTag: ovens.tag, timeZone: sites.timeZone })
    .from(maintenancePlans)
    .innerJoin(ovens, eq(ovens.id, maintenancePlans.ovenId))
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .where(ovenId ? eq(maintenancePlans.ovenId, ovenId) : undefined)
    .orderBy(asc(ovens.tag), asc(maintenancePlans.title));
}
export type PlanListRow = Awaited<ReturnType<typeof listPlans>>[number];

export function planJson(p: PlanRow) {
  return {
    id: p.id,
    ovenId: p.ovenId,
    groupKey: p.groupKey,
    title: p.title,
    kind: p.kind,
    instructions: p.instructions,
    checklist: p.checklist,
    estimatedMinutes: p.estimatedMinutes,
    assigneeId: p.assigneeId,
    assigneeRole: p.assigneeRole,
    safetyLockout: p.safetyLockout,
    rrule: p.rrule,
    dtstart: p.dtstartLocal,
    everyRuns: p.everyRuns,
    everyHeaterHours: p.everyHeaterHours,
    lookAheadDays: p.lookAheadDays,
    active: p.active,
    version: p.version,
    createdAt: p.createdAt.toISOString(),
  };
}

async function zonesFor(db: DbOrTx, ovenIds: number[]) {
  const rows = await db
    .select({ id: ovens.id, timeZone: sites.timeZone })
    .from(ovens)
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .where(inArray(ovens.id, ovenIds));
  return new Map(rows.map((r) => [r.id, r.timeZone]));
}

/** One plan per oven (copies sharing a group key); the rule is checked in each oven's zone. */
export async function createPlans(db: Db, input: PlanCreateInput, actor: Actor, now = new Date()) {
  const zones = await zonesFor(db, input.ovenIds);
  const missing = input.ovenIds.filter((id) => !zones.has(id));
  if (missing.length) throw new AppError("invalid_input", `ovenIds: no oven has id ${missing.join(", ")}.`, { fields: { ovenIds: "no oven has that id" } });
  if (input.rrule) {
    for (const tz of new Set(zones.values())) {
      const problem = validateRecurrence({ rrule: input.rrule, dtstartLocal: input.dtstart!, timeZone: tz });
      if (problem) throw new AppError("invalid_input", `rrule: ${problem}`, { fields: { rrule: problem } });
    }
  }
  const groupKey = input.ovenIds.length > 1 ? crypto.randomUUID() : null;
  return db.transaction(async (tx) => {
    const rows = await tx
      .insert(maintenancePlans)
      .values(
        [...new Set(input.ovenIds)].map((ovenId) => ({
          ovenId,
          groupKey,
          title: input.title,
          instructions: input.instructions,
          kind: input.kind,
          checklist: input.checklist,
          estimatedMinutes: input.estimatedMinutes ?? null,
          assigneeId: input.assigneeId ?? null,
          assigneeRole: input.assigneeRole ?? null,
          safetyLockout: input.safetyLockout,
          rrule: input.rrule ?? null,
          dtstartLocal: input.dtstart ?? null,
          everyRuns: input.everyRuns ?? null,
          everyHeaterHours: input.everyHeaterHours ?? null,
          lookAheadDays: input.lookAheadDays,
          createdAt: now,
          updatedAt: now,
        })),
      )
      .returning();
    for (const p of rows) await recordAudit(tx, { actor, action: "plan.create", entity: "maintenance_plan", entityId: p.id, after: p });
    return rows;
  });
}

export async function getPlan(db: DbOrTx, id: number) {
  const [row] = await db
    .select({ plan: maintenancePlans, ovenTag: ovens.tag, timeZone: sites.timeZone })
    .from(maintenancePlans)
    .innerJoin(ovens, eq(ovens.id, maintenancePlans.ovenId))
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .where(eq(maintenancePlans.id, id))
    .limit(1);
  return row ?? null;
}

/**
 * Edits a plan (optimistic on its version). A changed rule or start replaces only future,
 * open, untouched orders — regenerateAfterPlanEdit decides which.
 */
export async function updatePlan(db: Db, id: number, patch: PlanUpdateInput, actor: Actor, now = new Date()) {
  const found = await getPlan(db, id);
  if (!found) throw notFound("That plan");
  const before = found.plan;
  if (before.version !== patch.version) {
    throw new AppError("conflict", `Someone else changed this plan (now version ${before.version}). Reload, then try again.`, { current: planJson(before) });
  }
  const next = { ...before, ...patch, dtstartLocal: patch.dtstart ?? before.dtstartLocal };
  if (next.rrule && next.dtstartLocal) {
    const problem = validateRecurrence({ rrule: next.rrule, dtstartLocal: next.dtstartLocal, timeZone: found.timeZone });
    if (problem) throw new AppError("invalid_input", `rrule: ${problem}`, { fields: { rrule: problem } });
  }
  return db.transaction(async (tx) => {
    const { version, dtstart, ...fields } = patch;
    void dtstart;
    const [after] = await tx
      .update(maintenancePlans)
      .set({ ...fields, dtstartLocal: next.dtstartLocal, version: version + 1, updatedAt: now })
      .where(and(eq(maintenancePlans.id, id), eq(maintenancePlans.version, version)))
      .returning();
    if (!after) throw new AppError("conflict", "Someone else changed this plan a moment ago. Reload, then try again.");
    const ruleChanged = after.rrule !== before.rrule || after.dtstartLocal !== before.dtstartLocal;
    if (ruleChanged && after.rrule && after.dtstartLocal) {
      const old = await tx.select().from(workOrders).where(eq(workOrders.planId, id));
      const regen = regenerateAfterPlanEdit({
        oldOrders: old.map((o) => ({ occurrenceKey: o.occurrenceKey!, dueAt: o.dueAt!, state: o.state, touched: o.touched })),
        newPlan: { id: String(id), rrule: after.rrule, dtstartLocal: after.dtstartLocal, timeZone: found.timeZone, lookAheadDays: after.lookAheadDays, createdAt: after.createdAt },
        now,
      });
      if (regen.cancelKeys.length) {
        await tx.update(workOrders).set({ state: "cancelled", updatedAt: now }).where(and(eq(workOrders.planId, id), inArray(workOrders.occurrenceKey, regen.cancelKeys)));
      }
      for (const r of regen.reschedule) {
        await tx.update(workOrders).set({ dueAt: r.dueAt, updatedAt: now }).where(and(eq(workOrders.planId, id), eq(workOrders.occurrenceKey, r.occurrenceKey)));
      }
      await insertOrdersIdempotent(
        tx,
        regen.create.map((c) => ({
          number: pendingNumber(), planId: id, occurrenceKey: c.occurrenceKey, ovenId: after.ovenId, title: after.title, kind: after.kind,
          dueAt: c.dueAt, checklist: after.checklist, safetyLockout: after.safetyLockout, assigneeId: after.assigneeId,
        })),
      );
    }
    await recordAudit(tx, { actor, action: "plan.update", entity: "maintenance_plan", entityId: id, before, after });
    return after;
  });
}
