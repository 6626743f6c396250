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
  await subscribe(h.db, "engineer@brightwater.example", "drift_alert", { createdAt: new Date(now.getTime() - 86_400_000) });
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
});
