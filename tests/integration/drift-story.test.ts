import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, asc, desc, eq, inArray, isNull } from "drizzle-orm";
import { runs } from "@/db/schema/runs";
import { actorFor, createTestDb } from "./test-db";
import { ovens } from "@/db/schema/fleet";
import { changes } from "@/db/schema/changes";
import { alerts, driftPoints } from "@/db/schema/drift";
import { getTrend } from "@/db/queries/trends";
import { changeImpact } from "@/db/queries/impact";
import { computeOvenHealth } from "@/db/queries/health";
import { fleetView } from "@/db/queries/fleet-view";
import { acknowledgeAlert, listAlerts } from "@/db/queries/alerts";
import { applyRunToDrift, recomputeOven } from "@/db/queries/drift";

// The demo's story, read back through the same queries the API and pages use. The data is
// invented (the seed's model); the statistics behind each check are tested against published
// examples in tests/reference/drift.
let t: Awaited<ReturnType<typeof createTestDb>>;
const now = new Date();
const idOf = async (tag: string) => (await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, tag)))[0].id;

beforeAll(async () => {
  t = await createTestDb();
});
afterAll(() => t.close());

describe("L2-RF1: the wearing blower bearing", () => {
  it("fires the EWMA chart on critical spread during its last three months, and keeps firing", async () => {
    const trend = await getTrend(t.db, await idOf("L2-RF1"), "criticalSpread", {}, now);
    const threeMonthsAgo = now.getTime() - 92 * 86_400_000;
    const monitored = trend.points.filter((p) => p.ewma !== null);
    const firing = (p: (typeof monitored)[number]) => p.signals.includes("ewma");
    // The run from which the EWMA stays beyond its limit to the end.
    let start = monitored.length;
    while (start > 0 && firing(monitored[start - 1])) start--;
    expect(monitored.length - start).toBeGreaterThan(10);
    expect(Date.parse(monitored[start].runAt)).toBeGreaterThanOrEqual(threeMonthsAgo);
    // Before the wear the oven was in control: EWMA signals there are the odd false alarm.
    const early = monitored.filter((p) => Date.parse(p.runAt) < threeMonthsAgo);
    expect(early.filter(firing).length / early.length).toBeLessThan(0.1);
  });

  it("projects the crossing of its window limit within 30 days, and its health says so", async () => {
    const trend = await getTrend(t.db, await idOf("L2-RF1"), "criticalSpread", {}, now);
    expect(trend.projection).not.toBeNull();
    expect(trend.projection!.slopePerDay).toBeGreaterThan(0);
    expect(trend.projection!.daysToLimit!).toBeGreaterThan(0);
    expect(trend.projection!.daysToLimit!).toBeLessThanOrEqual(30);
    const health = await computeOvenHealth(t.db, await idOf("L2-RF1"), now);
    expect(["watch", "act"]).toContain(health.state);
    expect(health.reasons.some((r) => /Critical-phase spread is rising; projected to reach 13\.0 °C in about \d+ days/.test(r))).toBe(true);
  });

  it("is listed first in the fleet view, with an open alert, while the steady ovens stay Steady", async () => {
    const fleet = await fleetView(t.db, {}, now);
    expect(fleet[0].tag).toBe("L2-RF1");
    expect(fleet[0].openAlerts).toBeGreaterThan(0);
    expect(fleet.filter((o) => o.tag.startsWith("L1") || o.tag === "L2-RF2").map((o) => o.state)).toEqual(["steady", "steady", "steady"]);
  });
});

describe("LAB-B1: baffle, added fan, re-shaped fan", () => {
  it("shows each improvement as significant and larger than the measurement uncertainty", async () => {
    const steps = await t.db.select().from(changes).where(eq(changes.ovenId, await idOf("LAB-B1"))).orderBy(asc(changes.at));
    expect(steps.map((c) => c.area)).toEqual(["baffle", "fan", "fan"]);
    const means: number[] = [];
    for (const c of steps) {
      const impact = await changeImpact(t.db, c.id, "deltaTPeak", { before: 10, after: 10 });
      expect(impact.difference!).toBeLessThan(0);
      expect(impact.p!).toBeLessThan(0.001);
      expect(impact.resolvable).toBe(true);
      expect(Math.abs(impact.difference!)).toBeGreaterThan(impact.expandedUncertainty!);
      expect(impact.summary).toMatch(/lower since the change — more than the measurement can be wrong by/);
      means.push(impact.before.mean!, impact.after.mean!);
    }
    // The brief's story: about 40 °C, then 12–15 °C, then about 7 °C, then under 5 °C.
    expect(means[0]).toBeGreaterThan(30);
    expect(means[1]).toBeGreaterThan(11);
    expect(means[1]).toBeLessThan(16);
    expect(means[3]).toBeGreaterThan(5);
    expect(means[3]).toBeLessThan(9);
    expect(means[5]).toBeLessThan(5);
  });
});

describe("L1-RF2: the controller firmware update", () => {
  it("shows the shorter time above liquidus", async () => {
    const [fw] = await t.db.select().from(changes).where(and(eq(changes.ovenId, await idOf("L1-RF2")), eq(changes.area, "controller_firmware")));
    const impact = await changeImpact(t.db, fw.id, "talMin", { before: 10, after: 10 });
    expect(impact.difference!).toBeLessThan(-2);
    expect(impact.difference!).toBeGreaterThan(-10);
    expect(impact.p!).toBeLessThan(0.05);
    expect(impact.resolvable).toBe(true);
  });
});

describe("incremental drift state", () => {
  it("stepping the last runs one by one gives exactly what a rebuild from the whole history gives", async () => {
    const oven = await idOf("L2-RF1");
    const points = () => t.db.select().from(driftPoints).where(eq(driftPoints.ovenId, oven)).orderBy(asc(driftPoints.metric), asc(driftPoints.at));
    const rebuilt = await points();
    // Hide the last 8 runs, rebuild without them, then bring them back one at a time as uploads do.
    const last = await t.db.select().from(runs).where(and(eq(runs.ovenId, oven), isNull(runs.deletedAt))).orderBy(desc(runs.runAt)).limit(8);
    await t.db.update(runs).set({ deletedAt: now }).where(inArray(runs.id, last.map((r) => r.id)));
    await t.db.transaction((tx) => recomputeOven(tx, oven));
    expect((await points()).length).toBeLessThan(rebuilt.length);
    for (const r of [...last].reverse()) {
      await t.db.update(runs).set({ deletedAt: null }).where(eq(runs.id, r.id));
      await t.db.transaction((tx) => applyRunToDrift(tx, r));
    }
    expect(await points()).toEqual(rebuilt);
  });
});

describe("alerts", () => {
  it("are acknowledged once with a note, and can open a drift investigation", async () => {
    const [open] = await listAlerts(t.db, { status: "open" });
    expect(open).toBeTruthy();
    const tech = await actorFor(t.db, "technician");
    const r = await acknowledgeAlert(t.db, open.alert.id, { note: "Blower bearing noisy; investigation opened.", openWorkOrder: true }, tech);
    expect(r.workOrderId).toBeGreaterThan(0);
    await expect(acknowledgeAlert(t.db, open.alert.id, { note: "again" }, tech)).rejects.toThrow(/already acknowledged/);
    const [row] = await t.db.select().from(alerts).where(eq(alerts.id, open.alert.id));
    expect(row.acknowledgedBy).toBe(tech.userId);
    expect(row.workOrderId).toBe(r.workOrderId);
  });
});
