import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, asc, eq, gte, isNull } from "drizzle-orm";
import { createTestDb } from "./test-db";
import { ovens } from "@/db/schema/fleet";
import { runs } from "@/db/schema/runs";
import { maintenancePlans, workOrders } from "@/db/schema/maintenance";
import { generateWorkOrders } from "@/db/queries/work-order-generation";

// Plans counted in verification runs, against the seeded demo: one order per N runs since the
// plan began, exactly once, and no flood of old orders when the generator first runs.
let t: Awaited<ReturnType<typeof createTestDb>>;
beforeAll(async () => {
  t = await createTestDb();
});
afterAll(() => t.close());

const MIN = 60_000;

async function runTimes(ovenId: number, since: Date) {
  const rows = await t.db
    .select({ at: runs.runAt })
    .from(runs)
    .where(and(eq(runs.ovenId, ovenId), isNull(runs.deletedAt), gte(runs.runAt, since)))
    .orderBy(asc(runs.runAt));
  return rows.map((r) => r.at);
}

describe("every-N-runs plans", () => {
  it("the demo's probe inspections carry their history, so the first generation adds nothing old", async () => {
    const plans = await t.db.select().from(maintenancePlans).where(eq(maintenancePlans.templateId, "probe-inspection-runs"));
    expect(plans.length).toBe(6);
    for (const plan of plans) {
      const counted = (await runTimes(plan.ovenId, plan.createdAt)).length;
      const orders = await t.db.select().from(workOrders).where(eq(workOrders.planId, plan.id));
      expect(orders.length, `plan ${plan.id}`).toBe(Math.floor(counted / plan.everyRuns!));
    }
    const runPlanIds = plans.map((p) => p.id);
    const countRunPlanOrders = async () => (await t.db.select({ planId: workOrders.planId }).from(workOrders)).filter((o) => runPlanIds.includes(o.planId!)).length;
    const before = await countRunPlanOrders();
    await generateWorkOrders(t.db, { now: new Date(), actor: null });
    expect(await countRunPlanOrders()).toBe(before);
    const l1 = plans.find((p) => p.everyRuns === 50)!;
    const done = await t.db.select().from(workOrders).where(and(eq(workOrders.planId, l1.id), eq(workOrders.state, "done")));
    for (const o of done) expect(o.completedAt!.getTime()).toBeGreaterThanOrEqual(o.dueAt!.getTime());
  });

  it("owe one order per N runs since the plan began; the next run past a multiple adds exactly one", async () => {
    const [oven] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "L1-RF1"));
    const since = new Date(Date.now() - 60 * 86_400_000);
    const [plan] = await t.db
      .insert(maintenancePlans)
      .values({ ovenId: oven.id, title: "Thermocouple check every 7 runs", kind: "preventive", everyRuns: 7, createdAt: since })
      .returning();
    const times = await runTimes(oven.id, since);
    expect(times.length).toBeGreaterThan(40);
    // Just before the 35th run since the plan began: four thresholds (7, 14, 21, 28) crossed.
    const beforeFifth = new Date(times[34].getTime() - MIN);
    await generateWorkOrders(t.db, { now: beforeFifth, actor: null });
    const first = await t.db.select().from(workOrders).where(eq(workOrders.planId, plan.id));
    expect(first.map((o) => o.occurrenceKey).sort()).toEqual([7, 14, 21, 28].map((n) => `${plan.id}:runs:${n}`).sort());
    expect(first.find((o) => o.occurrenceKey!.endsWith(":runs:7"))!.dueAt).toEqual(times[6]);
    // Generating again at the same moment adds none; after the 35th run, exactly one more.
    await generateWorkOrders(t.db, { now: beforeFifth, actor: null });
    expect(await t.db.$count(workOrders, eq(workOrders.planId, plan.id))).toBe(4);
    await generateWorkOrders(t.db, { now: new Date(times[34].getTime() + MIN), actor: null });
    const second = await t.db.select().from(workOrders).where(eq(workOrders.planId, plan.id));
    expect(second.length).toBe(5);
    expect(second.find((o) => o.occurrenceKey === `${plan.id}:runs:35`)!.dueAt).toEqual(times[34]);
    // And at the present: one per seven runs, each once.
    await generateWorkOrders(t.db, { now: new Date(), actor: null });
    await generateWorkOrders(t.db, { now: new Date(Date.now() + MIN), actor: null });
    const made = await t.db.select().from(workOrders).where(eq(workOrders.planId, plan.id));
    expect(made.length).toBe(Math.floor(times.length / 7));
    expect(new Set(made.map((o) => o.occurrenceKey)).size).toBe(made.length);
  });
});
