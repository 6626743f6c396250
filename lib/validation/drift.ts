import { z } from "zod";
import { plantDate } from "./dates";
import { TRACKED_METRICS } from "@/lib/tracked-metrics";

const blank = (v: unknown) => (v === "" ? undefined : v);

export const trendQuerySchema = z.object({
  metric: z.enum(TRACKED_METRICS, { error: `one of ${TRACKED_METRICS.join(", ")}` }).default("deltaTPeak"),
  from: z.preprocess(blank, plantDate("a date, e.g. 2026-06-01").optional()),
  to: z.preprocess(blank, plantDate("a date, e.g. 2026-12-01").optional()),
});

export const impactQuerySchema = z.object({
  metric: z.enum(TRACKED_METRICS, { error: `one of ${TRACKED_METRICS.join(", ")}` }).default("deltaTPeak"),
  before: z.preprocess(blank, z.coerce.number().int().min(2, "at least 2").max(200, "at most 200").default(10)),
  after: z.preprocess(blank, z.coerce.number().int().min(2, "at least 2").max(200, "at most 200").default(10)),
  delta: z.preprocess(blank, z.coerce.number().positive("a positive difference").max(1000, "at most 1000").optional()),
});

export const alertQuerySchema = z.object({
  ovenId: z.preprocess(blank, z.coerce.number().int().positive().optional()),
  status: z.preprocess(blank, z.enum(["open", "acknowledged", "all"]).default("open")),
});

export const acknowledgeSchema = z.object({
  note: z.string({ error: "is required" }).trim().min(3, "say in a few words what you found or did").max(2000),
  openWorkOrder: z.preprocess((v) => v === "on" || v === "true" || v === true, z.boolean()).default(false),
});

export const baselineSchema = z.object({
  metric: z.enum(TRACKED_METRICS),
  fromRunId: z.coerce.number().int().positive(),
  toRunId: z.coerce.number().int().positive(),
});

export const fleetQuerySchema = z.object({
  siteId: z.preprocess(blank, z.coerce.number().int().positive().optional()),
  lineId: z.preprocess(blank, z.coerce.number().int().positive().optional()),
});

export const driftSettingsSchema = z.object({
  ovenId: z.coerce.number().int().positive(),
  lambda: z.coerce.number({ error: "a number" }).gt(0, "more than 0").max(1, "at most 1"),
  L: z.coerce.number({ error: "a number" }).min(1, "at least 1").max(5, "at most 5"),
  cusumK: z.coerce.number({ error: "a number" }).min(0, "0 or more").max(3, "at most 3"),
  cusumH: z.coerce.number({ error: "a number" }).gt(0, "more than 0").max(20, "at most 20"),
});

/** A baseline chosen by dates on the page: the oven's runs between them become the baseline. */
export const baselineByDatesSchema = z.object({
  ovenId: z.coerce.number().int().positive(),
  metric: z.enum(TRACKED_METRICS),
  from: plantDate("a date"),
  to: plantDate("a date"),
}).refine((v) => v.to > v.from, { path: ["to"], message: "must be after the start" });
