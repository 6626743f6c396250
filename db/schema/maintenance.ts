import { sql } from "drizzle-orm";
import { integer, real, sqliteTable, text, index, uniqueIndex } from "drizzle-orm/sqlite-core";
import { ovens } from "./fleet";
import { users, ROLES } from "./users";
import { WORK_ORDER_KINDS, WORK_ORDER_STATES, type ChecklistItem, type ChecklistResult } from "@/lib/maintenance/work-order-state";

/*
 * Maintenance plans and work orders.
 *
 * A plan belongs to one oven. "Applied to several ovens" copies the plan once per oven (sharing a
 * groupKey), because each copy then has its own occurrence keys, version and later edits — an
 * oven that gets a longer interval does not drag the others along.
 */

export const PLAN_KINDS = ["preventive", "calibration"] as const;
export const PRIORITIES = ["low", "normal", "high", "urgent"] as const;
export const METER_KINDS = ["heater_hours", "conveyor_hours", "cycles"] as const;
export type PlanKind = (typeof PLAN_KINDS)[number];
export type Priority = (typeof PRIORITIES)[number];
export type MeterKind = (typeof METER_KINDS)[number];

const ts = (name: string) => integer(name, { mode: "timestamp_ms" });
const created = () => ts("created_at").notNull().$defaultFn(() => new Date());

export const maintenancePlans = sqliteTable(
  "maintenance_plan",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    groupKey: text("group_key"),
    templateId: text("template_id"),
    title: text("title").notNull(),
    instructions: text("instructions").notNull().default(""),
    checklist: text("checklist", { mode: "json" }).$type<ChecklistItem[]>().notNull().default([]),
    estimatedMinutes: integer("estimated_minutes"),
    kind: text("kind", { enum: PLAN_KINDS }).notNull().default("preventive"),
    assigneeId: text("assignee_id").references(() => users.id),
    assigneeRole: text("assignee_role", { enum: ROLES }),
    /** Opens the chamber or touches heaters, wiring or moving parts: show lock-out/tag-out. */
    safetyLockout: integer("safety_lockout", { mode: "boolean" }).notNull().default(false),
    rrule: text("rrule"),
    dtstartLocal: text("dtstart_local"),
    everyRuns: integer("every_runs"),
    everyHeaterHours: real("every_heater_hours"),
    /** Heater-hour meter value when the plan started counting. */
    meterBaseline: real("meter_baseline"),
    lookAheadDays: integer("look_ahead_days").notNull().default(14),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    version: integer("version").notNull().default(1),
    createdAt: created(),
    updatedAt: ts("updated_at").notNull().$defaultFn(() => new Date()),
  },
  (t) => [
    index("plan_oven_idx").on(t.ovenId),
    index("plan_assignee_idx").on(t.assigneeId),
    index("plan_active_idx").on(t.active),
    uniqueIndex("plan_oven_template_unique").on(t.ovenId, t.templateId),
  ],
);

export const workOrders = sqliteTable(
  "work_order",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    number: text("number").notNull(),
    planId: integer("plan_id").references(() => maintenancePlans.id),
    occurrenceKey: text("occurrence_key"),
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    title: text("title").notNull(),
    kind: text("kind", { enum: WORK_ORDER_KINDS }).notNull(),
    priority: text("priority", { enum: PRIORITIES }).notNull().default("normal"),
    state: text("state", { enum: WORK_ORDER_STATES }).notNull().default("open"),
    assigneeId: text("assignee_id").references(() => users.id),
    dueAt: ts("due_at"),
    startedAt: ts("started_at"),
    completedAt: ts("completed_at"),
    breakdown: integer("breakdown", { mode: "boolean" }).notNull().default(false),
    failureStartedAt: ts("failure_started_at"),
    checklist: text("checklist", { mode: "json" }).$type<ChecklistItem[]>().notNull().default([]),
    checklistResults: text("checklist_results", { mode: "json" }).$type<Record<string, ChecklistResult>>().notNull().default({}),
    notes: text("notes"),
    labourMinutes: integer("labour_minutes"),
    downtimeMinutes: integer("downtime_minutes"),
    safetyLockout: integer("safety_lockout", { mode: "boolean" }).notNull().default(false),
    /** Optimistic concurrency: every update names the version it read. */
    version: integer("version").notNull().default(1),
    /** Someone edited, assigned, commented on or started it: a plan edit never replaces it. */
    touched: integer("touched", { mode: "boolean" }).notNull().default(false),
    createdById: text("created_by_id").references(() => users.id),
    createdAt: created(),
    updatedAt: ts("updated_at").notNull().$defaultFn(() => new Date()),
  },
  (t) => [
    uniqueIndex("work_order_number_unique").on(t.number),
    // Generation's idempotence lives here: insert … on conflict do nothing.
    uniqueIndex("work_order_plan_occurrence_unique").on(t.planId, t.occurrenceKey),
    index("work_order_oven_idx").on(t.ovenId),
    index("work_order_state_due_idx").on(t.state, t.dueAt),
    index("work_order_assignee_idx").on(t.assigneeId),
    index("work_order_due_idx").on(t.dueAt),
    // The list's order (undated last, then due, then id), so a page is read off the index
    // instead of sorting every order: 60 000 of them on the large data set.
    index("work_order_list_order_idx").on(sql`(due_at is null)`, t.dueAt, t.id),
    index("work_order_kind_idx").on(t.kind),
  ],
);

export const workOrderParts = sqliteTable(
  "work_order_part",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    workOrderId: integer("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    description: text("description").notNull(),
    quantity: real("quantity").notNull().default(1),
    createdAt: created(),
  },
  (t) => [index("work_order_part_order_idx").on(t.workOrderId)],
);

export const workOrderAttachments = sqliteTable(
  "work_order_attachment",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    workOrderId: integer("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    sha256: text("sha256").notNull(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    uploadedById: text("uploaded_by_id").references(() => users.id),
    createdAt: created(),
  },
  (t) => [index("work_order_attachment_order_idx").on(t.workOrderId), index("work_order_attachment_sha_idx").on(t.sha256)],
);

export const workOrderComments = sqliteTable(
  "work_order_comment",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    workOrderId: integer("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    authorId: text("author_id").references(() => users.id),
    body: text("body").notNull(),
    mentions: text("mentions", { mode: "json" }).$type<string[]>().notNull().default([]),
    createdAt: created(),
  },
  (t) => [index("work_order_comment_order_idx").on(t.workOrderId), index("work_order_comment_author_idx").on(t.authorId)],
);

export const meterReadings = sqliteTable(
  "meter_reading",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    kind: text("kind", { enum: METER_KINDS }).notNull(),
    value: real("value").notNull(),
    at: ts("at").notNull(),
    recordedById: text("recorded_by_id").references(() => users.id),
    createdAt: created(),
  },
  (t) => [index("meter_reading_oven_kind_at_idx").on(t.ovenId, t.kind, t.at)],
);

export type PlanRow = typeof maintenancePlans.$inferSelect;
export type WorkOrderRow = typeof workOrders.$inferSelect;
export type MeterReadingRow = typeof meterReadings.$inferSelect;
