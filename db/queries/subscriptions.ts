import "server-only";
import { and, asc, eq, lt, isNull, or } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { subscriptions, type MailKind } from "../schema/mail";
import { users } from "../schema/users";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { notFound } from "@/lib/errors";
import { defaultSubscriptionsFor } from "@/lib/mail/kinds";
import { ruleForWeekdays } from "@/lib/mail/schedule";

export async function listSubscriptionsFor(db: DbOrTx, userId: string) {
  return db.select().from(subscriptions).where(eq(subscriptions.userId, userId)).orderBy(asc(subscriptions.id));
}

/** Enabled subscriptions of a kind, with what the sender needs to know about each person. */
export async function listActiveSubscribers(db: DbOrTx, kind: MailKind) {
  return db
    .select({ sub: subscriptions, user: { id: users.id, email: users.email, name: users.name, timeZone: users.timeZone, role: users.role } })
    .from(subscriptions)
    .innerJoin(users, eq(users.id, subscriptions.userId))
    .where(and(eq(subscriptions.kind, kind), eq(subscriptions.enabled, true), eq(users.active, true)));
}

/** Moves the high-water mark forward only: a slower tick can never move it back. */
export async function markOccurrenceEnqueued(db: DbOrTx, subscriptionId: number, occurrence: Date) {
  await db
    .update(subscriptions)
    .set({ lastEnqueuedOccurrence: occurrence })
    .where(and(eq(subscriptions.id, subscriptionId), or(isNull(subscriptions.lastEnqueuedOccurrence), lt(subscriptions.lastEnqueuedOccurrence, occurrence))));
}

export type SubscriptionInput = { userId: string; kind: MailKind; enabled: boolean; weekdays?: string[]; sendAt?: string };

/**
 * Saves one person's choice for one kind. Changing the schedule consumes everything up to now,
 * so moving Monday's digest to Tuesday on a Wednesday does not send Tuesday's at once.
 */
export async function saveSubscription(db: DbOrTx, input: SubscriptionInput, actor: Actor | null, now = new Date()) {
  return db.transaction(async (tx) => {
    const [user] = await tx.select({ id: users.id }).from(users).where(eq(users.id, input.userId)).limit(1);
    if (!user) throw notFound("That person");
    const schedule = input.weekdays ? ruleForWeekdays(input.weekdays) : null;
    const sendAt = input.sendAt ?? null;
    const [before] = await tx.select().from(subscriptions).where(and(eq(subscriptions.userId, input.userId), eq(subscriptions.kind, input.kind))).limit(1);
    const changedSchedule = !before || before.schedule !== schedule || before.sendAt !== sendAt || (!before.enabled && input.enabled);
    const values = { enabled: input.enabled, schedule, sendAt, updatedAt: now, ...(changedSchedule ? { lastEnqueuedOccurrence: now } : {}) };
    const [after] = before
      ? await tx.update(subscriptions).set(values).where(eq(subscriptions.id, before.id)).returning()
      : await tx.insert(subscriptions).values({ userId: input.userId, kind: input.kind, createdAt: now, ...values }).returning();
    await recordAudit(tx, { actor, action: before ? "subscription.update" : "subscription.create", entity: "subscription", entityId: after.id, before: before ?? null, after });
    return after;
  });
}

/** One-click unsubscribe: the kind is switched off (a row is made if there was none). */
export async function unsubscribe(db: DbOrTx, userId: string, kind: MailKind, now = new Date()) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(subscriptions).where(and(eq(subscriptions.userId, userId), eq(subscriptions.kind, kind))).limit(1);
    if (before && !before.enabled) return before;
    const [after] = before
      ? await tx.update(subscriptions).set({ enabled: false, updatedAt: now }).where(eq(subscriptions.id, before.id)).returning()
      : await tx.insert(subscriptions).values({ userId, kind, enabled: false, createdAt: now, updatedAt: now }).returning();
    await recordAudit(tx, { actor: null, action: "subscription.unsubscribe", entity: "subscription", entityId: after.id, before: before ?? null, after });
    return after;
  });
}

export async function setUserTimeZone(db: DbOrTx, userId: string, timeZone: string, actor: Actor) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select({ id: users.id, timeZone: users.timeZone }).from(users).where(eq(users.id, userId)).limit(1);
    if (!before) throw notFound("That person");
    await tx.update(users).set({ timeZone, updatedAt: new Date() }).where(eq(users.id, userId));
    await recordAudit(tx, { actor, action: "user.time_zone", entity: "user", entityId: userId, before: { timeZone: before.timeZone }, after: { timeZone } });
  });
}

/** The role's defaults for anyone who has no rows yet (the demo seed; new people later). */
export async function ensureDefaultSubscriptions(db: DbOrTx, user: { id: string; role: Parameters<typeof defaultSubscriptionsFor>[0] }, createdAt: Date) {
  const existing = new Set((await listSubscriptionsFor(db, user.id)).map((s) => s.kind));
  let made = 0;
  for (const d of defaultSubscriptionsFor(user.role)) {
    if (existing.has(d.kind)) continue;
    await db.insert(subscriptions).values({
      userId: user.id,
      kind: d.kind,
      enabled: d.enabled,
      schedule: d.weekdays ? ruleForWeekdays(d.weekdays) : null,
      sendAt: d.sendAt ?? null,
      createdAt,
      updatedAt: createdAt,
    });
    made++;
  }
  return made;
}
