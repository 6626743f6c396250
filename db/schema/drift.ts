import { integer, primaryKey, real, sqliteTable, text, index } from "drizzle-orm/sqlite-core";
import { ovens } from "./fleet";
import { users } from "./users";
import { runs } from "./runs";

// Drift tracking keeps its state per oven and metric, so a new run is one step, not a rescan.

/** A baseline an engineer picked; without one the default (first ten runs after the latest change) applies. */
export const driftBaselines = sqliteTable(
  "drift_baseline",
  {
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    metric: text("metric").notNull(),
    fromRunId: integer("from_run_id").notNull().references(() => runs.id),
    toRunId: integer("to_run_id").notNull().references(() => runs.id),
    setBy: text("set_by").references(() => users.id),
    setAt: integer("set_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [primaryKey({ columns: [t.ovenId, t.metric] })],
);

/** The stored EWMA/CUSUM/run-rule state after the latest run, and the baseline it used. */
export const driftStates = sqliteTable(
  "drift_state",
  {
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    metric: text("metric").notNull(),
    baseline: text("baseline", { mode: "json" }).notNull(),
    state: text("state", { mode: "json" }),
    lastRunId: integer("last_run_id"),
    lastRunAt: integer("last_run_at", { mode: "timestamp_ms" }),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
  },
  (t) => [primaryKey({ columns: [t.ovenId, t.metric] })],
);

/** One drift result per monitored run and metric, so trend charts read without recomputing. */
export const driftPoints = sqliteTable(
  "drift_point",
  {
    runId: integer("run_id").notNull().references(() => runs.id),
    metric: text("metric").notNull(),
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    at: integer("at", { mode: "timestamp_ms" }).notNull(),
    value: real("value").notNull(),
    ewma: real("ewma").notNull(),
    ewmaUcl: real("ewma_ucl").notNull(),
    ewmaLcl: real("ewma_lcl").notNull(),
    cusumHigh: real("cusum_high").notNull(),
    cusumLow: real("cusum_low").notNull(),
    signals: text("signals", { mode: "json" }).$type<string[]>().notNull(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.metric] }), index("drift_point_oven_metric_at_idx").on(t.ovenId, t.metric, t.at)],
);

export const HEALTH_STATES = ["steady", "watch", "act", "down"] as const;

/**
 * The fleet view's figures of an oven's runs as of its last health refresh, kept in the shape
 * the view answers with (ISO times), so reading it makes no dates: 6 000 of them per request on
 * 200 ovens were a tenth of the view's time.
 */
export type OvenRunSummary = {
  lastRun: { id: number; runAt: string; verdict: "pass" | "marginal" | "fail"; windowUse: number | null; deltaTMax: number | null } | null;
  /** ΔT at peak of the runs of the 30 days before the refresh, oldest first. */
  deltaT: { at: string; value: number }[];
};

/** Each oven's current health, kept up to date as runs, orders and calibrations change. */
export const ovenHealth = sqliteTable("oven_health", {
  ovenId: integer("oven_id").primaryKey().references(() => ovens.id),
  state: text("state", { enum: HEALTH_STATES }).notNull(),
  reasons: text("reasons", { mode: "json" }).$type<string[]>().notNull(),
  /** Stored so the fleet view reads one row per oven, not each oven's runs (null until refreshed). */
  runSummary: text("run_summary", { mode: "json" }).$type<OvenRunSummary>(),
  updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull(),
});

export const alerts = sqliteTable(
  "alert",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    ovenId: integer("oven_id").notNull().references(() => ovens.id),
    fromState: text("from_state", { enum: HEALTH_STATES }),
    toState: text("to_state", { enum: HEALTH_STATES }).notNull(),
    reasons: text("reasons", { mode: "json" }).$type<string[]>().notNull(),
    runId: integer("run_id").references(() => runs.id),
    raisedAt: integer("raised_at", { mode: "timestamp_ms" }).notNull(),
    acknowledgedAt: integer("acknowledged_at", { mode: "timestamp_ms" }),
    acknowledgedBy: text("acknowledged_by").references(() => users.id),
    note: text("note"),
    workOrderId: integer("work_order_id"),
  },
  (t) => [index("alert_oven_idx").on(t.ovenId, t.raisedAt), index("alert_open_idx").on(t.acknowledgedAt)],
);

export type AlertRow = typeof alerts.$inferSelect;

/** Per-oven detector settings; an oven without a row uses the defaults (λ 0.2, L 3, k 0.5σ, h 5σ). */
export const driftSettings = sqliteTable("drift_setting", {
  ovenId: integer("oven_id").primaryKey().references(() => ovens.id),
  lambda: real("lambda").notNull(),
  L: real("l").notNull(),
  cusumK: real("cusum_k").notNull(),
  cusumH: real("cusum_h").notNull(),
  updatedBy: text("updated_by").references(() => users.id),
  updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
});
