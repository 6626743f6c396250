import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SMTPServer } from "smtp-server";
import { and, eq } from "drizzle-orm";
import { outbox, subscriptions } from "@/db/schema/mail";
import { unsubscribeWithToken } from "@/lib/unsubscribe";
import { signUnsubscribeToken } from "@/lib/mail-token";
import { mailHarness, subscribe, userId, at } from "./mail-harness";

let h: Awaited<ReturnType<typeof mailHarness>>;
const WEEKLY = { schedule: "FREQ=WEEKLY;BYDAY=MO", sendAt: "07:30" };
const MIN = 60_000;

beforeAll(async () => {
  h = await mailHarness(2753);
  await subscribe(h.db, "manager@brightwater.example", "fleet_digest", { ...WEEKLY, createdAt: at("2027-01-01T00:00:00Z") });
});
afterAll(() => h.close());

describe("a sink that refuses", () => {
  const t0 = at("2027-01-04T07:30:00Z");

  it("leaves the message pending with its attempts and error; backoff 1, 2, 4 minutes", async () => {
    await h.stopSink();
    // (The tick also generates the seeded plans' work orders; only the mail counts matter here.)
    expect(await h.tick(t0)).toMatchObject({ enqueued: 1, sent: 0, failed: 1 });
    let [row] = await h.outboxRows();
    expect(row).toMatchObject({ state: "pending", attempts: 1 });
    expect(row.lastError).toMatch(/ECONNREFUSED|ESOCKET|ECONNECTION/);
    // Base 1 minute, doubling: next tries at +1, then +1+2 = +3, then +3+4 = +7 minutes.
    expect(row.nextAttemptAt).toEqual(new Date(t0.getTime() + 1 * MIN));
    expect(await h.tick(new Date(t0.getTime() + 59_000))).toMatchObject({ sent: 0, failed: 0 });
    expect(await h.tick(new Date(t0.getTime() + 1 * MIN))).toMatchObject({ failed: 1 });
    [row] = await h.outboxRows();
    expect(row).toMatchObject({ attempts: 2, nextAttemptAt: new Date(t0.getTime() + 3 * MIN) });
    expect(await h.tick(new Date(t0.getTime() + 3 * MIN))).toMatchObject({ failed: 1 });
    [row] = await h.outboxRows();
    expect(row).toMatchObject({ attempts: 3, nextAttemptAt: new Date(t0.getTime() + 7 * MIN) });
    expect(await h.received()).toHaveLength(0);
  });

  it("goes out once the sink is back", async () => {
    await h.startSink();
    expect(await h.tick(new Date(t0.getTime() + 7 * MIN))).toMatchObject({ sent: 1, failed: 0 });
    expect(await h.tick(new Date(t0.getTime() + 60 * MIN))).toMatchObject({ sent: 0 });
    const [row] = await h.outboxRows();
    expect(row).toMatchObject({ state: "sent", attempts: 4 });
    expect(await h.received()).toHaveLength(1);
  });

  it("a server that answers 451 is retried; one that answers 550 marks the message failed", async () => {
    // A second server on its own port whose onData rejects, in place of the sink.
    await h.stopSink();
    let code = 451;
    const refusing = new SMTPServer({ authOptional: true, disabledCommands: ["STARTTLS"], logger: false, onData(stream, _s, cb) {
      stream.resume();
      stream.on("end", () => cb(Object.assign(new Error(code === 451 ? "Mailbox busy, try later" : "No such mailbox"), { responseCode: code })));
    } });
    await new Promise<void>((r) => refusing.listen(2753, "127.0.0.1", () => r()));
    const monday = at("2027-01-11T07:30:00Z");
    expect(await h.tick(monday)).toMatchObject({ enqueued: 1, failed: 1 });
    let row = (await h.outboxRows()).at(-1)!;
    expect(row).toMatchObject({ state: "pending", attempts: 1 });
    expect(row.smtpResponse).toMatch(/^451 /);
    code = 550;
    expect(await h.tick(new Date(monday.getTime() + MIN))).toMatchObject({ failed: 1 });
    row = (await h.outboxRows()).at(-1)!;
    expect(row).toMatchObject({ state: "failed", attempts: 2 });
    expect(row.lastError).toContain("No such mailbox");
    await new Promise<void>((r) => refusing.close(() => r()));
    await h.startSink();
    // failed is not retried by the sender (only an admin's resend brings it back).
    expect(await h.tick(new Date(monday.getTime() + 120 * MIN))).toMatchObject({ sent: 0 });
  });

  it("gives up after 8 attempts and keeps the error (dead)", async () => {
    await h.stopSink();
    const monday = at("2027-01-18T07:30:00Z");
    await h.tick(monday);
    const row = (await h.outboxRows()).at(-1)!;
    await h.db.update(outbox).set({ attempts: 7, nextAttemptAt: monday }).where(eq(outbox.id, row.id));
    expect(await h.tick(new Date(monday.getTime() + MIN))).toMatchObject({ failed: 1 });
    const dead = (await h.outboxRows()).at(-1)!;
    expect(dead).toMatchObject({ state: "dead", attempts: 8 });
    expect(dead.lastError).toMatch(/ECONNREFUSED|ESOCKET|ECONNECTION/);
    await h.startSink();
    expect(await h.tick(new Date(monday.getTime() + 24 * 60 * MIN))).toMatchObject({ sent: 0 });
  });
});

describe("unsubscribe through the signed link", () => {
  it("the received message carries the link and the one-click headers", async () => {
    const [m] = await h.received();
    // mailparser folds the List-* headers into one "list" entry (RFC 2369 / RFC 8058 names).
    const list = JSON.parse((m.headers as Record<string, string>).list);
    expect(list["unsubscribe-post"].name).toBe("List-Unsubscribe=One-Click");
    expect(list.unsubscribe.url).toMatch(/^http:\/\/localhost:3999\/unsubscribe\?token=/);
    expect(m.text).toContain(list.unsubscribe.url);
    expect(m.text).toContain("http://localhost:3999/settings/notifications");
  });

  it("a tampered or expired token is refused and changes nothing", async () => {
    const [m] = await h.received();
    const token = decodeURIComponent(/unsubscribe\?token=([^\s\]>)]+)/.exec(m.text!)![1]);
    const [body, sig] = token.split(".");
    const otherUser = Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(body, "base64url").toString()), u: await userId(h.db, "tech@brightwater.example") })).toString("base64url");
    await expect(unsubscribeWithToken(h.db, `${otherUser}.${sig}`, at("2027-01-20T00:00:00Z"))).rejects.toMatchObject({ code: "invalid_input", details: { reason: "bad_signature" } });
    await expect(unsubscribeWithToken(h.db, `${body}.${sig.slice(0, -2)}AA`, at("2027-01-20T00:00:00Z"))).rejects.toMatchObject({ details: { reason: "bad_signature" } });
    await expect(unsubscribeWithToken(h.db, "garbage", at("2027-01-20T00:00:00Z"))).rejects.toMatchObject({ details: { reason: "malformed" } });
    // The token was made on 4 January with a 60-day life: refused from 5 March 2027 07:30Z on.
    await expect(unsubscribeWithToken(h.db, token, at("2027-03-05T07:30:00Z"))).rejects.toMatchObject({ details: { reason: "expired" } });
    const expiredNow = signUnsubscribeToken({ userId: await userId(h.db, "manager@brightwater.example"), kind: "fleet_digest", expiresAt: at("2027-01-19T00:00:00Z") });
    await expect(unsubscribeWithToken(h.db, expiredNow, at("2027-01-19T00:00:00Z"))).rejects.toMatchObject({ details: { reason: "expired" } });
    const [sub] = await h.db.select().from(subscriptions).where(eq(subscriptions.kind, "fleet_digest"));
    expect(sub.enabled).toBe(true);
  });

  it("the link stops the next digest, and only that kind", async () => {
    const [m] = await h.received();
    const token = decodeURIComponent(/unsubscribe\?token=([^\s\]>)]+)/.exec(m.text!)![1]);
    const manager = await userId(h.db, "manager@brightwater.example");
    await subscribe(h.db, "manager@brightwater.example", "my_work_daily", { schedule: "FREQ=DAILY", sendAt: "07:00", createdAt: at("2027-01-24T00:00:00Z") });
    expect(await unsubscribeWithToken(h.db, token, at("2027-01-20T00:00:00Z"))).toEqual({ email: "manager@brightwater.example", kind: "fleet_digest" });
    const before = (await h.received()).length;
    const result = await h.tick(at("2027-01-25T07:30:00Z"));
    expect(result).toMatchObject({ enqueued: 1, sent: 1 }); // the daily list only
    const latest = (await h.received()).slice(before);
    expect(latest.map((x) => x.subject)).toEqual([expect.stringMatching(/^My work for Monday 25 January 2027/)]);
    const [digest] = await h.db.select().from(subscriptions).where(and(eq(subscriptions.userId, manager), eq(subscriptions.kind, "fleet_digest")));
    expect(digest.enabled).toBe(false);
  });
});
