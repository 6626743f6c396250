import { integer, sqliteTable, text, index } from "drizzle-orm/sqlite-core";
import { ovens } from "./fleet";
import { users } from "./users";

export const CHANGE_AREAS = ["fan", "baffle", "heater", "controller_firmware", "insulation", "sensor", "conveyor", "exhaust", "other"] as const;
export type ChangeArea = (typeof CHANGE_AREAS)[number];

// The modification log: one row per hardware or firmware change to an oven. The oven's current
// configuration (its Setup) is the latest `after` value per area.
export const changes = sqliteTable(
  "oven_change",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    at: integer("at", { mode: "timestamp_ms" }).notNull(),
    area: text("area", { enum: CHANGE_AREAS }).notNull(),
    summary: text("summary").notNull(),
    before: text("before"),
    after: text("after").notNull(),
    reason: text("reason"),
    // The work order it was done under. Work orders live in the maintenance tables; the link is
    // checked by the queries rather than a foreign key so either feature can be migrated alone.
    workOrderId: integer("work_order_id"),
    createdBy: text("created_by").references(() => users.id),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [index("oven_change_oven_at_idx").on(t.ovenId, t.at), index("oven_change_area_idx").on(t.area), index("oven_change_at_idx").on(t.at), index("oven_change_wo_idx").on(t.workOrderId)],
);

export type ChangeRow = typeof changes.$inferSelect;

/** Photos and documents of a change (stored by content hash under UPLOAD_DIR). */
export const changeAttachments = sqliteTable(
  "oven_change_attachment",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    changeId: integer("change_id").notNull().references(() => changes.id, { onDelete: "cascade" }),
    sha256: text("sha256").notNull(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    uploadedBy: text("uploaded_by").references(() => users.id),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [index("oven_change_attachment_change_idx").on(t.changeId)],
);
