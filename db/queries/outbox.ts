import "server-only";
import { and, desc, eq, inArray, lte, or, sql } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { outbox, schedulerLeases, type OutboxState } from "../schema/mail";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { notFound } from "@/lib/errors";

export type NewOutboxRow = typeof outbox.$inferInsert;

/** Queues a message unless one with the same idempotency key exists. True when it was queued. */
export async function enqueueOutbox(db: DbOrTx, row: NewOutboxRow): Promise<boolean> {
  const inserted = await db.insert(outbox).values(row).onConflictDoNothing({ target: outbox.idempotencyKey }).returning({ id: outbox.id });
  return inserted.length > 0;
}

/**
 * Claims up to `limit` rows in one UPDATE (SQLite runs it atomically): pending rows whose time
 * has come, and rows left in `sending` by a tick that died more than `staleBefore` ago. Each
 * claimed row gets this tick's lease token; only the holder of the token may finish it.
 */
export async function claimOutbox(db: DbOrTx, { now, leaseToken, staleBefore, limit }: { now: Date; leaseToken: string; staleBefore: Date; limit: number }) {
  const due = db
    .select({ id: outbox.id })
    .from(outbox)
    .where(or(and(eq(outbox.state, "pending"), lte(outbox.nextAttemptAt, now)), and(eq(outbox.state, "sending"), lte(outbox.claimedAt, staleBefore))))
    .orderBy(outbox.id)
    .limit(limit);
  return db
    .update(outbox)
    .set({ state: "sending", leaseToken, claimedAt: now, attempts: sql`${outbox.attempts} + 1` })
    .where(inArray(outbox.id, due))
    .returning();
}

/** Records a send; false when the claim was lost (another tick took the row over as stale). */
export async function markOutboxSent(db: DbOrTx, id: number, leaseToken: string, at: Date, smtpResponse: string) {
  const rows = await db
    .update(outbox)
    .set({ state: "sent", sentAt: at, smtpResponse, lastError: null, leaseToken: null })
    .where(and(eq(outbox.id, id), eq(outbox.leaseToken, leaseToken)))
    .returning({ id: outbox.id });
  return rows.length > 0;
}

export async function markOutboxFailed(
  db: DbOrTx,
  id: number,
  leaseToken: string,
  outcome: { state: Extract<OutboxState, "pending" | "failed" | "dead">; nextAttemptAt: Date; error: string; smtpResponse: string | null },
) {
  const rows = await db
    .update(outbox)
    .set({ state: outcome.state, nextAttemptAt: outcome.nextAttemptAt, lastError: outcome.error, smtpResponse: outcome.smtpResponse, leaseToken: null })
    .where(and(eq(outbox.id, id), eq(outbox.leaseToken, leaseToken)))
    .returning({ id: outbox.id });
  return rows.length > 0;
}

export async function listOutbox(db: DbOrTx, { state, limit = 200 }: { state?: OutboxState; limit?: number } = {}) {
  return db
    .select({
      id: outbox.id,
      kind: outbox.kind,
      to: outbox.to,
      subject: outbox.subject,
      state: outbox.state,
      attempts: outbox.attempts,
      lastError: outbox.lastError,
      sentAt: outbox.sentAt,
      createdAt: outbox.createdAt,
      nextAttemptAt: outbox.nextAttemptAt,
      smtpResponse: outbox.smtpResponse,
    })
    .from(outbox)
    .where(state ? eq(outbox.state, state) : undefined)
    .orderBy(desc(outbox.id))
    .limit(limit);
}
export type OutboxListRow = Awaited<ReturnType<typeof listOutbox>>[number];

/** An admin's resend: the same row (same key, same Message-ID) goes back to the queue with fresh attempts. */
export async function resendOutbox(db: DbOrTx, id: number, actor: Actor, now = new Date()) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(outbox).where(eq(outbox.id, id)).limit(1);
    if (!before) throw notFound("That message");
    if (before.state === "sending") return before;
    const [after] = await tx.update(outbox).set({ state: "pending", attempts: 0, nextAttemptAt: now, leaseToken: null, claimedAt: null }).where(eq(outbox.id, id)).returning();
    await recordAudit(tx, { actor, action: "outbox.resend", entity: "outbox", entityId: id, before: { state: before.state, attempts: before.attempts }, after: { state: after.state } });
    return after;
  });
}

/**
 * Takes or renews the named lease in one statement: it succeeds only when nobody holds it, the
 * holder's lease has expired, or we are the holder. Two instances racing get one winner.
 */
export async function acquireLease(db: DbOrTx, { name, holder, now, ttlMs }: { name: string; holder: string; now: Date; ttlMs: number }): Promise<boolean> {
  const expiresAt = new Date(now.getTime() + ttlMs);
  const rows = await db
    .insert(schedulerLeases)
    .values({ name, holder, expiresAt })
    .onConflictDoUpdate({
      target: schedulerLeases.name,
      set: { holder, expiresAt },
      setWhere: sql`${schedulerLeases.expiresAt} < ${now.getTime()} OR ${schedulerLeases.holder} = ${holder}`,
    })
    .returning({ holder: schedulerLeases.holder });
  return rows.length === 1 && rows[0].holder === holder;
}

/** Lets the next tick start at once instead of waiting for the expiry. */
export async function releaseLease(db: DbOrTx, { name, holder }: { name: string; holder: string }) {
  await db.update(schedulerLeases).set({ expiresAt: new Date(0) }).where(and(eq(schedulerLeases.name, name), eq(schedulerLeases.holder, holder)));
}
