import { z } from "zod";
import { plantDate } from "./dates";

export const CHANGE_AREA_VALUES = ["fan", "baffle", "heater", "controller_firmware", "insulation", "sensor", "conveyor", "exhaust", "other"] as const;
export const CHANGE_AREA_LABELS: Record<(typeof CHANGE_AREA_VALUES)[number], string> = {
  fan: "Fan",
  baffle: "Baffle",
  heater: "Heater",
  controller_firmware: "Controller firmware",
  insulation: "Insulation",
  sensor: "Sensor",
  conveyor: "Conveyor",
  exhaust: "Exhaust",
  other: "Other",
};
/** Areas where a change touches heating, wiring or airflow: the form shows the certification caution. */
export const SAFETY_CRITICAL_AREAS = new Set(["fan", "baffle", "heater", "insulation", "exhaust"]);

const blank = (v: unknown) => (v === "" ? undefined : v);

export const changeCreateSchema = z.object({
  at: z.preprocess(
    blank,
    plantDate("a date and time, e.g. 2026-11-20T14:30").refine((d) => d.getTime() <= Date.now() + 5 * 60_000, "cannot be in the future"),
  ),
  area: z.enum(CHANGE_AREA_VALUES, { error: "choose an area" }),
  summary: z.string({ error: "is required" }).trim().min(3, "say in a few words what changed").max(120, "at most 120 characters"),
  before: z.preprocess(blank, z.string().trim().max(200, "at most 200 characters").optional()),
  after: z.string({ error: "is required" }).trim().min(1, "is required — the new value, e.g. firmware 2.4.0").max(200, "at most 200 characters"),
  reason: z.preprocess(blank, z.string().trim().max(2000).optional()),
  workOrderId: z.preprocess(blank, z.coerce.number().int().positive().optional()),
});
export type ChangeCreateInput = z.infer<typeof changeCreateSchema>;

export const changeFilterSchema = z.object({
  ovenId: z.preprocess(blank, z.coerce.number().int().positive().optional()),
  area: z.preprocess(blank, z.enum(CHANGE_AREA_VALUES).optional()),
  from: z.preprocess(blank, plantDate("a date").optional()),
  to: z.preprocess(blank, plantDate("a date").optional()),
});
export type ChangeFilter = z.infer<typeof changeFilterSchema>;
