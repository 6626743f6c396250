/*
 * Keys and retry policy for the outbox. A key names one message for all time:
 * (kind, recipient, occurrence) for scheduled mail, (kind, recipient, event) for the rest.
 */

export function scheduledKey(kind: string, userId: string, occurrence: Date): string {
  return `${kind}:${userId}:${occurrence.toISOString()}`;
}

export function eventKey(kind: string, userId: string, event: string): string {
  return `${kind}:${userId}:${event}`;
}

/**
 * The Message-ID header, derived from the key alone: a message sent twice (see lib/jobs/drain.ts
 * for when that can happen) carries the same Message-ID both times, so a receiving side can drop
 * the copy. Characters outside RFC 5322's dot-atom are replaced.
 */
export function messageIdFor(key: string, domain = "ovenward.mail"): string {
  return `<${key.replace(/[^A-Za-z0-9!#$%&'*+\-/=?^_`{|}~.]/g, ".").replace(/\.{2,}/g, ".")}@${domain}>`;
}

export const RETRY = { baseMs: 60_000, factor: 2, capMs: 3_600_000, maxAttempts: 8 } as const;

/** Delay before the next try after `attempts` failed tries: 1, 2, 4, … minutes, at most an hour. */
export function backoffMs(attempts: number): number {
  const n = Math.max(1, attempts);
  return Math.min(RETRY.capMs, RETRY.baseMs * RETRY.factor ** (n - 1));
}

export type FailureOutcome = { state: "pending"; nextAttemptAt: Date } | { state: "dead"; nextAttemptAt: Date };

/** After a failed try (attempts already counts it): try again later, or give up and keep the error. */
export function afterFailure(attempts: number, now: Date): FailureOutcome {
  if (attempts >= RETRY.maxAttempts) return { state: "dead", nextAttemptAt: now };
  return { state: "pending", nextAttemptAt: new Date(now.getTime() + backoffMs(attempts)) };
}
