import "server-only";
import { randomUUID } from "node:crypto";
import type { Db } from "@/db/client";
import { acquireLease, releaseLease } from "@/db/queries/outbox";
import { drainOutbox, type MailTransport } from "./drain";
import { enqueueDue } from "./enqueue";
import { TICK_STEPS } from "./tick-steps";
import "./plant-sources";

export const TICK_LEASE = "scheduler";
/** Longer than any tick should take; a tick that dies holding it blocks others this long at most. */
export const TICK_LEASE_TTL_MS = 5 * 60_000;

export type TickResult = {
  enqueued: number; sent: number; failed: number; generated: number;
  skipped?: "lease_held";
  /** When this tick held the lease (wall clock), so an operator can see ticks never overlap. */
  startedAt?: Date; finishedAt?: Date;
};

/**
 * One scheduler tick: take the lease (only one instance ticks at a time), run the generation
 * steps, enqueue due messages, drain the outbox, give the lease back.
 */
export async function runTick({ db, now = new Date(), transport, from, holder = randomUUID() }: { db: Db; now?: Date; transport: MailTransport; from: string; holder?: string }): Promise<TickResult> {
  if (!(await acquireLease(db, { name: TICK_LEASE, holder, now, ttlMs: TICK_LEASE_TTL_MS }))) {
    return { enqueued: 0, sent: 0, failed: 0, generated: 0, skipped: "lease_held" };
  }
  const startedAt = new Date();
  try {
    let generated = 0;
    for (const step of TICK_STEPS) generated += await step.run({ db, now });
    const enqueued = await enqueueDue(db, now);
    // Renewal counts the time this tick has taken on from `now`, so a mocked clock stays consistent.
    const started = Date.now();
    const renew = () => acquireLease(db, { name: TICK_LEASE, holder, now: new Date(now.getTime() + (Date.now() - started)), ttlMs: TICK_LEASE_TTL_MS });
    const { sent, failed } = await drainOutbox(db, { now, transport, from, keepGoing: renew });
    return { enqueued, sent, failed, generated, startedAt, finishedAt: new Date() };
  } finally {
    await releaseLease(db, { name: TICK_LEASE, holder });
  }
}
