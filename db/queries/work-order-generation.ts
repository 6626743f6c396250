import "server-only";
import { and, asc, eq, gte, inArray, isNotNull, isNull, like, lte, sql } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { maintenancePlans, meterReadings, workOrders, type PlanRow } from "../schema/maintenance";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { planOccurrencesToGenerate } from "@/lib/maintenance/generation";
import { dueByMeter, dueByRuns } from "@/lib/maintenance/usage-triggers";
import { runs } from "../schema/runs";

/*
 * Turns plan occurrences into work orders. The pure core picks the occurrences; the database
 * decides what is new: every insert is `on conflict (plan_id, occurrence_key) do nothing`, so two
 * generators running at once (or one run twice) can never create the same order twice.
 */

export type NewOrder = typeof workOrders.$inferInsert;

const PENDING = "pending:";

/** Work-order numbers follow the row id ("WO-00123"), so they never collide between writers. */
export async function numberPendingOrders(tx: DbOrTx) {
  await tx.run(sql`update work_order set number = printf('WO-%05d', id) where number like ${PENDING + "%"}`);
}

export function pendingNumber(): string {
  return PENDING + crypto.randomUUID();
}

/** Inserts orders, skipping any whose (plan, occurrence) already exists. Returns how many were new. */
export async function insertOrdersIdempotent(tx: DbOrTx, rows: NewOrder[]): Promise<number> {
  let created = 0;
  // SQLite allows 32 766 bound variables; ~25 columns per row keeps a chunk of 200 well inside.
  for (let i = 0; i < rows.length; i += 200) {
    const chunk = rows.slice(i, i + 200).map((r) => ({ ...r, number: r.number ?? pendingNumber() }));
    const inserted = await tx
      .insert(workOrders)
      .values(chunk)
      .onConflictDoNothing({ target: [workOrders.planId, workOrders.occurrenceKey] })
      .returning({ id: workOrders.id });
    created += inserted.length;
  }
  await numberPendingOrders(tx);
  return created;
}

function orderFromPlan(plan: PlanRow, occurrenceKey: string, dueAt: Date): NewOrder {
  return {
    number: pendingNumber(),
    planId: plan.id,
    occurrenceKey,
    ovenId: plan.ovenId,
    title: plan.title,
    kind: plan.kind,
    state: "open",
    assigneeId: plan.assigneeId,
    dueAt,
    checklist: plan.checklist,
    safetyLockout: plan.safetyLockout,
  };
}

async function existingKeys(db: DbOrTx, planIds: number[]) {
  const byPlan = new Map<number, Set<string>>();
  if (!planIds.length) return byPlan;
  const rows = await db
    .select({ planId: workOrders.planId, key: workOrders.occurrenceKey })
    .from(workOrders)
    .where(and(inArray(workOrders.planId, planIds), isNotNull(workOrders.occurrenceKey)));
  for (const r of rows) {
    if (!byPlan.has(r.planId!)) byPlan.set(r.planId!, new Set());
    byPlan.get(r.planId!)!.add(r.key!);
  }
  return byPlan;
}

/** Orders a set of plans owes at `now` (calendar, heater-hour and run-count plans). */
export async function ordersOwed(db: DbOrTx, plans: { plan: PlanRow; timeZone: string }[], now: Date): Promise<NewOrder[]> {
  const keys = await existingKeys(db, plans.map((p) => p.plan.id));
  const out: NewOrder[] = [];
  for (const { plan, timeZone } of plans) {
    const have = keys.get(plan.id) ?? new Set<string>();
    if (plan.rrule && plan.dtstartLocal) {
      const occ = planOccurrencesToGenerate({
        plan: { id: String(plan.id), rrule: plan.rrule, dtstartLocal: plan.dtstartLocal, timeZone, lookAheadDays: plan.lookAheadDays, createdAt: plan.createdAt },
        existingOccurrenceKeys: have,
        now,
      });
      for (const o of occ) out.push(orderFromPlan(plan, o.occurrenceKey, o.dueAt));
    } else if (plan.everyHeaterHours) {
      const readings = await db
        .select({ at: meterReadings.at, value: meterReadings.value })
        .from(meterReadings)
        .where(and(eq(meterReadings.ovenId, plan.ovenId), eq(meterReadings.kind, "heater_hours")))
        .orderBy(asc(meterReadings.at));
      if (!readings.length) continue;
      const due = dueByMeter({
        planId: String(plan.id),
        everyHours: plan.everyHeaterHours,
        readings,
        baselineValue: plan.meterBaseline ?? readings[0].value,
        lastTriggeredThreshold: lastThreshold(have),
        now,
      });
      for (const c of due.crossed) out.push(orderFromPlan(plan, c.occurrenceKey, c.reachedAt));
    } else if (plan.everyRuns) {
      // Every tick asks; a count on the index answers "not yet" without reading the run history.
      const counted = await db.$count(runs, runsOfPlan(plan, now));
      if (counted < (lastThreshold(have) ?? 0) + plan.everyRuns) continue;
      const due = await dueByRunsForPlan(db, plan, have, now);
      for (const c of due.crossed) out.push(orderFromPlan(plan, c.occurrenceKey, c.reachedAt));
    }
  }
  return out;
}

/** The highest threshold among a plan's usage keys ("<plan>:runs:<n>"), or null when none. */
export function lastThreshold(keys: Iterable<string>): number | null {
  const values = [...keys].map((k) => Number(k.split(":").pop())).filter(Number.isFinite);
  return values.length ? Math.max(...values) : null;
}

const runsOfPlan = (plan: PlanRow, now: Date) => and(eq(runs.ovenId, plan.ovenId), isNull(runs.deletedAt), gte(runs.runAt, plan.createdAt), lte(runs.runAt, now));

/**
 * A run-count plan counts the oven's verification runs since the plan began (deleted runs do
 * not count); each multiple of N is one occurrence with a stable key.
 */
export async function dueByRunsForPlan(db: DbOrTx, plan: PlanRow, keys: Set<string>, now: Date) {
  const rows = await db
    .select({ at: runs.runAt })
    .from(runs)
    .where(runsOfPlan(plan, now))
    .orderBy(asc(runs.runAt));
  return dueByRuns({ planId: String(plan.id), everyRuns: plan.everyRuns!, runs: rows.map((r) => r.at), since: plan.createdAt, lastTriggeredThreshold: lastThreshold(keys), now });
}

export async function activePlansWithZone(db: DbOrTx, planIds?: number[]) {
  const rows = await db
    .select({ plan: maintenancePlans, timeZone: sites.timeZone })
    .from(maintenancePlans)
    .innerJoin(ovens, eq(ovens.id, maintenancePlans.ovenId))
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .where(and(eq(maintenancePlans.active, true), planIds ? inArray(maintenancePlans.id, planIds) : undefined));
  return rows;
}

/**
 * Creates every order the active plans owe up to `until` (default: now + each plan's
 * look-ahead). Idempotent; safe to run from several places at once.
 */
export async function generateWorkOrders(db: Db, { now, until, actor }: { now: Date; until?: Date; actor: Actor | null }) {
  // With `until`, the horizon is that instant instead of now + each plan's look-ahead.
  const plans = await activePlansWithZone(db);
  const owed = await ordersOwed(db, plans, until ?? now);
  const rows = until ? owed.filter((o) => (o.dueAt as Date) <= until) : owed;
  const created = await db.transaction(async (tx) => {
    const n = await insertOrdersIdempotent(tx, rows);
    if (n > 0) await recordAudit(tx, { actor, action: "maintenance.generate", entity: "work_order", entityId: "batch", after: { created: n, until: until?.toISOString() ?? null } });
    return n;
  });
  return { created };
}

/** For tests and the seed: orders still carrying a pending number (should be none). */
export async function countPendingNumbers(db: DbOrTx) {
  const [r] = await db.select({ n: sql<number>`count(*)` }).from(workOrders).where(like(workOrders.number, PENDING + "%"));
  return r.n;
}
