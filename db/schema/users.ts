import { integer, primaryKey, sqliteTable, text, index, uniqueIndex } from "drizzle-orm/sqlite-core";

export const ROLES = ["viewer", "technician", "engineer", "manager", "admin"] as const;
export type Role = (typeof ROLES)[number];

// Auth.js's user table, extended with Ovenward's role, password and lock-out counters.
export const users = sqliteTable(
  "user",
  {
    id: text("id").primaryKey().$defaultFn(() => crypto.randomUUID()),
    name: text("name"),
    email: text("email").notNull(),
    emailVerified: integer("emailVerified", { mode: "timestamp_ms" }),
    image: text("image"),
    role: text("role", { enum: ROLES }).notNull().default("viewer"),
    passwordHash: text("password_hash"),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    failedSignIns: integer("failed_sign_ins").notNull().default(0),
    lastFailedSignInAt: integer("last_failed_sign_in_at", { mode: "timestamp_ms" }),
    lockedUntil: integer("locked_until", { mode: "timestamp_ms" }),
    /** IANA zone the person's scheduled e-mails are timed in; the demo site's by default. */
    timeZone: text("time_zone").notNull().default("Europe/Dublin"),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("user_email_unique").on(t.email), index("user_role_idx").on(t.role)],
);

export const accounts = sqliteTable(
  "account",
  {
    userId: text("userId").notNull().references(() => users.id, { onDelete: "cascade" }),
    type: text("type").notNull(),
    provider: text("provider").notNull(),
    providerAccountId: text("providerAccountId").notNull(),
    refresh_token: text("refresh_token"),
    access_token: text("access_token"),
    expires_at: integer("expires_at"),
    token_type: text("token_type"),
    scope: text("scope"),
    id_token: text("id_token"),
    session_state: text("session_state"),
  },
  (t) => [primaryKey({ columns: [t.provider, t.providerAccountId] }), index("account_user_idx").on(t.userId)],
);

export const sessions = sqliteTable(
  "session",
  {
    sessionToken: text("sessionToken").primaryKey(),
    userId: text("userId").notNull().references(() => users.id, { onDelete: "cascade" }),
    expires: integer("expires", { mode: "timestamp_ms" }).notNull(),
  },
  (t) => [index("session_user_idx").on(t.userId)],
);

export const verificationTokens = sqliteTable(
  "verificationToken",
  {
    identifier: text("identifier").notNull(),
    token: text("token").notNull(),
    expires: integer("expires", { mode: "timestamp_ms" }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);

// One-time links Ovenward sends itself (invitations to set a password). Only the hash is kept.
export const userTokens = sqliteTable(
  "user_token",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    purpose: text("purpose", { enum: ["invite"] }).notNull(),
    tokenHash: text("token_hash").notNull(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    usedAt: integer("used_at", { mode: "timestamp_ms" }),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("user_token_hash_unique").on(t.tokenHash), index("user_token_user_idx").on(t.userId)],
);

export type UserRow = typeof users.$inferSelect;
