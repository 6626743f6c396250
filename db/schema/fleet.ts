import { integer, sqliteTable, text, index, uniqueIndex } from "drizzle-orm/sqlite-core";
import { processWindows, testBoards } from "./windows";

export const sites = sqliteTable(
  "site",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    timeZone: text("time_zone").notNull(),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("site_name_unique").on(t.name)],
);

export const LINE_KINDS = ["smt", "lab", "other"] as const;

export const lines = sqliteTable(
  "line",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    siteId: integer("site_id").notNull().references(() => sites.id),
    name: text("name").notNull(),
    kind: text("kind", { enum: LINE_KINDS }).notNull().default("smt"),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("line_site_name_unique").on(t.siteId, t.name), index("line_site_idx").on(t.siteId)],
);

export const OVEN_KINDS = ["convection", "batch_ir", "vapour_phase", "other"] as const;
export const SERVICE_STATES = ["in_service", "down", "retired"] as const;
export type OvenKind = (typeof OVEN_KINDS)[number];
export type ServiceState = (typeof SERVICE_STATES)[number];

export const ovens = sqliteTable(
  "oven",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    tag: text("tag").notNull(),
    name: text("name").notNull(),
    lineId: integer("line_id").notNull().references(() => lines.id),
    kind: text("kind", { enum: OVEN_KINDS }).notNull(),
    zones: integer("zones"),
    maker: text("maker"),
    model: text("model"),
    serial: text("serial"),
    installedOn: text("installed_on"),
    serviceState: text("service_state", { enum: SERVICE_STATES }).notNull().default("in_service"),
    notes: text("notes"),
    defaultWindowId: integer("default_window_id").references(() => processWindows.id),
    defaultBoardId: integer("default_board_id").references(() => testBoards.id),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [
    uniqueIndex("oven_tag_unique").on(t.tag),
    index("oven_line_idx").on(t.lineId),
    index("oven_state_idx").on(t.serviceState),
    index("oven_default_window_idx").on(t.defaultWindowId),
    index("oven_default_board_idx").on(t.defaultBoardId),
  ],
);

export type SiteRow = typeof sites.$inferSelect;
export type LineRow = typeof lines.$inferSelect;
export type OvenRow = typeof ovens.$inferSelect;
