import { env } from "@/lib/env";
import { sharedLimiter, waitPhrase, type Decision, type Limit } from "@/lib/rate-limit";

/*
 * Sign-in attempts per client address: failed password sign-ins and every magic-link request
 * (known address or not, so the limit reveals nothing about who has an account) share one
 * bucket of SIGN_IN_RATE_LIMIT per 15 minutes. Successful password sign-ins give their attempt back, so a
 * plant where everyone signs in through one address at shift change is not slowed.
 * The per-account lockout (lockout.ts) is the other half: it stops guessing one account's
 * password from many addresses. Buckets are per app instance (see lib/rate-limit.ts).
 */

export const SIGN_IN_WINDOW_MS = 15 * 60_000;

export function signInLimit(): Limit | null {
  const n = env().SIGN_IN_RATE_LIMIT;
  return n > 0 ? { capacity: n, windowMs: SIGN_IN_WINDOW_MS } : null;
}

/**
 * The client's address from X-Forwarded-For. Next.js fills that header with the socket address
 * only when the request has none, and each proxy appends the address it saw, so the entry
 * `hops` places from the right is the one the nearest trusted proxy vouches for. Entries further
 * left came from the client and could be anything. Without a proxy (hops 1, nothing appended) a
 * client that sends its own header chooses its key; put the app behind the TLS proxy it needs
 * anyway for Secure cookies.
 */
export function clientAddress(headers: Headers, hops = env().TRUSTED_PROXY_HOPS): string {
  const chain = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  const picked = chain.length ? chain[Math.max(0, chain.length - hops)] : (headers.get("x-real-ip") ?? "unknown");
  // IPv4-mapped IPv6 and plain IPv4 are one client.
  return picked.replace(/^::ffff:/i, "").slice(0, 64).toLowerCase();
}

const limiter = () => {
  const limit = signInLimit();
  return limit ? sharedLimiter("sign-in", limit) : null;
};
const OPEN: Decision = { allowed: true, remaining: Infinity, retryAfterMs: 0 };

/** May this address try again now? Spends nothing. */
export function signInAllowed(headers: Headers, now = Date.now()): Decision {
  return limiter()?.peek(clientAddress(headers), now) ?? OPEN;
}

/** Counts one attempt (a password sign-in, a magic-link request); refused when none are left. */
export function countSignInAttempt(headers: Headers, now = Date.now()): Decision {
  return limiter()?.take(clientAddress(headers), now) ?? OPEN;
}

/**
 * A password sign-in that succeeded gives its attempt back. Taking first and refunding on success
 * (rather than counting failures afterwards) keeps the limit exact when many attempts run at once.
 */
export function refundSignInAttempt(headers: Headers, now = Date.now()): void {
  limiter()?.refund(clientAddress(headers), now);
}

export function signInLimitedMessage(retryAfterMs: number): string {
  return `Too many sign-in attempts from your network. Wait ${waitPhrase(retryAfterMs)} and try again, or ask an admin to help.`;
}
