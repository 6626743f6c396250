import { z } from "zod";
import { EARLIEST_YEAR, isCalendarDate, LATEST_YEAR, plantDate } from "./dates";

// Shared by the API, the forms and the queries. Enum lists are repeated here (not imported from
// the schema) so this file imports only zod; a unit test keeps them in step.
const WO_KINDS = ["preventive", "corrective", "calibration", "drift_investigation"] as const;
const WO_STATES = ["open", "in_progress", "on_hold", "done", "cancelled"] as const;
const PRIORITIES = ["low", "normal", "high", "urgent"] as const;
const ROLES = ["viewer", "technician", "engineer", "manager", "admin"] as const;
export const METER_KIND_VALUES = ["heater_hours", "conveyor_hours", "cycles"] as const;

const localDateTime = z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "a local date-time as YYYY-MM-DDTHH:mm").refine(isCalendarDate, `a date-time that exists, between ${EARLIEST_YEAR} and ${LATEST_YEAR}`);
const isoInstant = plantDate("a date-time (ISO 8601)");
const checklistItem = z.object({
  id: z.string().trim().min(1, "is required").max(60),
  label: z.string().trim().min(1, "is required").max(300),
  mandatory: z.boolean().default(true),
});

export const planCreateSchema = z
  .object({
    ovenIds: z.array(z.coerce.number().int().positive()).min(1, "pick at least one oven").max(100),
    title: z.string().trim().min(1, "is required").max(200),
    instructions: z.string().max(5000).default(""),
    kind: z.enum(["preventive", "calibration"]).default("preventive"),
    checklist: z.array(checklistItem).max(50).default([]),
    estimatedMinutes: z.coerce.number().int().min(1).max(10_000).optional(),
    assigneeId: z.string().min(1).nullable().optional(),
    assigneeRole: z.enum(ROLES).nullable().optional(),
    safetyLockout: z.boolean().default(false),
    rrule: z.string().trim().min(1).max(500).optional(),
    dtstart: localDateTime.optional(),
    everyRuns: z.coerce.number().int().min(1).max(100_000).optional(),
    everyHeaterHours: z.coerce.number().positive().max(1_000_000).optional(),
    lookAheadDays: z.coerce.number().int().min(0).max(366).default(14),
  })
  .superRefine((v, ctx) => {
    const triggers = [v.rrule !== undefined, v.everyRuns !== undefined, v.everyHeaterHours !== undefined].filter(Boolean).length;
    if (triggers !== 1) ctx.addIssue({ code: "custom", path: ["rrule"], message: "give exactly one trigger: rrule, everyRuns or everyHeaterHours" });
    if (v.rrule !== undefined && !v.dtstart) ctx.addIssue({ code: "custom", path: ["dtstart"], message: "is required with an rrule" });
  });
export type PlanCreateInput = z.infer<typeof planCreateSchema>;

export const planUpdateSchema = z.object({
  version: z.coerce.number().int().positive(),
  title: z.string().trim().min(1).max(200).optional(),
  instructions: z.string().max(5000).optional(),
  checklist: z.array(checklistItem).max(50).optional(),
  estimatedMinutes: z.coerce.number().int().min(1).max(10_000).nullable().optional(),
  rrule: z.string().trim().min(1).max(500).optional(),
  dtstart: localDateTime.optional(),
  active: z.boolean().optional(),
});
export type PlanUpdateInput = z.infer<typeof planUpdateSchema>;

/** Plans look ahead at most 366 days; a farther horizon would only write years of orders nobody works. */
export const GENERATE_MAX_AHEAD_MS = 366 * 86_400_000;
export const generateSchema = z.object({
  until: isoInstant.refine((d) => d.getTime() <= Date.now() + GENERATE_MAX_AHEAD_MS, "at most 366 days from now").optional(),
});

const boolish = z.preprocess((v) => (v === "true" || v === "1" ? true : v === "false" || v === "0" ? false : v), z.boolean());

export const workOrderFilterSchema = z.object({
  planId: z.coerce.number().int().positive().optional(),
  ovenId: z.coerce.number().int().positive().optional(),
  kind: z.enum(WO_KINDS).optional(),
  state: z.union([z.enum(WO_STATES), z.literal("unfinished")]).optional(),
  assigneeId: z.string().min(1).optional(),
  from: isoInstant.optional(),
  to: isoInstant.optional(),
  overdue: boolish.optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});
export type WorkOrderFilter = z.infer<typeof workOrderFilterSchema>;

export const checklistResultSchema = z.object({ ok: z.boolean().nullable(), note: z.string().max(1000).optional() });
export const partSchema = z.object({
  description: z.string().trim().min(1, "is required").max(200),
  quantity: z.coerce.number().positive("must be above 0").max(100_000).default(1),
});

export const workOrderPatchSchema = z.object({
  version: z.coerce.number().int().min(0, "is required"),
  state: z.enum(WO_STATES).optional(),
  assigneeId: z.string().min(1).nullable().optional(),
  priority: z.enum(PRIORITIES).optional(),
  dueAt: isoInstant.nullable().optional(),
  checklistResults: z.record(z.string(), checklistResultSchema).optional(),
  notes: z.string().max(10_000).nullable().optional(),
  labourMinutes: z.coerce.number().int().min(0).max(100_000).nullable().optional(),
  downtimeMinutes: z.coerce.number().int().min(0).max(1_000_000).nullable().optional(),
  breakdown: z.boolean().optional(),
  failureStartedAt: isoInstant.nullable().optional(),
  /** Replaces the order's parts list when given. */
  parts: z.array(partSchema).max(100).optional(),
});
export type WorkOrderPatch = z.infer<typeof workOrderPatchSchema>;

export const workOrderCreateSchema = z.object({
  ovenId: z.coerce.number().int().positive(),
  title: z.string().trim().min(1, "is required").max(200),
  kind: z.enum(["corrective", "drift_investigation"]).default("corrective"),
  priority: z.enum(PRIORITIES).default("normal"),
  notes: z.string().max(10_000).optional(),
  dueAt: isoInstant.optional(),
  breakdown: z.boolean().default(false),
  failureStartedAt: isoInstant.optional(),
  assigneeId: z.string().min(1).optional(),
});
export type WorkOrderCreateInput = z.infer<typeof workOrderCreateSchema>;

export const bulkAssignSchema = z.object({
  ids: z.array(z.coerce.number().int().positive()).min(1, "pick at least one order").max(500),
  assigneeId: z.string().min(1).nullable(),
});

export const commentSchema = z.object({ body: z.string().trim().min(1, "is required").max(5000) });

export const meterReadingSchema = z.object({
  kind: z.enum(METER_KIND_VALUES).default("heater_hours"),
  // A meter counts hours or cycles: a billion is decades of any oven's life, and keeps sums finite.
  value: z.coerce.number().min(0, "must be 0 or more").max(1e9, "at most 1 000 000 000"),
  at: isoInstant.optional(),
});
export type MeterReadingInput = z.infer<typeof meterReadingSchema>;

export const kpiQuerySchema = z.object({
  from: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "a date as YYYY-MM-DD").optional(),
  to: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "a date as YYYY-MM-DD").optional(),
});
