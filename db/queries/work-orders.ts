import "server-only";
import { refreshHealth } from "./health";
import { and, asc, desc, eq, gte, inArray, lt, or, sql, type SQL } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { users } from "../schema/users";
import { workOrderParts, workOrders, type WorkOrderRow } from "../schema/maintenance";
import { recordAudit } from "./audit";
import { numberPendingOrders, pendingNumber } from "./work-order-generation";
import type { Actor } from "@/lib/actor";
import { AppError, notFound } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { assertTransition, checkClose, describeUnanswered, WorkOrderTransitionError } from "@/lib/maintenance/work-order-state";
import type { WorkOrderCreateInput, WorkOrderFilter, WorkOrderPatch } from "@/lib/validation/maintenance";

const UNFINISHED = ["open", "in_progress", "on_hold"] as const;

function filterWhere(f: Partial<WorkOrderFilter>, now: Date): SQL | undefined {
  const w: SQL[] = [];
  if (f.planId) w.push(eq(workOrders.planId, f.planId));
  if (f.ovenId) w.push(eq(workOrders.ovenId, f.ovenId));
  if (f.kind) w.push(eq(workOrders.kind, f.kind));
  if (f.state === "unfinished") w.push(inArray(workOrders.state, [...UNFINISHED]));
  else if (f.state) w.push(eq(workOrders.state, f.state));
  if (f.assigneeId === "none") w.push(sql`${workOrders.assigneeId} is null`);
  else if (f.assigneeId) w.push(eq(workOrders.assigneeId, f.assigneeId));
  if (f.from) w.push(gte(workOrders.dueAt, f.from));
  if (f.to) w.push(lt(workOrders.dueAt, f.to));
  if (f.overdue) w.push(and(inArray(workOrders.state, [...UNFINISHED]), lt(workOrders.dueAt, now))!);
  return w.length ? and(...w) : undefined;
}

const listColumns = {
  order: workOrders,
  ovenTag: ovens.tag,
  assigneeName: users.name,
  timeZone: sites.timeZone,
};

/** A page of orders, overdue and soonest due first. */
export async function listWorkOrders(db: DbOrTx, f: Partial<WorkOrderFilter>, now = new Date()) {
  const where = filterWhere(f, now);
  const [items, [{ total }]] = await Promise.all([
    db
      .select(listColumns)
      .from(workOrders)
      .innerJoin(ovens, eq(ovens.id, workOrders.ovenId))
      .innerJoin(lines, eq(lines.id, ovens.lineId))
      .innerJoin(sites, eq(sites.id, lines.siteId))
      .leftJoin(users, eq(users.id, workOrders.assigneeId))
      .where(where)
      .orderBy(sql`${workOrders.dueAt} is null`, asc(workOrders.dueAt), asc(workOrders.id))
      .limit(f.limit ?? 50)
      .offset(f.offset ?? 0),
    db.select({ total: sql<number>`count(*)` }).from(workOrders).where(where),
  ]);
  return { items, total };
}
export type WorkOrderListRow = Awaited<ReturnType<typeof listWorkOrders>>["items"][number];

/** The API's list shape (contract in the maintenance issue), plus display fields. */
export function workOrderListJson(r: WorkOrderListRow) {
  const o = r.order;
  return {
    id: o.id,
    number: o.number,
    planId: o.planId,
    ovenId: o.ovenId,
    kind: o.kind,
    state: o.state,
    dueAt: o.dueAt?.toISOString() ?? null,
    assigneeId: o.assigneeId,
    version: o.version,
    title: o.title,
    priority: o.priority,
    ovenTag: r.ovenTag,
    assigneeName: r.assigneeName,
    timeZone: r.timeZone,
    completedAt: o.completedAt?.toISOString() ?? null,
  };
}
export type WorkOrderListJson = ReturnType<typeof workOrderListJson>;

export async function getWorkOrder(db: DbOrTx, id: number) {
  const [row] = await db.select().from(workOrders).where(eq(workOrders.id, id)).limit(1);
  return row ?? null;
}

export async function listParts(db: DbOrTx, workOrderId: number) {
  return db.select().from(workOrderParts).where(eq(workOrderParts.workOrderId, workOrderId)).orderBy(asc(workOrderParts.id));
}

export function workOrderJson(o: WorkOrderRow, parts: { description: string; quantity: number }[] = []) {
  return {
    ...o,
    dueAt: o.dueAt?.toISOString() ?? null,
    startedAt: o.startedAt?.toISOString() ?? null,
    completedAt: o.completedAt?.toISOString() ?? null,
    failureStartedAt: o.failureStartedAt?.toISOString() ?? null,
    createdAt: o.createdAt.toISOString(),
    updatedAt: o.updatedAt.toISOString(),
    parts: parts.map((p) => ({ description: p.description, quantity: p.quantity })),
  };
}
export type WorkOrderJson = ReturnType<typeof workOrderJson>;

async function conflict(db: DbOrTx, id: number) {
  const current = await getWorkOrder(db, id);
  if (!current) return notFound("That work order");
  return new AppError(
    "conflict",
    `Someone else changed ${current.number} since you opened it (now version ${current.version}). Reload to see their changes, then try again.`,
    { current: workOrderJson(current, await listParts(db, id)) },
  );
}

/** Who may set the assignee: managers anyone; others only themselves, or clear their own. */
function checkAssign(actor: Actor, before: WorkOrderRow, assigneeId: string | null) {
  if (can(actor.role, "workorder.assign")) return;
  const ownOrFree = assigneeId === actor.userId || (assigneeId === null && before.assigneeId === actor.userId);
  if (!ownOrFree) throw new AppError("forbidden", "Your role may only take a work order for yourself; a manager assigns work to others.");
}

/**
 * Applies a patch based on `patch.version`. The write is a single
 * UPDATE … WHERE id = ? AND version = ?, so of two people saving the same version exactly one
 * succeeds; the other gets 409 with the record as it now is.
 */
export async function patchWorkOrder(db: Db, id: number, patch: WorkOrderPatch, actor: Actor, now = new Date()) {
  const before = await getWorkOrder(db, id);
  if (!before) throw notFound("That work order");
  if (before.version !== patch.version) throw await conflict(db, id);
  const { version, parts, ...fields } = patch;
  const set: Partial<WorkOrderRow> = { ...fields, touched: true, updatedAt: now };
  if (fields.assigneeId !== undefined) checkAssign(actor, before, fields.assigneeId);
  const to = fields.state;
  if (to && to !== before.state) {
    try {
      assertTransition(before.state, to);
    } catch (e) {
      if (e instanceof WorkOrderTransitionError) throw new AppError("invalid_input", e.message, { fields: { state: e.message }, from: e.from, to: e.to });
      throw e;
    }
    if (to === "in_progress" && !before.startedAt) set.startedAt = now;
    if (to === "in_progress" && !before.assigneeId && fields.assigneeId === undefined) set.assigneeId = actor.userId;
    if (to === "done") {
      const missing = checkClose({ checklist: before.checklist, results: { ...before.checklistResults, ...(fields.checklistResults ?? {}) } });
      if (missing.length) throw new AppError("invalid_input", describeUnanswered(missing)!, { fields: { checklistResults: describeUnanswered(missing) }, unanswered: missing });
      set.completedAt = now;
    }
  } else if (to === before.state) {
    delete set.state;
  }
  if (fields.checklistResults) set.checklistResults = { ...before.checklistResults, ...fields.checklistResults };
  const after = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(workOrders)
      .set({ ...set, version: sql`${workOrders.version} + 1` as unknown as number })
      .where(and(eq(workOrders.id, id), eq(workOrders.version, version)))
      .returning();
    if (!row) return null;
    if (parts) {
      await tx.delete(workOrderParts).where(eq(workOrderParts.workOrderId, id));
      if (parts.length) await tx.insert(workOrderParts).values(parts.map((p) => ({ ...p, workOrderId: id })));
    }
    await recordAudit(tx, { actor, action: to === "done" ? "workorder.close" : "workorder.update", entity: "work_order", entityId: id, before, after: row });
    // An open breakdown makes the oven Down; closing it lets the health recover.
    if (row.breakdown && row.state !== before.state) await refreshHealth(tx, row.ovenId, now);
    return row;
  });
  if (!after) throw await conflict(db, id);
  return workOrderJson(after, await listParts(db, id));
}

export async function createWorkOrder(db: Db, input: WorkOrderCreateInput, actor: Actor, now = new Date()) {
  const [oven] = await db.select({ id: ovens.id }).from(ovens).where(eq(ovens.id, input.ovenId)).limit(1);
  if (!oven) throw new AppError("invalid_input", "ovenId: no oven has that id.", { fields: { ovenId: "no oven has that id" } });
  if (input.assigneeId && input.assigneeId !== actor.userId && !can(actor.role, "workorder.assign")) {
    throw new AppError("forbidden", "Your role may only take a work order for yourself; a manager assigns work to others.");
  }
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(workOrders)
      .values({
        number: pendingNumber(),
        ovenId: input.ovenId,
        title: input.title,
        kind: input.kind,
        priority: input.priority,
        notes: input.notes,
        dueAt: input.dueAt ?? now,
        breakdown: input.breakdown,
        failureStartedAt: input.breakdown ? (input.failureStartedAt ?? now) : null,
        assigneeId: input.assigneeId ?? null,
        // Unplanned work opens the chamber more often than not; the caution is shown by default.
        safetyLockout: true,
        touched: true,
        createdById: actor.userId,
        createdAt: now,
        updatedAt: now,
      })
      .returning({ id: workOrders.id });
    await numberPendingOrders(tx);
    const created = (await getWorkOrder(tx, row.id))!;
    await recordAudit(tx, { actor, action: "workorder.create", entity: "work_order", entityId: row.id, after: created });
    if (created.breakdown) await refreshHealth(tx, created.ovenId, now);
    return workOrderJson(created);
  });
}

/** Assigns several orders at once (managers). Final orders are left alone and reported. */
export async function bulkAssign(db: Db, ids: number[], assigneeId: string | null, actor: Actor) {
  if (assigneeId) {
    const [u] = await db.select({ id: users.id }).from(users).where(eq(users.id, assigneeId)).limit(1);
    if (!u) throw new AppError("invalid_input", "assigneeId: no user has that id.", { fields: { assigneeId: "no user has that id" } });
  }
  return db.transaction(async (tx) => {
    const rows = await tx
      .update(workOrders)
      .set({ assigneeId, touched: true, updatedAt: new Date(), version: sql`${workOrders.version} + 1` as unknown as number })
      .where(and(inArray(workOrders.id, ids), inArray(workOrders.state, [...UNFINISHED])))
      .returning({ id: workOrders.id });
    await recordAudit(tx, { actor, action: "workorder.assign", entity: "work_order", entityId: rows.map((r) => r.id).join(","), after: { assigneeId } });
    return { assigned: rows.length, skipped: ids.length - rows.length };
  });
}

/** Orders for My work: mine due within `days`, and nobody's due within a day or overdue. */
export async function listMyWork(db: DbOrTx, userId: string, now: Date, days = 7) {
  const horizon = new Date(now.getTime() + days * 86_400_000);
  const soon = new Date(now.getTime() + 86_400_000);
  return db
    .select(listColumns)
    .from(workOrders)
    .innerJoin(ovens, eq(ovens.id, workOrders.ovenId))
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .leftJoin(users, eq(users.id, workOrders.assigneeId))
    .where(
      and(
        inArray(workOrders.state, [...UNFINISHED]),
        or(
          // Mine: anything due within `days` (or undated).
          and(eq(workOrders.assigneeId, userId), or(lt(workOrders.dueAt, horizon), sql`${workOrders.dueAt} is null`)),
          // Nobody's: only what is due within a day or already overdue, so the list stays short.
          and(sql`${workOrders.assigneeId} is null`, lt(workOrders.dueAt, soon)),
        ),
      ),
    )
    .orderBy(desc(sql`${workOrders.state} = 'in_progress'`), asc(workOrders.dueAt))
    .limit(200);
}
