import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, gte, isNull } from "drizzle-orm";
import { createTestDb } from "./test-db";
import { ovens } from "@/db/schema/fleet";
import { runs } from "@/db/schema/runs";
import { maintenancePlans, workOrders } from "@/db/schema/maintenance";
import { generateWorkOrders } from "@/db/queries/work-order-generation";

// A plan counted in verification runs: one order per N runs since the plan began, exactly once.
let t: Awaited<ReturnType<typeof createTestDb>>;
beforeAll(async () => {
  t = await createTestDb();
});
afterAll(() => t.close());

describe("every-N-runs plans", () => {
  it("owe floor(runs since the plan began ÷ N) orders, and generating again adds none", async () => {
    const [oven] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "L1-RF1"));
    const since = new Date(Date.now() - 60 * 86_400_000);
    const [plan] = await t.db
      .insert(maintenancePlans)
      .values({ ovenId: oven.id, title: "Thermocouple check every 7 runs", kind: "preventive", everyRuns: 7, createdAt: since })
      .returning();
    const counted = await t.db.$count(runs, and(eq(runs.ovenId, oven.id), isNull(runs.deletedAt), gte(runs.runAt, since)));
    expect(counted).toBeGreaterThan(40);
    const now = new Date();
    await generateWorkOrders(t.db, { now, actor: null });
    const made = await t.db.select().from(workOrders).where(eq(workOrders.planId, plan.id));
    expect(made.length).toBe(Math.floor(counted / 7));
    expect(new Set(made.map((o) => o.occurrenceKey)).size).toBe(made.length);
    await generateWorkOrders(t.db, { now: new Date(now.getTime() + 60_000), actor: null });
    expect(await t.db.$count(workOrders, eq(workOrders.planId, plan.id))).toBe(made.length);
  });
});
