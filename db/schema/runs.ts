import { sql } from "drizzle-orm";
import { blob, integer, real, sqliteTable, text, index } from "drizzle-orm/sqlite-core";
import type { ProcessWindow } from "@/lib/thermal/windows";
import type { VerdictItems } from "@/lib/thermal/types";
import { ovens } from "./fleet";
import { users } from "./users";
import { storedFiles } from "./files";
import { calibrations, instruments } from "./instruments";
import { processWindows, testBoards } from "./windows";

export const START_STATES = ["cold", "hot"] as const;
export const VERDICT_STATUSES = ["pass", "marginal", "fail"] as const;
export const CALIBRATION_STATUSES = ["valid", "lapsed", "none"] as const;
export type CalibrationStatus = (typeof CALIBRATION_STATUSES)[number];

// The board metrics are real columns: lists filter and sort on them and trends read them.
const boardColumns = {
  peakMin: real("peak_min").notNull(),
  peakMax: real("peak_max").notNull(),
  deltaTPeak: real("delta_t_peak").notNull(),
  criticalSpread: real("critical_spread"),
  heatUpRate: real("heat_up_rate"),
  rampUpMax: real("ramp_up_max"),
  rampDownMax: real("ramp_down_max"),
  soakTimeMin: real("soak_time_min"),
  soakTimeMax: real("soak_time_max"),
  talMin: real("tal_min"),
  talMax: real("tal_max"),
  timeToPeakMax: real("time_to_peak_max"),
};

export const runs = sqliteTable(
  "run",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    runAt: integer("run_at", { mode: "timestamp_ms" }).notNull(),
    windowId: integer("window_id").references(() => processWindows.id),
    windowVersion: integer("window_version"),
    /** The window values this run was judged with; never changed afterwards. */
    windowValues: text("window_values", { mode: "json" }).$type<ProcessWindow>().notNull(),
    boardId: integer("board_id").references(() => testBoards.id),
    instrumentId: integer("instrument_id").references(() => instruments.id),
    calibrationId: integer("calibration_id").references(() => calibrations.id),
    calibrationStatus: text("calibration_status", { enum: CALIBRATION_STATUSES }).notNull(),
    skewSeconds: real("skew_seconds").notNull().default(0),
    /** Offsets applied, °C by file column. */
    offsetsApplied: text("offsets_applied", { mode: "json" }).$type<Record<string, number>>().notNull(),
    fileSha256: text("file_sha256").references(() => storedFiles.sha256),
    fileName: text("file_name"),
    startState: text("start_state", { enum: START_STATES }),
    conveyorSpeed: real("conveyor_speed"),
    setPoints: text("set_points", { mode: "json" }).$type<Record<string, number> | number[] | null>(),
    operator: text("operator"),
    notes: text("notes"),
    rows: integer("rows").notNull(),
    durationSeconds: real("duration_seconds").notNull(),
    sampleInterval: real("sample_interval").notNull(),
    units: text("units").notNull(),
    warnings: text("warnings", { mode: "json" }).$type<string[]>().notNull(),
    ...boardColumns,
    verdictStatus: text("verdict_status", { enum: VERDICT_STATUSES }).notNull(),
    windowUse: real("window_use"),
    verdictItems: text("verdict_items", { mode: "json" }).$type<VerdictItems>().notNull(),
    createdBy: text("created_by").references(() => users.id),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    deletedAt: integer("deleted_at", { mode: "timestamp_ms" }),
  },
  (t) => [
    index("run_oven_time_idx").on(t.ovenId, t.runAt),
    index("run_time_idx").on(t.runAt),
    // Live (not deleted) runs only, so the lists' counts and pages read the index alone: the
    // plant-wide runs list counted 219 000 table rows per request on the large data set.
    index("run_live_time_idx").on(t.runAt, t.id).where(sql`deleted_at is null`),
    // The fleet view's latest run and 30-day ΔT per oven, without a table read per run.
    index("run_oven_live_idx").on(t.ovenId, t.runAt, t.deltaTPeak).where(sql`deleted_at is null`),
    index("run_window_idx").on(t.windowId),
    index("run_board_idx").on(t.boardId),
    index("run_instrument_idx").on(t.instrumentId, t.runAt),
    index("run_calibration_idx").on(t.calibrationId),
    index("run_verdict_idx").on(t.verdictStatus, t.runAt).where(sql`deleted_at is null`),
    index("run_file_idx").on(t.fileSha256),
    index("run_created_by_idx").on(t.createdBy),
  ],
);

export const runChannels = sqliteTable(
  "run_channel",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    runId: integer("run_id").notNull().references(() => runs.id),
    position: integer("position").notNull(),
    column: text("column").notNull(),
    probeLabel: text("probe_label").notNull(),
    peak: real("peak").notNull(),
    timeAtPeak: real("time_at_peak").notNull(),
    tal: real("tal"),
    heatUpRate: real("heat_up_rate"),
    rampUpMax: real("ramp_up_max"),
    rampDownMax: real("ramp_down_max"),
    soakTime: real("soak_time"),
    timeToPeak: real("time_to_peak"),
  },
  (t) => [index("run_channel_run_idx").on(t.runId, t.position)],
);

/**
 * The aligned, corrected curves, so a run can be re-judged and re-plotted without its file:
 * `time` is Float32 (s), `values` Float32 channel-major (°C), little-endian.
 */
export const runSamples = sqliteTable("run_sample", {
  runId: integer("run_id").primaryKey().references(() => runs.id),
  rows: integer("rows").notNull(),
  channels: integer("channels").notNull(),
  time: blob("time", { mode: "buffer" }).notNull(),
  values: blob("values", { mode: "buffer" }).notNull(),
});

/** Re-judging a run against a (newer) window keeps the original verdict and adds one of these. */
export const runJudgements = sqliteTable(
  "run_judgement",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    runId: integer("run_id").notNull().references(() => runs.id),
    windowId: integer("window_id").references(() => processWindows.id),
    windowVersion: integer("window_version"),
    windowValues: text("window_values", { mode: "json" }).$type<ProcessWindow>().notNull(),
    ...boardColumns,
    verdictStatus: text("verdict_status", { enum: VERDICT_STATUSES }).notNull(),
    windowUse: real("window_use"),
    verdictItems: text("verdict_items", { mode: "json" }).$type<VerdictItems>().notNull(),
    createdBy: text("created_by").references(() => users.id),
    createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [index("run_judgement_run_idx").on(t.runId), index("run_judgement_window_idx").on(t.windowId)],
);

export type RunRow = typeof runs.$inferSelect;
export type RunInsert = typeof runs.$inferInsert;
export type RunChannelRow = typeof runChannels.$inferSelect;
export type RunJudgementRow = typeof runJudgements.$inferSelect;
