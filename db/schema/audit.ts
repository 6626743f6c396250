import { integer, sqliteTable, text, index } from "drizzle-orm/sqlite-core";

// Every change made through the app: who, when, what, and the record before and after (JSON).
export const auditLog = sqliteTable(
  "audit_log",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    at: integer("at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    actorUserId: text("actor_user_id"),
    actorTokenId: integer("actor_token_id"),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id").notNull(),
    before: text("before", { mode: "json" }),
    after: text("after", { mode: "json" }),
  },
  (t) => [index("audit_entity_idx").on(t.entity, t.entityId), index("audit_at_idx").on(t.at), index("audit_actor_idx").on(t.actorUserId)],
);

export type AuditRow = typeof auditLog.$inferSelect;
