import { integer, sqliteTable, text, real, index, uniqueIndex } from "drizzle-orm/sqlite-core";
import { users } from "./users";
import { testBoards } from "./windows";
import { storedFiles } from "./files";

export const INSTRUMENT_KINDS = ["logger", "probe_set"] as const;
export type InstrumentKind = (typeof INSTRUMENT_KINDS)[number];

export const instruments = sqliteTable(
  "instrument",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    kind: text("kind", { enum: INSTRUMENT_KINDS }).notNull(),
    name: text("name").notNull(),
    serial: text("serial").notNull(),
    channelCount: integer("channel_count").notNull(),
    /** Time between consecutive channels of one scan, s (loggers). */
    scanSkewSeconds: real("scan_skew_seconds").notNull().default(0),
    resolution: real("resolution"),
    accuracy: real("accuracy"),
    thermocoupleType: text("thermocouple_type"),
    toleranceClass: text("tolerance_class"),
    notes: text("notes"),
    retiredAt: integer("retired_at", { mode: "timestamp_ms" }),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("instrument_serial_unique").on(t.kind, t.serial), index("instrument_kind_idx").on(t.kind)],
);

export const calibrations = sqliteTable(
  "calibration",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    instrumentId: integer("instrument_id").notNull().references(() => instruments.id),
    performedAt: integer("performed_at", { mode: "timestamp_ms" }).notNull(),
    performedBy: text("performed_by").notNull(),
    reference: text("reference").notNull(),
    /** °C added to each logger channel, keyed by channel number ("1", "2", …). */
    offsets: text("offsets", { mode: "json" }).$type<Record<string, number>>().notNull(),
    expandedUncertainty: real("expanded_uncertainty"),
    certificateSha256: text("certificate_sha256").references(() => storedFiles.sha256),
    dueAt: integer("due_at", { mode: "timestamp_ms" }).notNull(),
    createdBy: text("created_by").references(() => users.id),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [
    index("calibration_instrument_idx").on(t.instrumentId, t.performedAt),
    index("calibration_due_idx").on(t.dueAt),
    index("calibration_certificate_idx").on(t.certificateSha256),
  ],
);

/** The remembered mapping of a logger's file columns to a board's probe positions. */
export const columnMappings = sqliteTable(
  "column_mapping",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    instrumentId: integer("instrument_id").notNull().references(() => instruments.id),
    boardId: integer("board_id").notNull().references(() => testBoards.id),
    /** column header → probe label */
    mapping: text("mapping", { mode: "json" }).$type<Record<string, string>>().notNull(),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex("column_mapping_unique").on(t.instrumentId, t.boardId), index("column_mapping_board_idx").on(t.boardId)],
);

export type InstrumentRow = typeof instruments.$inferSelect;
export type CalibrationRow = typeof calibrations.$inferSelect;
