import { describe, expect, it } from "vitest";
import { afterFailure, backoffMs, eventKey, messageIdFor, RETRY, scheduledKey } from "@/lib/mail/outbox-policy";

const MIN = 60_000;

describe("backoff: base 1 minute, doubling, capped at 1 hour, dead after 8 attempts", () => {
  it("waits 1, 2, 4, 8, 16, 32, 60, 60 minutes (2^(n−1) min: 64 > 60 is capped)", () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8].map((n) => backoffMs(n) / MIN)).toEqual([1, 2, 4, 8, 16, 32, 60, 60]);
  });
  it("retries up to the 7th failure, gives up at the 8th", () => {
    const now = new Date("2027-01-04T07:30:00Z");
    expect(afterFailure(7, now)).toEqual({ state: "pending", nextAttemptAt: new Date("2027-01-04T08:30:00Z") });
    expect(afterFailure(8, now)).toEqual({ state: "dead", nextAttemptAt: now });
    expect(RETRY.maxAttempts).toBe(8);
    // Total wait before giving up: 1+2+4+8+16+32+60 = 123 minutes.
    expect([1, 2, 3, 4, 5, 6, 7].reduce((s, n) => s + backoffMs(n), 0)).toBe(123 * MIN);
  });
});

describe("idempotency keys and Message-ID", () => {
  const uid = "3f2a5c1e-0b7d-4e55-9c1a-7d2e8f9a0b1c";
  it("name kind, recipient and occurrence (or event)", () => {
    expect(scheduledKey("fleet_digest", uid, new Date("2027-01-04T07:30:00Z"))).toBe(`fleet_digest:${uid}:2027-01-04T07:30:00.000Z`);
    expect(eventKey("drift_alert", uid, "alert:42")).toBe(`drift_alert:${uid}:alert:42`);
  });
  it("the Message-ID is the key in RFC 5322 msg-id form (dot-atom-text @ domain), the same every time", () => {
    const key = scheduledKey("fleet_digest", uid, new Date("2027-01-04T07:30:00Z"));
    const id = messageIdFor(key);
    expect(id).toBe(`<fleet_digest.${uid}.2027-01-04T07.30.00.000Z@ovenward.mail>`);
    expect(messageIdFor(key)).toBe(id);
    // RFC 5322 §3.2.3 atext, dots only between atoms.
    expect(id).toMatch(/^<[A-Za-z0-9!#$%&'*+\-/=?^_`{|}~]+(\.[A-Za-z0-9!#$%&'*+\-/=?^_`{|}~]+)*@[a-z.]+>$/);
    expect(messageIdFor(eventKey("drift_alert", uid, "alert:42"))).not.toBe(messageIdFor(eventKey("drift_alert", uid, "alert:43")));
  });
});
