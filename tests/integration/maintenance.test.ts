import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { actorFor, createTestDb } from "./test-db";
import { maintenancePlans, meterReadings, workOrders } from "@/db/schema/maintenance";
import { ovens } from "@/db/schema/fleet";
import { createPlans, updatePlan } from "@/db/queries/plans";
import { countPendingNumbers, generateWorkOrders } from "@/db/queries/work-order-generation";
import { createWorkOrder, getWorkOrder, patchWorkOrder } from "@/db/queries/work-orders";
import { recordMeterReading } from "@/db/queries/meters";
import { seedMaintenance } from "@/db/seed/seed-maintenance";
import { AppError } from "@/lib/errors";

// Maintenance against a real libSQL database (temp file, migrations, demo seed).
let t: Awaited<ReturnType<typeof createTestDb>>;
let labB2 = 0;
beforeAll(async () => {
  t = await createTestDb();
  [{ id: labB2 }] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "LAB-B2"));
});
afterAll(() => t.close());

const countFor = async (planId: number) =>
  (await t.db.select({ n: sql<number>`count(*)` }).from(workOrders).where(eq(workOrders.planId, planId)))[0].n;

async function weeklyPlan(title: string, createdAt: Date) {
  const engineer = await actorFor(t.db, "engineer");
  const [plan] = await createPlans(
    t.db,
    { ovenIds: [labB2], title, instructions: "", kind: "preventive", checklist: [{ id: "a", label: "Filter cleaned", mandatory: true }], safetyLockout: true, rrule: "FREQ=WEEKLY;BYDAY=MO", dtstart: "2026-03-02T07:00", lookAheadDays: 14 },
    engineer,
    createdAt,
  );
  return plan;
}

describe("generation is idempotent through the (plan, occurrence) unique index", () => {
  it("running twice creates nothing the second time", async () => {
    const plan = await weeklyPlan("Idempotence check", new Date("2026-03-01T00:00:00Z"));
    const now = new Date("2026-03-20T12:00:00Z");
    const manager = await actorFor(t.db, "manager");
    const first = await generateWorkOrders(t.db, { now, actor: manager });
    // Mondays from 2 Mar to now + 14 d (3 Apr): 2, 9, 16, 23, 30 March — five orders (hand count).
    expect(await countFor(plan.id)).toBe(5);
    expect(first.created).toBeGreaterThanOrEqual(5);
    const second = await generateWorkOrders(t.db, { now, actor: manager });
    expect(second.created).toBe(0);
    expect(await countFor(plan.id)).toBe(5);
    // Europe/Dublin is GMT until 29 Mar 2026 and IST (UTC+1) after: 07:00 local is 07:00Z then 06:00Z.
    const dues = (await t.db.select({ d: workOrders.dueAt }).from(workOrders).where(eq(workOrders.planId, plan.id))).map((r) => r.d!.toISOString()).sort();
    expect(dues).toEqual(["2026-03-02T07:00:00.000Z", "2026-03-09T07:00:00.000Z", "2026-03-16T07:00:00.000Z", "2026-03-23T07:00:00.000Z", "2026-03-30T06:00:00.000Z"]);
    expect(await countPendingNumbers(t.db)).toBe(0);
  });

  it("two generations at once (Promise.all) still create each order once", async () => {
    const plan = await weeklyPlan("Concurrent generation", new Date("2026-04-01T00:00:00Z"));
    const now = new Date("2026-04-10T12:00:00Z");
    const manager = await actorFor(t.db, "manager");
    const results = await Promise.all([generateWorkOrders(t.db, { now, actor: manager }), generateWorkOrders(t.db, { now, actor: manager })]);
    // Mondays 6, 13, 20 April (now + 14 d = 24 April): three orders, whichever run made them.
    expect(await countFor(plan.id)).toBe(3);
    const mine = await t.db.select({ n: workOrders.number }).from(workOrders).where(eq(workOrders.planId, plan.id));
    expect(new Set(mine.map((m) => m.n)).size).toBe(3);
    expect(results.every((r) => r.created >= 0)).toBe(true);
  });

  it("the database itself refuses a second order for the same occurrence", async () => {
    const [order] = await t.db.select().from(workOrders).where(sql`${workOrders.planId} is not null`).limit(1);
    const err = await t.db
      .insert(workOrders)
      .values({ number: "WO-DUP", planId: order.planId, occurrenceKey: order.occurrenceKey, ovenId: order.ovenId, title: "dup", kind: "preventive" })
      .then(() => null, (e: { message: string; cause?: { message: string } }) => e);
    expect(err?.cause?.message ?? "").toMatch(/UNIQUE constraint failed: work_order\.plan_id, work_order\.occurrence_key/);
  });

  it("editing a plan's rule replaces only future untouched orders", async () => {
    const plan = await weeklyPlan("Edited plan", new Date("2026-05-01T00:00:00Z"));
    const now = new Date("2026-05-06T12:00:00Z");
    const manager = await actorFor(t.db, "manager");
    await generateWorkOrders(t.db, { now, actor: manager });
    // Mondays 4, 11, 18 May exist; 4 May is past. Move the plan to Wednesdays.
    await updatePlan(t.db, plan.id, { version: plan.version, rrule: "FREQ=WEEKLY;BYDAY=WE" }, manager, now);
    const rows = await t.db.select().from(workOrders).where(eq(workOrders.planId, plan.id));
    const open = rows.filter((r) => r.state === "open").map((r) => r.dueAt!.toISOString()).sort();
    // Kept: the past Monday 4 May (history). New: Wednesdays 13 and 20 May (06:00Z = 07:00 IST).
    expect(open).toEqual(["2026-05-04T06:00:00.000Z", "2026-05-13T06:00:00.000Z", "2026-05-20T06:00:00.000Z"]);
    expect(rows.filter((r) => r.state === "cancelled").length).toBe(2);
  });
});

describe("work orders: optimistic concurrency and transitions", () => {
  async function freshOrder() {
    const tech = await actorFor(t.db, "technician");
    const created = await createWorkOrder(t.db, { ovenId: labB2, title: "Drawer latch sticks", kind: "corrective", priority: "normal", breakdown: false }, tech);
    return { tech, created };
  }

  it("numbers orders WO-nnnnn from the row id", async () => {
    const { created } = await freshOrder();
    expect(created.number).toBe(`WO-${String(created.id).padStart(5, "0")}`);
  });

  it("two closes of the same version: exactly one wins, the other gets 409 with the current record", async () => {
    const { tech, created } = await freshOrder();
    const engineer = await actorFor(t.db, "engineer");
    const close = (actor: typeof tech, notes: string) =>
      patchWorkOrder(t.db, created.id, { version: created.version, state: "done", notes, labourMinutes: 10 }, actor).then(
        (r) => ({ ok: true as const, r }),
        (e: unknown) => ({ ok: false as const, e }),
      );
    const results = await Promise.all([close(tech, "by tech"), close(engineer, "by engineer")]);
    const wins = results.filter((r) => r.ok);
    const losses = results.filter((r) => !r.ok);
    expect(wins).toHaveLength(1);
    expect(losses).toHaveLength(1);
    const err = (losses[0] as { e: AppError }).e;
    expect(err).toBeInstanceOf(AppError);
    expect(err.code).toBe("conflict");
    expect(err.status).toBe(409);
    const current = err.details!.current as { version: number; state: string; notes: string };
    expect(current.version).toBe(created.version + 1);
    expect(current.state).toBe("done");
    // Nothing was overwritten: the stored notes are the winner's.
    const stored = await getWorkOrder(t.db, created.id);
    expect(stored!.notes).toBe(current.notes);
    expect(stored!.version).toBe(created.version + 1);
  });

  it("a stale version is refused before anything is written", async () => {
    const { tech, created } = await freshOrder();
    await patchWorkOrder(t.db, created.id, { version: created.version, notes: "first" }, tech);
    await expect(patchWorkOrder(t.db, created.id, { version: created.version, notes: "second" }, tech)).rejects.toMatchObject({ code: "conflict" });
    expect((await getWorkOrder(t.db, created.id))!.notes).toBe("first");
  });

  it("refuses transitions the state machine forbids, with a clear message", async () => {
    const { tech, created } = await freshOrder();
    const held = await patchWorkOrder(t.db, created.id, { version: created.version, state: "on_hold" }, tech);
    await expect(patchWorkOrder(t.db, created.id, { version: held.version, state: "done" }, tech)).rejects.toMatchObject({
      code: "invalid_input",
      message: "A work order that is on hold cannot be moved to done; resume it (in progress) first.",
    });
    const cancelled = await patchWorkOrder(t.db, created.id, { version: held.version, state: "cancelled" }, tech);
    await expect(patchWorkOrder(t.db, created.id, { version: cancelled.version, state: "open" }, tech)).rejects.toMatchObject({
      message: expect.stringContaining("a cancelled order is final"),
    });
  });

  it("closing needs every mandatory checklist item answered", async () => {
    const tech = await actorFor(t.db, "technician");
    const [order] = await t.db
      .select()
      .from(workOrders)
      .where(and(eq(workOrders.state, "open"), sql`json_array_length(${workOrders.checklist}) >= 2`))
      .limit(1);
    const mandatory = order.checklist.filter((c) => c.mandatory);
    await expect(patchWorkOrder(t.db, order.id, { version: order.version, state: "done" }, tech)).rejects.toMatchObject({
      code: "invalid_input",
      message: expect.stringContaining(mandatory[0].label),
    });
    const results = Object.fromEntries(mandatory.map((c) => [c.id, { ok: true }]));
    const done = await patchWorkOrder(t.db, order.id, { version: order.version, state: "done", checklistResults: results }, tech);
    expect(done.state).toBe("done");
    expect(done.completedAt).not.toBeNull();
  });

  it("a technician may take an order for themselves but not assign it to someone else", async () => {
    const { tech, created } = await freshOrder();
    const manager = await actorFor(t.db, "manager");
    await expect(patchWorkOrder(t.db, created.id, { version: created.version, assigneeId: manager.userId }, tech)).rejects.toMatchObject({ code: "forbidden" });
    const mine = await patchWorkOrder(t.db, created.id, { version: created.version, assigneeId: tech.userId }, tech);
    expect(mine.assigneeId).toBe(tech.userId);
  });
});

describe("meter readings", () => {
  it("only count up", async () => {
    const tech = await actorFor(t.db, "technician");
    const [last] = await t.db.select().from(meterReadings).where(and(eq(meterReadings.ovenId, labB2), eq(meterReadings.kind, "heater_hours"))).orderBy(sql`${meterReadings.at} desc`).limit(1);
    await expect(recordMeterReading(t.db, labB2, { kind: "heater_hours", value: last.value - 1 }, tech)).rejects.toMatchObject({ code: "invalid_input", message: expect.stringContaining("only counts up") });
    const ok = await recordMeterReading(t.db, labB2, { kind: "heater_hours", value: last.value + 12 }, tech);
    expect(ok.value).toBe(last.value + 12);
  });
});

describe("the demo seed", () => {
  it("is idempotent and tells the brief's story", async () => {
    const plansBefore = await t.db.$count(maintenancePlans);
    expect(await seedMaintenance(t.db, {})).toEqual({ plans: 0, workOrders: 0, meterReadings: 0 });
    expect(await t.db.$count(maintenancePlans)).toBe(plansBefore);
    const drift = await t.db.select().from(workOrders).where(eq(workOrders.kind, "drift_investigation"));
    expect(drift.map((d) => d.title)).toContain("Critical-phase spread rising");
    const breakdowns = await t.db.select().from(workOrders).where(eq(workOrders.breakdown, true));
    expect(breakdowns.some((b) => b.downtimeMinutes! > 0)).toBe(true);
  });
});
