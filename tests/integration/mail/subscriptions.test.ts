import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { runAction } from "@/lib/action";
import { updateMailTimeZoneDef, updateSubscriptionDef } from "@/lib/actions/mail";
import { subscriptions } from "@/db/schema/mail";
import { users } from "@/db/schema/users";
import { seedMail } from "@/db/seed/seed-mail";
import { actorFor, createTestDb } from "../test-db";

let t: Awaited<ReturnType<typeof createTestDb>>;
beforeAll(async () => {
  t = await createTestDb();
});
afterAll(() => t.close());

const idOf = async (email: string) => (await t.db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0].id;
const sub = async (email: string, kind: "fleet_digest" | "my_work_daily") =>
  (await t.db.select().from(subscriptions).where(and(eq(subscriptions.userId, await idOf(email)), eq(subscriptions.kind, kind))))[0];

describe("subscriptions", () => {
  it("the seed gives each demo person the role's defaults, once", async () => {
    expect(await t.db.$count(subscriptions)).toBe(25); // 5 people × 5 kinds
    expect(await seedMail(t.db)).toEqual({ subscriptions: 0 });
    expect(await sub("manager@brightwater.example", "fleet_digest")).toMatchObject({ enabled: true, schedule: "FREQ=WEEKLY;BYDAY=MO", sendAt: "07:30" });
    expect(await sub("tech@brightwater.example", "my_work_daily")).toMatchObject({ enabled: true, schedule: "FREQ=WEEKLY;BYDAY=MO,TU,WE,TH,FR", sendAt: "06:45" });
  });

  it("a person changes their own schedule from the form's fields", async () => {
    const tech = await actorFor(t.db, "technician");
    const r = await runAction(updateSubscriptionDef, tech, { userId: tech.userId, kind: "my_work_daily", enabled: "on", sendAt: "06:15", day_MO: "on", day_WE: "on" }, t.db);
    expect(r).toMatchObject({ ok: true, data: { schedule: "FREQ=WEEKLY;BYDAY=MO,WE" } });
    expect(await sub("tech@brightwater.example", "my_work_daily")).toMatchObject({ sendAt: "06:15" });
  });

  it("says which field is wrong", async () => {
    const tech = await actorFor(t.db, "technician");
    expect(await runAction(updateSubscriptionDef, tech, { userId: tech.userId, kind: "my_work_daily", enabled: "on", sendAt: "6am", day_MO: "on" }, t.db)).toMatchObject({
      ok: false,
      code: "invalid_input",
      fields: { sendAt: "a time as HH:mm" },
    });
    expect(await runAction(updateSubscriptionDef, tech, { userId: tech.userId, kind: "my_work_daily", enabled: "on", sendAt: "06:00" }, t.db)).toMatchObject({
      ok: false,
      fields: { weekdays: "pick at least one weekday" },
    });
    expect(await runAction(updateMailTimeZoneDef, tech, { userId: tech.userId, timeZone: "Mars/Olympus" }, t.db)).toMatchObject({ ok: false, fields: { timeZone: expect.any(String) } });
  });

  it("only a manager (or admin) changes someone else's", async () => {
    const tech = await actorFor(t.db, "technician");
    const manager = await actorFor(t.db, "manager");
    const managerId = await idOf("manager@brightwater.example");
    expect(await runAction(updateSubscriptionDef, tech, { userId: managerId, kind: "fleet_digest", sendAt: "07:30", day_MO: "on" }, t.db)).toMatchObject({ ok: false, code: "forbidden" });
    expect(await sub("manager@brightwater.example", "fleet_digest")).toMatchObject({ enabled: true });
    const r = await runAction(updateSubscriptionDef, manager, { userId: tech.userId, kind: "my_work_daily", sendAt: "06:45", day_TU: "on" }, t.db);
    expect(r).toMatchObject({ ok: true, data: { enabled: false } });
    expect(await runAction(updateMailTimeZoneDef, manager, { userId: tech.userId, timeZone: "America/Chicago" }, t.db)).toMatchObject({ ok: true });
    expect((await t.db.select().from(users).where(eq(users.id, tech.userId)))[0].timeZone).toBe("America/Chicago");
  });
});
