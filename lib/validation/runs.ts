import { z } from "zod";
import { plantDate } from "./dates";

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);
const optionalId = (what: string) => z.preprocess(blank, z.coerce.number({ error: `choose a ${what}` }).int().positive(`choose a ${what}`).optional());
const jsonField = <S extends z.ZodType>(schema: S, example: string) =>
  z.preprocess(blank, z.unknown()).transform((value, ctx): z.infer<S> | undefined => {
    if (value === undefined) return undefined;
    let parsed: unknown = value;
    if (typeof value === "string") {
      try {
        parsed = JSON.parse(value);
      } catch {
        ctx.addIssue({ code: "custom", message: `not valid JSON, e.g. ${example}` });
        return z.NEVER;
      }
    }
    const r = schema.safeParse(parsed);
    if (!r.success) {
      ctx.addIssue({ code: "custom", message: `expected JSON like ${example}` });
      return z.NEVER;
    }
    return r.data;
  });

export const mappingSchema = z.record(z.string().min(1).max(200), z.string().trim().min(1).max(40)).refine((m) => Object.keys(m).length <= 64, "at most 64 columns");
export const setPointsSchema = z.union([z.record(z.string().max(40), z.number().finite()), z.array(z.number().finite()).max(40)]);

/** The form fields of an upload (multipart strings or already-typed values). */
export const runUploadSchema = z.object({
  windowId: optionalId("process window"),
  boardId: optionalId("test board"),
  instrumentId: optionalId("instrument"),
  mapping: jsonField(mappingSchema, '{"TC1 (°C)": "P1"}'),
  startState: z.preprocess(blank, z.enum(["cold", "hot"], { error: "cold or hot" }).optional()),
  conveyorSpeed: z.preprocess(blank, z.coerce.number({ error: "a number (cm/min)" }).finite().min(0, "cannot be negative").max(1000, "at most 1000 cm/min").optional()),
  setPoints: jsonField(setPointsSchema, '{"Z1": 120, "Z2": 150}'),
  runAt: z.preprocess(blank, plantDate("an ISO date-time, e.g. 2026-03-01T08:30:00Z").optional()),
  operator: z.preprocess(blank, z.string().trim().max(80, "at most 80 characters").optional()),
  notes: z.preprocess(blank, z.string().trim().max(2000, "at most 2000 characters").optional()),
});
export type RunUploadInput = Partial<z.infer<typeof runUploadSchema>>;

export const RUN_SORTS = ["runAt", "-runAt", "deltaTPeak", "-deltaTPeak", "windowUse", "-windowUse", "peakMin", "-peakMin", "criticalSpread", "-criticalSpread", "talMin", "-talMin"] as const;
export type RunSort = (typeof RUN_SORTS)[number];

export const runListQuerySchema = z.object({
  ovenId: optionalId("oven"),
  windowId: optionalId("window"),
  instrumentId: optionalId("instrument"),
  boardId: optionalId("board"),
  verdict: z.preprocess(blank, z.enum(["pass", "marginal", "fail"], { error: "pass, marginal or fail" }).optional()),
  calibration: z.preprocess(blank, z.enum(["valid", "lapsed", "none"], { error: "valid, lapsed or none" }).optional()),
  from: z.preprocess(blank, plantDate("a date, e.g. 2026-01-31").optional()),
  to: z.preprocess(blank, plantDate("a date, e.g. 2026-01-31").optional()),
  page: z.preprocess(blank, z.coerce.number().int().min(1, "at least 1").default(1)),
  pageSize: z.preprocess(blank, z.coerce.number().int().min(1, "at least 1").max(200, "at most 200").default(25)),
  sort: z.preprocess(blank, z.enum(RUN_SORTS, { error: `one of ${RUN_SORTS.join(", ")}` }).default("-runAt")),
});
export type RunListQuery = z.infer<typeof runListQuerySchema>;

export const rejudgeSchema = z.object({ windowId: optionalId("process window") });
