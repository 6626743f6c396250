import { z } from "zod";
import { EARLIEST_YEAR, isCalendarDate, LATEST_YEAR } from "./dates";

export const OVEN_KIND_VALUES = ["convection", "batch_ir", "vapour_phase", "other"] as const;
export const SERVICE_STATE_VALUES = ["in_service", "down", "retired"] as const;

export const OVEN_KIND_LABELS: Record<(typeof OVEN_KIND_VALUES)[number], string> = {
  convection: "Convection conveyor",
  batch_ir: "Batch / drawer infrared",
  vapour_phase: "Vapour phase",
  other: "Other",
};
export const SERVICE_STATE_LABELS: Record<(typeof SERVICE_STATE_VALUES)[number], string> = {
  in_service: "In service",
  down: "Down",
  retired: "Retired",
};

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `at most ${max} characters`)
    .optional()
    .nullable()
    .transform((v) => (v ? v : null));

const fields = {
  tag: z
    .string({ error: "is required" })
    .trim()
    .min(1, "is required")
    .max(24, "at most 24 characters")
    .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "letters, digits, dot, dash or underscore, e.g. L2-RF1")
    .transform((v) => v.toUpperCase()),
  name: z.string({ error: "is required" }).trim().min(1, "is required").max(80, "at most 80 characters"),
  lineId: z.coerce.number({ error: "choose a line" }).int().positive("choose a line"),
  kind: z.enum(OVEN_KIND_VALUES, { error: "choose a kind" }),
  zones: z.preprocess(
    (v) => (v === "" || v === undefined ? null : v),
    z.coerce.number().int("a whole number").min(1, "at least 1").max(30, "at most 30").nullable(),
  ),
  maker: optionalText(80),
  model: optionalText(80),
  serial: optionalText(80),
  installedOn: z.preprocess(
    (v) => (v === "" || v === undefined ? null : v),
    z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "a date as YYYY-MM-DD").refine(isCalendarDate, `a day that exists, between ${EARLIEST_YEAR} and ${LATEST_YEAR}`).nullable(),
  ),
  serviceState: z.enum(SERVICE_STATE_VALUES, { error: "in_service, down or retired" }),
  notes: optionalText(2000),
};

export const ovenCreateSchema = z.object({ ...fields, serviceState: fields.serviceState.default("in_service") });
export const ovenUpdateSchema = z
  .object(fields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" });

export type OvenCreateInput = z.infer<typeof ovenCreateSchema>;
export type OvenUpdateInput = z.infer<typeof ovenUpdateSchema>;

// Empty form fields ("All sites") mean "no filter", not an invalid value.
const blankToUndefined = (v: unknown) => (v === "" ? undefined : v);
export const fleetFilterSchema = z.object({
  siteId: z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional()),
  lineId: z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional()),
  state: z.preprocess(blankToUndefined, z.enum(SERVICE_STATE_VALUES).optional()),
  q: z.preprocess(blankToUndefined, z.string().trim().max(40).optional()),
});
export type FleetFilter = z.infer<typeof fleetFilterSchema>;
