import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { MAIL_EVENT_SOURCES } from "@/lib/jobs/mail-sources";
import { PreviewProps as driftSample } from "@/emails/drift-alert";
import { mailHarness, subscribe, userId, at } from "./mail-harness";

// The extension point the drift module will use: a source reports events; subscribers get each
// once, however often the source keeps reporting it.
let h: Awaited<ReturnType<typeof mailHarness>>;
beforeAll(async () => {
  h = await mailHarness(2754);
  await subscribe(h.db, "engineer@brightwater.example", "drift_alert", { createdAt: at("2027-01-01T00:00:00Z") });
  await subscribe(h.db, "manager@brightwater.example", "drift_alert", { createdAt: at("2027-01-01T00:00:00Z") });
});
afterEach(() => {
  MAIL_EVENT_SOURCES.drift_alert.length = 0;
});
afterAll(() => h.close());

const { links: _links, ...props } = driftSample;

describe("event-driven mail (drift alerts)", () => {
  it("each subscriber gets an alert once, even when the source reports it on every tick", async () => {
    MAIL_EVENT_SOURCES.drift_alert.push(async () => [{ key: "alert:12", audience: "subscribers", props }]);
    expect(await h.tick(at("2027-02-01T09:12:00Z"))).toMatchObject({ enqueued: 2, sent: 2 });
    expect(await h.tick(at("2027-02-01T09:13:00Z"))).toMatchObject({ enqueued: 0, sent: 0 });
    const got = await h.received();
    expect(got.map((m) => m.envelopeTo).sort()).toEqual(["engineer@brightwater.example", "manager@brightwater.example"]);
    expect(got[0].subject).toBe("L2-RF1: Watch — critical-phase spread");
  });

  it("an alert for named people reaches only those who are subscribed", async () => {
    const tech = await userId(h.db, "tech@brightwater.example"); // not subscribed to drift alerts
    const engineer = await userId(h.db, "engineer@brightwater.example");
    MAIL_EVENT_SOURCES.drift_alert.push(async () => [{ key: "alert:13", audience: [tech, engineer], props }]);
    expect(await h.tick(at("2027-02-02T09:00:00Z"))).toMatchObject({ enqueued: 1, sent: 1 });
    const rows = await h.outboxRows();
    expect(rows.at(-1)!.idempotencyKey).toBe(`drift_alert:${engineer}:alert:13`);
  });
});
