import { integer, sqliteTable, text, real, index, uniqueIndex } from "drizzle-orm/sqlite-core";
import type { ProcessWindow } from "@/lib/thermal/windows";
import { users } from "./users";
import { storedFiles } from "./files";

/**
 * A process window. `values` is the current version; every version (including the current one)
 * is also kept in process_window_version, so runs judged against an older version stay explained.
 */
export const processWindows = sqliteTable(
  "process_window",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    presetId: text("preset_id"),
    version: integer("version").notNull().default(1),
    values: text("values", { mode: "json" }).$type<ProcessWindow>().notNull(),
    notes: text("notes"),
    archivedAt: integer("archived_at", { mode: "timestamp_ms" }),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("process_window_name_unique").on(t.name)],
);

export const processWindowVersions = sqliteTable(
  "process_window_version",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    windowId: integer("window_id").notNull().references(() => processWindows.id),
    version: integer("version").notNull(),
    values: text("values", { mode: "json" }).$type<ProcessWindow>().notNull(),
    createdBy: text("created_by").references(() => users.id),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("process_window_version_unique").on(t.windowId, t.version)],
);

export type ProbePosition = { label: string; x: number; y: number; sitsOn: string };

export const testBoards = sqliteTable(
  "test_board",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    widthMm: real("width_mm").notNull(),
    heightMm: real("height_mm").notNull(),
    probes: text("probes", { mode: "json" }).$type<ProbePosition[]>().notNull(),
    pictureSha256: text("picture_sha256").references(() => storedFiles.sha256),
    notes: text("notes"),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("test_board_name_unique").on(t.name), index("test_board_picture_idx").on(t.pictureSha256)],
);

export type ProcessWindowRow = typeof processWindows.$inferSelect;
export type TestBoardRow = typeof testBoards.$inferSelect;
