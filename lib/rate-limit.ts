/*
 * Token buckets: a key may spend `capacity` requests at once, and the bucket refills evenly over
 * `windowMs` (so `capacity` per window on average, with bursts up to `capacity`). The bucket
 * arithmetic is pure and takes `now`; RateLimiter keeps the buckets of one app instance in memory.
 *
 * Per instance, on purpose: Ovenward runs as one Next.js process (scripts/serve.mts) on an embedded
 * database, and keeping the buckets in that database would turn every API read into a write. With
 * several instances behind a balancer each counts alone, so a client gets up to N × the limit; the
 * per-account sign-in lockout (lib/auth/lockout.ts) is stored in the database and stays shared.
 */

export type Limit = { capacity: number; windowMs: number };
export type Bucket = { tokens: number; at: number };
export type Decision = { allowed: boolean; remaining: number; retryAfterMs: number };

function refilled(bucket: Bucket | undefined, limit: Limit, now: number): Bucket {
  if (!bucket) return { tokens: limit.capacity, at: now };
  const elapsed = Math.max(0, now - bucket.at);
  return { tokens: Math.min(limit.capacity, bucket.tokens + (elapsed * limit.capacity) / limit.windowMs), at: now };
}

/** Time until the bucket holds one whole token again. */
function waitMs(tokens: number, limit: Limit): number {
  return tokens >= 1 ? 0 : Math.ceil(((1 - tokens) * limit.windowMs) / limit.capacity);
}

/** Spends one token if there is one. */
export function take(bucket: Bucket | undefined, limit: Limit, now: number): { bucket: Bucket; decision: Decision } {
  const b = refilled(bucket, limit, now);
  if (b.tokens >= 1) {
    const after = { tokens: b.tokens - 1, at: now };
    return { bucket: after, decision: { allowed: true, remaining: Math.floor(after.tokens), retryAfterMs: 0 } };
  }
  return { bucket: b, decision: { allowed: false, remaining: 0, retryAfterMs: waitMs(b.tokens, limit) } };
}

const peekTokens = (b: Bucket, limit: Limit, now: number) => refilled(b, limit, now).tokens;

/** Whether a request would be allowed now, without spending anything. */
export function peek(bucket: Bucket | undefined, limit: Limit, now: number): Decision {
  const b = refilled(bucket, limit, now);
  return { allowed: b.tokens >= 1, remaining: Math.floor(b.tokens), retryAfterMs: waitMs(b.tokens, limit) };
}

export class RateLimiter {
  private buckets = new Map<string, Bucket>();
  constructor(
    readonly limit: Limit,
    /** Bounds memory when keys are many (e.g. addresses); the least recently used go first. */
    readonly maxKeys = 10_000,
  ) {}

  take(key: string, now = Date.now()): Decision {
    const { bucket, decision } = take(this.buckets.get(key), this.limit, now);
    this.buckets.delete(key); // re-inserted last: Map order is then least recently used first
    this.buckets.set(key, bucket);
    if (this.buckets.size > this.maxKeys) this.buckets.delete(this.buckets.keys().next().value!);
    return decision;
  }

  /** Gives back a token taken for an attempt that turned out not to count (never above capacity). */
  refund(key: string, now = Date.now()): void {
    const b = this.buckets.get(key);
    if (b) this.buckets.set(key, { tokens: Math.min(this.limit.capacity, peekTokens(b, this.limit, now) + 1), at: now });
  }

  peek(key: string, now = Date.now()): Decision {
    return peek(this.buckets.get(key), this.limit, now);
  }

  get size() {
    return this.buckets.size;
  }
}

/**
 * One limiter per name for the whole process. Next.js may load a module once per route bundle,
 * so the limiters live on globalThis (as the database handle does in db/index.ts); a changed
 * limit replaces the limiter.
 */
export function sharedLimiter(name: string, limit: Limit): RateLimiter {
  const g = globalThis as unknown as { __ovenwardLimiters?: Map<string, RateLimiter> };
  g.__ovenwardLimiters ??= new Map();
  const existing = g.__ovenwardLimiters.get(name);
  if (existing && existing.limit.capacity === limit.capacity && existing.limit.windowMs === limit.windowMs) return existing;
  const created = new RateLimiter(limit);
  g.__ovenwardLimiters.set(name, created);
  return created;
}

export const retryAfterSeconds = (ms: number) => Math.max(1, Math.ceil(ms / 1000));

/** "about 3 minutes" / "about 20 seconds", for messages. */
export function waitPhrase(ms: number): string {
  const s = retryAfterSeconds(ms);
  if (s < 90) return `about ${s} second${s === 1 ? "" : "s"}`;
  const m = Math.ceil(s / 60);
  return `about ${m} minute${m === 1 ? "" : "s"}`;
}
