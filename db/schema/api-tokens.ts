import { integer, sqliteTable, text, index, uniqueIndex } from "drizzle-orm/sqlite-core";
import { ROLES, users } from "./users";

// Tokens for loggers and scripts. The secret is shown once; only its SHA-256 is stored.
export const apiTokens = sqliteTable(
  "api_token",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    prefix: text("prefix").notNull(),
    tokenHash: text("token_hash").notNull(),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    lastUsedAt: integer("last_used_at", { mode: "timestamp_ms" }),
    revokedAt: integer("revoked_at", { mode: "timestamp_ms" }),
  },
  (t) => [uniqueIndex("api_token_hash_unique").on(t.tokenHash), index("api_token_user_idx").on(t.userId)],
);

export type ApiTokenRow = typeof apiTokens.$inferSelect;
