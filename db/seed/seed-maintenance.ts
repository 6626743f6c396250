import { and, eq, inArray, isNotNull } from "drizzle-orm";
import { seededRandom } from "@/lib/thermal/synthetic-profile";
import type { Db, DbOrTx } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { users } from "../schema/users";
import { maintenancePlans, meterReadings, workOrderParts, workOrders, type PlanRow } from "../schema/maintenance";
import { dueByRunsForPlan, numberPendingOrders, pendingNumber, type NewOrder } from "../queries/work-order-generation";
import { REFLOW_PM_TEMPLATES, requiresLockout, type PmTemplate } from "@/lib/maintenance/pm-templates";
import { buildRrule } from "@/lib/maintenance/rrule-builder";
import { planOccurrencesToGenerate } from "@/lib/maintenance/generation";
import { localDateKey } from "@/lib/maintenance/wall-time";

/*
 * Brightwater's maintenance history: plans from the reflow templates on every oven, eighteen
 * months of orders with a realistic mix (mostly on time, some late, a few still overdue), one
 * breakdown on L1-RF1, the open drift investigation on L2-RF1, and weekly hour-meter readings.
 * Deterministic (a seeded PRNG, dates relative to `now` rounded down to the UTC day) and
 * idempotent (plans by (oven, template), orders by (plan, occurrence), one-offs by title).
 */

const DAY = 86_400_000;
const HISTORY_DAYS = 548;
const NITROGEN_OVENS = new Set(["L2-RF1", "L2-RF2"]);
const LINE_ONLY = new Set(["daily-conveyor-zones", "weekly-chain-lube", "quarterly-conveyor-speed"]);
export const BREAKDOWN_TITLE = "Conveyor drive tripped mid-shift; drive belt replaced";
export const DRIFT_TITLE = "Critical-phase spread rising";


function templatesFor(tag: string, isLab: boolean): PmTemplate[] {
  return REFLOW_PM_TEMPLATES.filter((t) => (t.whereFitted !== "nitrogen" || NITROGEN_OVENS.has(tag)) && !(isLab && LINE_ONLY.has(t.id)));
}

export async function ensurePlans(
  tx: DbOrTx,
  oven: { id: number; tag: string; isLab: boolean; timeZone: string },
  createdAt: Date,
  engineerId: string | null,
  templates: PmTemplate[] = templatesFor(oven.tag, oven.isLab),
) {
  // Only the seed's own plans (those made from a template); plans people added are theirs.
  const existing = await tx.select().from(maintenancePlans).where(and(eq(maintenancePlans.ovenId, oven.id), isNotNull(maintenancePlans.templateId)));
  const have = new Set(existing.map((p) => p.templateId));
  const fresh = templates
    .filter((t) => !have.has(t.id))
    .map((t) => ({
      ovenId: oven.id,
      templateId: t.id,
      title: t.title,
      instructions: t.instructions,
      checklist: t.checklist,
      estimatedMinutes: t.estimatedMinutes,
      kind: t.kind,
      assigneeRole: t.kind === "calibration" ? ("engineer" as const) : ("technician" as const),
      assigneeId: t.kind === "calibration" ? engineerId : null,
      safetyLockout: requiresLockout(t),
      rrule: t.trigger.type === "calendar" ? buildRrule(t.trigger.recurrence, { timeZone: oven.timeZone }) : null,
      dtstartLocal: t.trigger.type === "calendar" ? `${localDateKey(createdAt, oven.timeZone)}T${t.trigger.startTime}` : null,
      everyRuns: t.trigger.type === "runs" ? t.trigger.everyRuns : null,
      everyHeaterHours: t.trigger.type === "hours" ? t.trigger.everyHours : null,
      createdAt,
      updatedAt: createdAt,
    }));
  const created = fresh.length ? await tx.insert(maintenancePlans).values(fresh).returning() : [];
  return { plans: [...existing, ...created], created: created.length };
}

/** How one past order went: most on time, some late, a few never done (still overdue now). */
export function outcome(o: NewOrder, plan: PlanRow, now: Date, rand: () => number, techId: string | null, usage = false): NewOrder {
  const due = (o.dueAt as Date).getTime();
  if (due >= now.getTime()) return { ...o, assigneeId: rand() < 0.5 ? techId : null };
  const age = (now.getTime() - due) / DAY;
  const r = rand();
  const minutes = Math.max(5, Math.round((plan.estimatedMinutes ?? 30) * (0.7 + rand() * 0.7)));
  // Recent work is often still open; older misses are weekly-or-rarer tasks a few weeks late
  // (a daily clean missed a month ago is simply skipped, not left open).
  const daily = plan.rrule?.includes("FREQ=DAILY") ?? false;
  // A daily task missed more than a few days ago is mostly skipped too, so My work stays a list
  // a technician can get through.
  const overdueChance = age < 3 ? 0.35 : age < 12 ? (daily ? 0.05 : 0.35) : age < 45 && !daily ? 0.05 : 0;
  if (r < overdueChance) return { ...o, assigneeId: rand() < 0.6 ? techId : null };
  if (r < overdueChance + 0.015) return { ...o, state: "cancelled", touched: true, notes: "Line down for changeover; skipped." };
  const late = r > 0.9;
  // A usage order only exists once its threshold is reached, so it is done after that moment.
  const planned = late ? due + (2 + rand() * 70) * 3_600_000 : usage ? due + (20 + rand() * 100) * 60_000 : due - (10 + rand() * 110) * 60_000;
  const completed = Math.min(planned, now.getTime() - 5 * 60_000); // never in the future
  const results = Object.fromEntries(plan.checklist.map((c) => [c.id, { ok: true }]));
  return {
    ...o,
    state: "done",
    touched: true,
    assigneeId: techId,
    startedAt: new Date(completed - minutes * 60_000),
    completedAt: new Date(completed),
    labourMinutes: minutes,
    checklistResults: results,
    notes: late ? "Done after the due time: the line was running a rush order." : null,
  };
}

async function ensureOneOffs(tx: DbOrTx, byTag: Map<string, number>, now: Date, ids: { tech: string | null; engineer: string | null }) {
  const titles = [BREAKDOWN_TITLE, DRIFT_TITLE];
  const have = new Set((await tx.select({ title: workOrders.title }).from(workOrders).where(inArray(workOrders.title, titles))).map((r) => r.title));
  let n = 0;
  if (!have.has(BREAKDOWN_TITLE) && byTag.has("L1-RF1")) {
    const failure = new Date(now.getTime() - 41 * DAY - 1.5 * 3_600_000); // 10:30 UTC, inside the KPI page's default 90 days
    const [row] = await tx
      .insert(workOrders)
      .values({
        number: pendingNumber(), ovenId: byTag.get("L1-RF1")!, title: BREAKDOWN_TITLE, kind: "corrective", priority: "urgent", state: "done",
        breakdown: true, failureStartedAt: failure, dueAt: failure, startedAt: new Date(failure.getTime() + 20 * 60_000),
        completedAt: new Date(failure.getTime() + 185 * 60_000), downtimeMinutes: 185, labourMinutes: 150, assigneeId: ids.tech,
        safetyLockout: true, touched: true, notes: "Drive belt frayed and slipping; replaced, tension set, conveyor speed re-verified.",
        createdAt: failure, updatedAt: failure,
      })
      .returning({ id: workOrders.id });
    await tx.insert(workOrderParts).values([
      { workOrderId: row.id, description: "Conveyor drive belt", quantity: 1 },
      { workOrderId: row.id, description: "Cable ties", quantity: 4 },
    ]);
    n++;
  }
  if (!have.has(DRIFT_TITLE) && byTag.has("L2-RF1")) {
    const raised = new Date(now.getTime() - 2 * DAY - 3 * 3_600_000);
    await tx.insert(workOrders).values({
      number: pendingNumber(), ovenId: byTag.get("L2-RF1")!, title: DRIFT_TITLE, kind: "drift_investigation", priority: "high", state: "open",
      dueAt: new Date(now.getTime() + 5 * DAY - 3 * 3_600_000), assigneeId: ids.engineer, safetyLockout: true, touched: true,
      notes: "EWMA of the critical-phase spread crossed its limit; projection reaches the window edge within weeks. Check blower bearings first.",
      checklist: [
        { id: "bearing", label: "Blower bearing noise and play checked", mandatory: true },
        { id: "profile", label: "Verification run after the check", mandatory: true },
      ],
      createdAt: raised, updatedAt: raised,
    });
    n++;
  }
  return n;
}

export async function ensureMeters(tx: DbOrTx, ovenRows: { id: number; tag: string; isLab: boolean }[], now: Date, rand: () => number, historyDays = HISTORY_DAYS) {
  const withReadings = new Set((await tx.selectDistinct({ ovenId: meterReadings.ovenId }).from(meterReadings)).map((r) => r.ovenId));
  const rows: (typeof meterReadings.$inferInsert)[] = [];
  for (const o of ovenRows) {
    if (withReadings.has(o.id)) continue;
    const perDay = o.isLab ? 5 : 19;
    let heater = o.isLab ? 4200 : 21_000 + o.id * 1300;
    let cycles = o.isLab ? 900 : 0;
    for (let d = historyDays; d >= 1; d -= 7) {
      heater += Math.round(perDay * 7 * (0.85 + rand() * 0.3));
      cycles += o.isLab ? Math.round(20 + rand() * 15) : 0;
      const at = new Date(now.getTime() - d * DAY - 4 * 3_600_000); // 08:00 UTC
      rows.push({ ovenId: o.id, kind: "heater_hours", value: heater, at });
      if (o.isLab) rows.push({ ovenId: o.id, kind: "cycles", value: cycles, at });
    }
  }
  for (let i = 0; i < rows.length; i += 500) await tx.insert(meterReadings).values(rows.slice(i, i + 500));
  return rows.length;
}

export async function seedMaintenance(db: Db, { now: rawNow = new Date() }: { now?: Date } = {}) {
  const now = new Date(Math.floor(rawNow.getTime() / DAY) * DAY + 12 * 3_600_000);
  const createdAt = new Date(now.getTime() - HISTORY_DAYS * DAY - 12 * 3_600_000);
  const userRows = await db.select({ id: users.id, email: users.email }).from(users).where(inArray(users.email, ["tech@brightwater.example", "engineer@brightwater.example"]));
  const ids = { tech: userRows.find((u) => u.email.startsWith("tech"))?.id ?? null, engineer: userRows.find((u) => u.email.startsWith("engineer"))?.id ?? null };
  const ovenRows = (
    await db
      .select({ id: ovens.id, tag: ovens.tag, lineKind: lines.kind, timeZone: sites.timeZone })
      .from(ovens)
      .innerJoin(lines, eq(lines.id, ovens.lineId))
      .innerJoin(sites, eq(sites.id, lines.siteId))
      .where(eq(ovens.serviceState, "in_service"))
  ).map((o) => ({ ...o, isLab: o.lineKind === "lab" }));
  const counts = { plans: 0, workOrders: 0, meterReadings: 0 };
  await db.transaction(async (tx) => {
    const rand = seededRandom(20_260_402);
    // Run-count plans draw from their own stream, so the calendar history stays as it was.
    const usageRand = seededRandom(20_260_403);
    const orders: NewOrder[] = [];
    for (const oven of ovenRows) {
      const { plans, created } = await ensurePlans(tx, oven, createdAt, ids.engineer);
      counts.plans += created;
      const planIds = plans.map((p) => p.id);
      const taken = new Set(
        (await tx.select({ k: workOrders.occurrenceKey }).from(workOrders).where(and(inArray(workOrders.planId, planIds)))).map((r) => r.k!),
      );
      for (const plan of plans) {
        if (plan.everyRuns) {
          // Counted in the runs seeded above: one order per N runs since the plan began.
          const due = await dueByRunsForPlan(tx, plan, new Set([...taken].filter((k) => k.startsWith(`${plan.id}:`))), now);
          for (const c of due.crossed) {
            taken.add(c.occurrenceKey);
            const base: NewOrder = {
              number: pendingNumber(), planId: plan.id, occurrenceKey: c.occurrenceKey, ovenId: oven.id, title: plan.title, kind: plan.kind,
              dueAt: c.reachedAt, checklist: plan.checklist, safetyLockout: plan.safetyLockout, assigneeId: plan.assigneeId,
              createdAt: c.reachedAt, updatedAt: c.reachedAt,
            };
            orders.push(outcome(base, plan, now, usageRand, plan.assigneeId ?? ids.tech, true));
          }
          continue;
        }
        if (!plan.rrule || !plan.dtstartLocal) continue;
        const calendarPlan = { id: String(plan.id), rrule: plan.rrule, dtstartLocal: plan.dtstartLocal, timeZone: oven.timeZone, lookAheadDays: plan.lookAheadDays, createdAt: plan.createdAt };
        // One call returns at most 500 occurrences (a daily plan has more over 18 months): repeat.
        const occ = [];
        for (;;) {
          const batch = planOccurrencesToGenerate({ plan: calendarPlan, existingOccurrenceKeys: taken, now });
          if (!batch.length) break;
          for (const o of batch) taken.add(o.occurrenceKey);
          occ.push(...batch);
        }
        for (const o of occ) {
          const base: NewOrder = {
            number: pendingNumber(), planId: plan.id, occurrenceKey: o.occurrenceKey, ovenId: oven.id, title: plan.title, kind: plan.kind,
            dueAt: o.dueAt, checklist: plan.checklist, safetyLockout: plan.safetyLockout, assigneeId: plan.assigneeId,
            createdAt: new Date(o.dueAt.getTime() - plan.lookAheadDays * DAY), updatedAt: o.dueAt,
          };
          orders.push(outcome(base, plan, now, rand, plan.assigneeId ?? ids.tech));
        }
      }
    }
    for (let i = 0; i < orders.length; i += 200) {
      const rows = await tx.insert(workOrders).values(orders.slice(i, i + 200)).onConflictDoNothing({ target: [workOrders.planId, workOrders.occurrenceKey] }).returning({ id: workOrders.id });
      counts.workOrders += rows.length;
    }
    counts.workOrders += await ensureOneOffs(tx, new Map(ovenRows.map((o) => [o.tag, o.id])), now, ids);
    await numberPendingOrders(tx);
    counts.meterReadings = await ensureMeters(tx, ovenRows, now, rand);
  });
  return counts;
}
