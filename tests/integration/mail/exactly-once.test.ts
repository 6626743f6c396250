import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { outbox } from "@/db/schema/mail";
import { acquireLease, claimOutbox, releaseLease } from "@/db/queries/outbox";
import { drainOutbox, SENDING_TIMEOUT_MS } from "@/lib/jobs/drain";
import { messageIdFor } from "@/lib/mail/outbox-policy";
import { mailHarness, subscribe, at } from "./mail-harness";

// Each message goes out exactly once, however the tick is repeated, raced or interrupted.
let h: Awaited<ReturnType<typeof mailHarness>>;
const DAILY = { schedule: "FREQ=DAILY", sendAt: "07:00" };
const created = at("2027-01-01T00:00:00Z");

beforeAll(async () => {
  h = await mailHarness(2752);
  for (const email of ["tech@brightwater.example", "engineer@brightwater.example", "manager@brightwater.example"]) {
    await subscribe(h.db, email, "my_work_daily", { ...DAILY, createdAt: created });
  }
});
afterAll(() => h.close());

const countBy = (rows: { envelopeTo: string }[]) => rows.reduce<Record<string, number>>((m, r) => ({ ...m, [r.envelopeTo]: (m[r.envelopeTo] ?? 0) + 1 }), {});

describe("exactly once", () => {
  it("running the tick twice sends each message once", async () => {
    const first = await h.tick(at("2027-01-05T07:00:00Z"));
    const second = await h.tick(at("2027-01-05T07:00:00Z"));
    expect(first).toMatchObject({ enqueued: 3, sent: 3, failed: 0 });
    expect(second).toMatchObject({ enqueued: 0, sent: 0, failed: 0 });
    expect(countBy(await h.received())).toEqual({ "tech@brightwater.example": 1, "engineer@brightwater.example": 1, "manager@brightwater.example": 1 });
  });

  it("two instances ticking at once: one holds the lease, each message is sent once", async () => {
    const now = at("2027-01-06T07:00:00Z");
    const [a, b] = await Promise.all([h.tick(now, "instance-a"), h.tick(now, "instance-b")]);
    expect([a.skipped, b.skipped].filter(Boolean)).toEqual(["lease_held"]);
    expect(a.sent + b.sent).toBe(3);
    const rows = (await h.received()).filter((m) => m.subject?.includes("Wednesday 6 January 2027"));
    expect(countBy(rows)).toEqual({ "tech@brightwater.example": 1, "engineer@brightwater.example": 1, "manager@brightwater.example": 1 });
  });

  it("even without the lease, two drains racing never claim the same row", async () => {
    const now = at("2027-01-07T07:00:00Z");
    // Enqueue through a tick whose drain has nothing to send to yet: all three go pending.
    await h.stopSink();
    await h.tick(now);
    await h.startSink();
    const later = new Date(now.getTime() + 60_000);
    const from = "Ovenward <ovenward@brightwater.example>";
    const [x, y] = await Promise.all([drainOutbox(h.db, { now: later, transport: h.transport, from }), drainOutbox(h.db, { now: later, transport: h.transport, from })]);
    expect(x.sent + y.sent).toBe(3);
    const rows = (await h.received()).filter((m) => m.subject?.includes("Thursday 7 January 2027"));
    expect(rows).toHaveLength(3);
  });

  it("a crash after claiming never skips and never sends twice", async () => {
    const now = at("2027-01-08T07:00:00Z");
    await h.stopSink();
    await h.tick(now); // three rows pending (the sink was away)
    await h.startSink();
    // A tick claims the rows, then "dies" before sending anything.
    const claimed = await claimOutbox(h.db, { now: new Date(now.getTime() + 60_000), leaseToken: "crashed-tick", staleBefore: new Date(0), limit: 10 });
    expect(claimed).toHaveLength(3);
    const fridays = async () => (await h.received()).filter((m) => m.subject?.includes("Friday 8 January 2027")).length;
    // Soon after, the rows are still another tick's: not sent again, not lost.
    expect(await h.tick(new Date(now.getTime() + 2 * 60_000))).toMatchObject({ sent: 0 });
    expect(await fridays()).toBe(0);
    // Once the claim is older than the timeout, the next tick takes them over and sends once.
    expect(await h.tick(new Date(now.getTime() + 60_000 + SENDING_TIMEOUT_MS))).toMatchObject({ sent: 3 });
    expect(await h.tick(new Date(now.getTime() + 2 * SENDING_TIMEOUT_MS))).toMatchObject({ sent: 0 });
    expect(await fridays()).toBe(3);
    // The crashed tick's late write cannot overwrite the outcome: its lease token is gone.
    const [row] = await h.db.select().from(outbox).where(eq(outbox.id, claimed[0].id));
    expect(row.state).toBe("sent");
    expect(row.leaseToken).toBeNull();
  });

  it("the lease: one holder until it expires or is released; a release by another is ignored", async () => {
    const name = "lease-test";
    const t = at("2027-02-01T00:00:00Z");
    const plus = (ms: number) => new Date(t.getTime() + ms);
    expect(await acquireLease(h.db, { name, holder: "a", now: t, ttlMs: 60_000 })).toBe(true);
    expect(await acquireLease(h.db, { name, holder: "b", now: plus(59_000), ttlMs: 60_000 })).toBe(false);
    expect(await acquireLease(h.db, { name, holder: "a", now: plus(59_000), ttlMs: 60_000 })).toBe(true); // renewal
    expect(await acquireLease(h.db, { name, holder: "b", now: plus(100_000), ttlMs: 60_000 })).toBe(false); // renewed to 119 s
    expect(await acquireLease(h.db, { name, holder: "b", now: plus(120_000), ttlMs: 60_000 })).toBe(true); // expired
    await releaseLease(h.db, { name, holder: "a" });
    expect(await acquireLease(h.db, { name, holder: "a", now: plus(121_000), ttlMs: 60_000 })).toBe(false);
    await releaseLease(h.db, { name, holder: "b" });
    expect(await acquireLease(h.db, { name, holder: "a", now: plus(121_000), ttlMs: 60_000 })).toBe(true);
  });

  it("a drain that lost its lease stops before claiming more", async () => {
    const now = at("2027-01-09T07:00:00Z");
    await h.stopSink();
    await h.tick(now);
    await h.startSink();
    const from = "Ovenward <ovenward@brightwater.example>";
    const later = new Date(now.getTime() + 60_000);
    expect(await drainOutbox(h.db, { now: later, transport: h.transport, from, keepGoing: async () => false })).toEqual({ sent: 0, failed: 0 });
    expect(await drainOutbox(h.db, { now: later, transport: h.transport, from, keepGoing: async () => true })).toEqual({ sent: 3, failed: 0 });
  });

  it("every copy of a message carries the Message-ID derived from its idempotency key", async () => {
    const rows = await h.outboxRows();
    const received = await h.received();
    expect(received).toHaveLength(rows.length);
    const ids = received.map((m) => (m.headers as Record<string, string>)["message-id"]);
    expect(new Set(ids).size).toBe(rows.length);
    for (const r of rows) expect(ids).toContain(messageIdFor(r.idempotencyKey));
  });
});
