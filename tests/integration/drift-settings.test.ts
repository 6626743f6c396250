import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, asc, eq } from "drizzle-orm";
import { actorFor, createTestDb } from "./test-db";
import { runAction } from "@/lib/action";
import { setBaselineByDatesDef, setDriftSettingsDef } from "@/lib/actions/drift";
import { ovens } from "@/db/schema/fleet";
import { runs } from "@/db/schema/runs";
import { driftPoints } from "@/db/schema/drift";
import { getDriftState } from "@/db/queries/drift";
import { ewmaExactLimits } from "@/lib/drift/ewma";

// Per-oven detector settings and an engineer's baseline: both rebuild the stored drift state.
let t: Awaited<ReturnType<typeof createTestDb>>;
let oven = 0;
beforeAll(async () => {
  t = await createTestDb();
  [{ id: oven }] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "L2-RF2"));
});
afterAll(() => t.close());

const firstPoint = () => t.db.select().from(driftPoints).where(and(eq(driftPoints.ovenId, oven), eq(driftPoints.metric, "deltaTPeak"))).orderBy(asc(driftPoints.at)).limit(1);

describe("drift settings per oven", () => {
  it("rebuilds the EWMA with the oven's own λ and L (limits as the exact formula gives)", async () => {
    const engineer = await actorFor(t.db, "engineer");
    const r = await runAction(setDriftSettingsDef, engineer, { ovenId: String(oven), lambda: "0.1", L: "2.5", cusumK: "0.5", cusumH: "5" }, t.db);
    expect(r).toMatchObject({ ok: true });
    const [p] = await firstPoint();
    const { baseline } = (await getDriftState(t.db, oven, "deltaTPeak"))!;
    const expected = ewmaExactLimits(baseline.mean, baseline.sigma, 0.1, 2.5, 1);
    expect(p.ewmaUcl).toBeCloseTo(expected.ucl, 12);
    expect(p.ewmaLcl).toBeCloseTo(expected.lcl, 12);
  });

  it("refuses a λ outside (0, 1], naming the field, and changes nothing", async () => {
    const engineer = await actorFor(t.db, "engineer");
    const [before] = await firstPoint();
    const r = await runAction(setDriftSettingsDef, engineer, { ovenId: String(oven), lambda: "1.5", L: "3", cusumK: "0.5", cusumH: "5" }, t.db);
    expect(r).toMatchObject({ ok: false, code: "invalid_input", fields: { lambda: "at most 1" } });
    expect((await firstPoint())[0]).toEqual(before);
  });

  it("takes a baseline from the runs between two dates", async () => {
    const engineer = await actorFor(t.db, "engineer");
    const all = await t.db.select({ id: runs.id, at: runs.runAt }).from(runs).where(eq(runs.ovenId, oven)).orderBy(asc(runs.runAt));
    const from = all[100].at;
    const to = all[119].at;
    const r = await runAction(setBaselineByDatesDef, engineer, { ovenId: String(oven), metric: "deltaTPeak", from: from.toISOString(), to: to.toISOString() }, t.db);
    expect(r).toMatchObject({ ok: true, data: { n: 20 } });
    const { baseline } = (await getDriftState(t.db, oven, "deltaTPeak"))!;
    expect([baseline.fromRunId, baseline.toRunId]).toEqual([all[100].id, all[119].id]);
    const tooNarrow = await runAction(setBaselineByDatesDef, engineer, { ovenId: String(oven), metric: "deltaTPeak", from: "2001-01-01", to: "2001-01-02" }, t.db);
    expect(tooNarrow).toMatchObject({ ok: false, code: "invalid_input" });
  });
});
