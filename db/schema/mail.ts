import { integer, sqliteTable, text, index, uniqueIndex } from "drizzle-orm/sqlite-core";
import { users } from "./users";

// Messages captured by the local SMTP sink (development, demo and tests only).
export const sinkMessages = sqliteTable(
  "sink_message",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    receivedAt: integer("received_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    envelopeFrom: text("envelope_from"),
    envelopeTo: text("envelope_to").notNull(),
    subject: text("subject"),
    text: text("text"),
    html: text("html"),
    headers: text("headers", { mode: "json" }),
  },
  (t) => [index("sink_message_received_idx").on(t.receivedAt)],
);

export const MAIL_KINDS = ["fleet_digest", "my_work_daily", "drift_alert", "calibration_due", "overdue_work"] as const;
export type MailKind = (typeof MAIL_KINDS)[number];
export const OUTBOX_STATES = ["pending", "sending", "sent", "failed", "dead"] as const;
export type OutboxState = (typeof OUTBOX_STATES)[number];

// Which e-mails each person gets. Scheduled kinds carry an RRULE and a local send time,
// both read in the user's own time zone (user.time_zone).
export const subscriptions = sqliteTable(
  "subscription",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: MAIL_KINDS }).notNull(),
    enabled: integer("enabled", { mode: "boolean" }).notNull().default(true),
    /** RRULE value without DTSTART, e.g. "FREQ=WEEKLY;BYDAY=MO"; null for event-driven kinds. */
    schedule: text("schedule"),
    /** Local send time "HH:mm" on the user's clock; null for event-driven kinds. */
    sendAt: text("send_at"),
    /** The latest occurrence already handled; occurrences at or before it are never enqueued again. */
    lastEnqueuedOccurrence: integer("last_enqueued_occurrence", { mode: "timestamp_ms" }),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("subscription_user_kind_unique").on(t.userId, t.kind), index("subscription_kind_idx").on(t.kind, t.enabled)],
);

// Every message Ovenward sends on its own is first a row here; the sender drains it.
export const outbox = sqliteTable(
  "outbox",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    kind: text("kind").notNull(),
    recipientUserId: text("recipient_user_id").references(() => users.id, { onDelete: "set null" }),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    html: text("html").notNull(),
    text: text("text").notNull(),
    headers: text("headers", { mode: "json" }).$type<Record<string, string>>().notNull(),
    /** (kind, recipient, occurrence or event): the same message can never be queued twice. */
    idempotencyKey: text("idempotency_key").notNull(),
    state: text("state", { enum: OUTBOX_STATES }).notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: integer("next_attempt_at", { mode: "timestamp_ms" }).notNull(),
    lastError: text("last_error"),
    smtpResponse: text("smtp_response"),
    leaseToken: text("lease_token"),
    claimedAt: integer("claimed_at", { mode: "timestamp_ms" }),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull(),
    sentAt: integer("sent_at", { mode: "timestamp_ms" }),
  },
  (t) => [
    uniqueIndex("outbox_idempotency_unique").on(t.idempotencyKey),
    index("outbox_state_next_idx").on(t.state, t.nextAttemptAt),
    index("outbox_recipient_idx").on(t.recipientUserId),
    index("outbox_created_idx").on(t.createdAt),
  ],
);

// One row per singleton job; whoever holds an unexpired lease is the only one running it.
export const schedulerLeases = sqliteTable("scheduler_lease", {
  name: text("name").primaryKey(),
  holder: text("holder").notNull(),
  expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
});

export type SubscriptionRow = typeof subscriptions.$inferSelect;
export type OutboxRow = typeof outbox.$inferSelect;
