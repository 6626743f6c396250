import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { alerts } from "@/db/schema/drift";
import { workOrders } from "@/db/schema/maintenance";
import { mailHarness, subscribe } from "./mail-harness";

// The tick wired to the plant's data: maintenance generation, the demo's drift alert, and the
// morning list built from real work orders — each exactly once.
let h: Awaited<ReturnType<typeof mailHarness>>;
const now = new Date();

beforeAll(async () => {
  h = await mailHarness(2758);
  const since = { createdAt: new Date(now.getTime() - 86_400_000) };
  await subscribe(h.db, "engineer@brightwater.example", "drift_alert", since);
  await subscribe(h.db, "engineer@brightwater.example", "calibration_due", since);
  await subscribe(h.db, "tech@brightwater.example", "overdue_work", since);
});
afterAll(() => h.close());

describe("the scheduler tick with the plant's sources", () => {
  it("generates owed work orders once, and e-mails the open drift alert once", async () => {
    const ordersBefore = await h.db.$count(workOrders);
    const later = new Date(now.getTime() + 20 * 86_400_000);
    const first = await h.tick(later);
    expect(first.generated).toBeGreaterThan(0);
    expect(await h.db.$count(workOrders)).toBe(ordersBefore + first.generated);
    const again = await h.tick(new Date(later.getTime() + 60_000));
    expect(again.generated).toBe(0);

    // The demo's alert was raised when the seed ran; a tick within two days mails it.
    const [alert] = await h.db.select().from(alerts).where(eq(alerts.toState, "act"));
    expect(alert).toBeTruthy();
    await h.tick(new Date(alert.raisedAt.getTime() + 60_000));
    await h.tick(new Date(alert.raisedAt.getTime() + 120_000));
    const mails = (await h.received()).filter((m) => m.envelopeTo.includes("engineer@brightwater.example") && /L2-RF1/.test(m.subject ?? ""));
    expect(mails).toHaveLength(1);
    expect(mails[0].text).toMatch(/out of window|projected/);
  });

  it("reminds of the probe set's calibration and of overdue work, once per reminder", async () => {
    const mine = async () => {
      const got = await h.received();
      return {
        // The demo's probe set A falls due within 30 days (db/seed/demo-story.ts).
        cal: got.filter((m) => m.envelopeTo.includes("engineer@") && /Probe set A/.test(`${m.subject} ${m.text}`)),
        overdue: got.filter((m) => m.envelopeTo.includes("tech@") && /overdue/i.test(m.subject ?? "")),
      };
    };
    const before = await mine();
    expect(before.cal.length).toBeGreaterThanOrEqual(1);
    expect(before.overdue.length).toBeGreaterThanOrEqual(1);
    expect(before.overdue[0].text).toMatch(/L\d-RF\d|LAB-B\d/);
    // Each reminder has its own key (30 days, 7 days; one per assignee per day): no repeats.
    expect(new Set(before.cal.map((m) => m.subject)).size).toBe(before.cal.length);
    const t = new Date(now.getTime() + 5 * 60_000);
    await h.tick(t);
    await h.tick(new Date(t.getTime() + 60_000));
    const after = await mine();
    expect(after.cal.length).toBe(before.cal.length);
    expect(after.overdue.length).toBe(before.overdue.length);
  });
});
