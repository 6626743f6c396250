import { describe, expect, it } from "vitest";
import { peek, RateLimiter, take, waitPhrase, type Bucket } from "@/lib/rate-limit";
import { clientAddress } from "@/lib/auth/sign-in-limit";

// The token bucket, with `now` passed in. A bucket of 5 per minute refills one token every 12 s.
const LIMIT = { capacity: 5, windowMs: 60_000 };
const T0 = Date.parse("2026-03-02T08:00:00Z");

describe("token bucket", () => {
  it("allows a burst of `capacity`, then refuses with the wait until the next token", () => {
    let b: Bucket | undefined;
    const decisions = [];
    for (let i = 0; i < 6; i++) {
      const r = take(b, LIMIT, T0);
      b = r.bucket;
      decisions.push(r.decision);
    }
    expect(decisions.map((d) => d.allowed)).toEqual([true, true, true, true, true, false]);
    expect(decisions.map((d) => d.remaining)).toEqual([4, 3, 2, 1, 0, 0]);
    expect(decisions[5].retryAfterMs).toBe(12_000);
  });

  it("refills evenly: one token after 12 s, never above capacity", () => {
    let b: Bucket | undefined;
    for (let i = 0; i < 5; i++) b = take(b, LIMIT, T0).bucket;
    expect(peek(b, LIMIT, T0 + 11_999).allowed).toBe(false);
    expect(peek(b, LIMIT, T0 + 11_999).retryAfterMs).toBe(1);
    expect(peek(b, LIMIT, T0 + 12_000)).toMatchObject({ allowed: true, remaining: 1 });
    expect(peek(b, LIMIT, T0 + 10 * 60_000).remaining).toBe(5);
  });

  it("a refused request spends nothing, so waiting the announced time is enough", () => {
    let b: Bucket | undefined;
    for (let i = 0; i < 5; i++) b = take(b, LIMIT, T0).bucket;
    const refused = take(b, LIMIT, T0 + 6_000);
    expect(refused.decision).toMatchObject({ allowed: false, retryAfterMs: 6_000 });
    expect(take(refused.bucket, LIMIT, T0 + 12_000).decision.allowed).toBe(true);
  });

  it("a clock that steps back does not mint tokens", () => {
    let b: Bucket | undefined;
    for (let i = 0; i < 5; i++) b = take(b, LIMIT, T0).bucket;
    expect(peek(b, LIMIT, T0 - 3_600_000).allowed).toBe(false);
  });
});

describe("RateLimiter", () => {
  it("keeps one bucket per key", () => {
    const l = new RateLimiter({ capacity: 2, windowMs: 60_000 });
    expect([l.take("a", T0), l.take("a", T0), l.take("a", T0)].map((d) => d.allowed)).toEqual([true, true, false]);
    expect(l.take("b", T0).allowed).toBe(true);
    expect(l.peek("a", T0).allowed).toBe(false);
  });

  it("refund gives one token back, never above capacity (a sign-in that succeeded)", () => {
    const l = new RateLimiter({ capacity: 2, windowMs: 60_000 });
    l.take("a", T0);
    l.take("a", T0);
    expect(l.peek("a", T0).allowed).toBe(false);
    l.refund("a", T0);
    expect(l.peek("a", T0)).toMatchObject({ allowed: true, remaining: 1 });
    l.refund("a", T0);
    l.refund("a", T0);
    expect(l.peek("a", T0).remaining).toBe(2);
  });

  it("forgets the least recently used key beyond maxKeys (memory stays bounded)", () => {
    const l = new RateLimiter({ capacity: 1, windowMs: 60_000 }, 3);
    for (const k of ["a", "b", "c"]) l.take(k, T0);
    l.take("a", T0 + 1); // a is now the most recent
    l.take("d", T0 + 2); // evicts b
    expect(l.size).toBe(3);
    expect(l.peek("b", T0 + 3).allowed).toBe(true); // a fresh bucket
    expect(l.peek("a", T0 + 3).allowed).toBe(false);
  });

  it("words the wait for people", () => {
    expect(waitPhrase(400)).toBe("about 1 second");
    expect(waitPhrase(45_000)).toBe("about 45 seconds");
    expect(waitPhrase(14 * 60_000 + 1)).toBe("about 15 minutes");
  });
});

describe("client address for the sign-in limit", () => {
  const h = (xff?: string) => new Headers(xff === undefined ? {} : { "x-forwarded-for": xff });
  it("takes the entry the nearest trusted proxy appended, not what the client wrote", () => {
    expect(clientAddress(h("203.0.113.9"), 1)).toBe("203.0.113.9");
    expect(clientAddress(h("10.9.9.9, 198.51.100.4"), 1)).toBe("198.51.100.4"); // client forged 10.9.9.9; the proxy saw .4
    expect(clientAddress(h("1.1.1.1, 198.51.100.4, 10.0.0.2"), 2)).toBe("198.51.100.4"); // CDN + balancer
    expect(clientAddress(h("198.51.100.4"), 3)).toBe("198.51.100.4"); // fewer entries than hops: the leftmost
  });
  it("treats ::ffff:-mapped IPv4 as the same client, and no header as one unknown client", () => {
    expect(clientAddress(h("::ffff:127.0.0.1"), 1)).toBe("127.0.0.1");
    expect(clientAddress(h(), 1)).toBe("unknown");
  });
});
