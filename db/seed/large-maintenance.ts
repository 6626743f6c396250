import type { Client } from "@libsql/client";
import type { Db } from "../client";
import { workOrders } from "../schema/maintenance";
import type { NewOrder } from "../queries/work-order-generation";
import { seededRandom } from "@/lib/thermal/synthetic-profile";
import { REFLOW_PM_TEMPLATES } from "@/lib/maintenance/pm-templates";
import { MAX_PER_RUN, planOccurrencesToGenerate } from "@/lib/maintenance/generation";
import { ensureMeters, ensurePlans, outcome } from "./seed-maintenance";
import { insertStatements } from "./bulk-insert";
import { LARGE_DAYS, LARGE_WORK_ORDERS } from "./large-plant";

const DAY = 86_400_000;
const HOUR = 3_600_000;

export type LargeMaintenanceOven = { id: number; tag: string; isLab: boolean; nitrogen: boolean; timeZone: string; breakdownDaysAgo: number | null; engineerId: string | null; techId: string | null };

// The calendar plans of the demo's templates, less the daily conveyor clean and the chain
// lubrication (over three years and 200 ovens they alone would be 300 000 orders).
const SKIPPED = new Set(["daily-conveyor-zones", "weekly-chain-lube"]);
function templatesOf(o: LargeMaintenanceOven) {
  return REFLOW_PM_TEMPLATES.filter(
    (t) => t.trigger.type === "calendar" && !SKIPPED.has(t.id) && (t.whereFitted !== "nitrogen" || o.nitrogen) && !(o.isLab && t.id === "quarterly-conveyor-speed"),
  );
}

const UNPLANNED = [
  { title: "Board dropped in zone 4; conveyor stopped and cleared", minutes: 40, breakdown: true },
  { title: "Edge rail jammed at the exit; rail re-aligned", minutes: 60, breakdown: true },
  { title: "Zone over-temperature alarm; thermocouple connector reseated", minutes: 35, breakdown: true },
  { title: "Blower noise reported by the line operator", minutes: 50, breakdown: false },
  { title: "Flux drip on the exit conveyor; drip tray emptied", minutes: 25, breakdown: false },
  { title: "Nitrogen flow low at start-up; regulator adjusted", minutes: 30, breakdown: false },
  { title: "Cooling fan guard loose; refitted", minutes: 20, breakdown: false },
  { title: "Profile out of window after changeover; recipe corrected", minutes: 45, breakdown: false },
];

/**
 * Plans on every oven, the orders their recurrences produced over the three years (most done on
 * time, some late, a few still open — the demo's outcome model), unplanned repairs and drift
 * investigations up to exactly 60 000 orders, and weekly hour-meter readings. Ids (and so the
 * WO numbers) follow the orders' creation times.
 */
export async function seedLargeMaintenance(db: Db, ovenRows: LargeMaintenanceOven[], { now, createdAt, total = LARGE_WORK_ORDERS }: { now: Date; createdAt: Date; total?: number }) {
  const rand = seededRandom(20_260_403);
  const orders: NewOrder[] = [];
  let plans = 0;
  await db.transaction(async (tx) => {
    for (const oven of ovenRows) {
      const made = await ensurePlans(tx, oven, createdAt, oven.engineerId, templatesOf(oven));
      plans += made.created;
      for (const plan of made.plans) {
        if (!plan.rrule || !plan.dtstartLocal) continue;
        const calendarPlan = { id: String(plan.id), rrule: plan.rrule, dtstartLocal: plan.dtstartLocal, timeZone: oven.timeZone, lookAheadDays: plan.lookAheadDays, createdAt: plan.createdAt };
        const taken = new Set<string>();
        for (;;) {
          // One call returns at most 500 occurrences: repeat until nothing is left.
          const batch = planOccurrencesToGenerate({ plan: calendarPlan, existingOccurrenceKeys: taken, now });
          if (!batch.length) break;
          for (const o of batch) {
            taken.add(o.occurrenceKey);
            const base: NewOrder = {
              number: "", planId: plan.id, occurrenceKey: o.occurrenceKey, ovenId: oven.id, title: plan.title, kind: plan.kind, dueAt: o.dueAt,
              checklist: plan.checklist, safetyLockout: plan.safetyLockout, assigneeId: plan.assigneeId,
              createdAt: new Date(o.dueAt.getTime() - plan.lookAheadDays * DAY), updatedAt: o.dueAt,
            };
            orders.push(outcome(base, plan, now, rand, plan.assigneeId ?? oven.techId));
          }
          // A short batch was the last one; asking again would only expand the rule once more.
          if (batch.length < MAX_PER_RUN) break;
        }
      }
    }
  });
  const planned = orders.length;
  // The ovens with an open breakdown now, then repairs and investigations spread over the history.
  for (const oven of ovenRows.filter((o) => o.breakdownDaysAgo !== null)) {
    const failure = new Date(now.getTime() - oven.breakdownDaysAgo! * DAY - 2 * HOUR);
    orders.push({
      number: "", ovenId: oven.id, title: "Conveyor drive stalled; line stopped", kind: "corrective", priority: "urgent", state: "open", breakdown: true,
      failureStartedAt: failure, dueAt: failure, assigneeId: oven.techId, safetyLockout: true, touched: true, createdAt: failure, updatedAt: failure,
    });
  }
  if (orders.length > total) throw new Error(`The plans alone make ${orders.length} orders, more than ${total}.`);
  while (orders.length < total) {
    const oven = ovenRows[Math.floor(rand() * ovenRows.length)];
    const raised = new Date(now.getTime() - (1 + Math.floor(rand() * (LARGE_DAYS - 2))) * DAY - Math.floor(rand() * 10) * HOUR);
    const drift = rand() < 0.12;
    const kind = UNPLANNED[Math.floor(rand() * UNPLANNED.length)];
    const age = (now.getTime() - raised.getTime()) / DAY;
    const done = age > 10 || rand() < 0.6;
    const minutes = Math.round(kind.minutes * (0.6 + rand()));
    const breakdown = !drift && kind.breakdown;
    const finished = new Date(raised.getTime() + (breakdown ? 20 + rand() * 200 : 60 + rand() * 2880) * 60_000);
    orders.push({
      number: "", ovenId: oven.id, title: drift ? "Critical-phase spread rising; check blower and baffles" : kind.title, kind: drift ? "drift_investigation" : "corrective",
      priority: breakdown ? "urgent" : drift ? "high" : "normal", state: done ? "done" : "open", breakdown, failureStartedAt: breakdown ? raised : null,
      dueAt: new Date(raised.getTime() + (breakdown ? 0 : 3 * DAY)), startedAt: done ? new Date(finished.getTime() - minutes * 60_000) : null,
      completedAt: done ? finished : null, downtimeMinutes: breakdown && done ? Math.round((finished.getTime() - raised.getTime()) / 60_000) : null,
      labourMinutes: done ? minutes : null, assigneeId: oven.techId, safetyLockout: true, touched: true, createdAt: raised, updatedAt: done ? finished : raised,
    });
  }
  // Numbered in creation order, as the app numbers them (WO-%05d of the row id).
  const cmp = (x: string, y: string) => (x < y ? -1 : x > y ? 1 : 0);
  orders.sort((a, b) => (a.createdAt as Date).getTime() - (b.createdAt as Date).getTime() || a.ovenId - b.ovenId || cmp(a.title, b.title) || cmp(String(a.occurrenceKey), String(b.occurrenceKey)));
  orders.forEach((o, i) => Object.assign(o, { id: i + 1, number: `WO-${String(i + 1).padStart(5, "0")}` }));
  let meterReadings = 0;
  await (db as unknown as { $client: Client }).$client.batch(insertStatements(workOrders, orders), "write");
  await db.transaction(async (tx) => {
    meterReadings = await ensureMeters(tx, ovenRows, now, rand, LARGE_DAYS);
  });
  return { plans, workOrders: orders.length, planned, meterReadings };
}
