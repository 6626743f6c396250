import { z } from "zod";
import { plantDate } from "./dates";

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);
const optionalNumber = (msg: string, min: number, max: number) =>
  z.preprocess(blank, z.coerce.number({ error: msg }).finite(msg).min(min, `at least ${min}`).max(max, `at most ${max}`).optional());
const optionalText = (max: number) => z.preprocess(blank, z.string().trim().max(max, `at most ${max} characters`).optional());

export const THERMOCOUPLE_TYPES = ["K", "J", "T", "N", "E"] as const;
export const TOLERANCE_CLASSES = ["iec-1", "iec-2", "iec-3", "astm-standard", "astm-special"] as const;
export const TOLERANCE_CLASS_LABELS: Record<(typeof TOLERANCE_CLASSES)[number], string> = {
  "iec-1": "IEC 60584-1 class 1",
  "iec-2": "IEC 60584-1 class 2",
  "iec-3": "IEC 60584-1 class 3",
  "astm-standard": "ASTM E230 standard limits",
  "astm-special": "ASTM E230 special limits",
};

export const instrumentSchema = z.object({
  kind: z.enum(["logger", "probe_set"], { error: "logger or probe set" }),
  name: z.string({ error: "is required" }).trim().min(1, "is required").max(80, "at most 80 characters"),
  serial: z.string({ error: "is required" }).trim().min(1, "is required").max(60, "at most 60 characters"),
  channelCount: z.coerce.number({ error: "a whole number" }).int("a whole number").min(1, "at least 1").max(64, "at most 64"),
  scanSkewSeconds: z.preprocess(blank, z.coerce.number({ error: "a number of seconds" }).finite().min(0, "cannot be negative").max(10, "at most 10 s").default(0)),
  resolution: optionalNumber("a number (°C)", 0, 10),
  accuracy: optionalNumber("a number (°C)", 0, 50),
  thermocoupleType: z.preprocess(blank, z.enum(THERMOCOUPLE_TYPES, { error: "K, J, T, N or E" }).optional()),
  toleranceClass: z.preprocess(blank, z.enum(TOLERANCE_CLASSES, { error: "choose a tolerance class" }).optional()),
  notes: optionalText(2000),
});
export type InstrumentInput = z.infer<typeof instrumentSchema>;
export const instrumentUpdateSchema = instrumentSchema.partial();

const offsetsSchema = z.record(z.string().regex(/^\d{1,2}$/, "channel numbers"), z.number().finite().min(-20).max(20));

export const calibrationSchema = z
  .object({
    performedAt: plantDate("a date as YYYY-MM-DD"),
    performedBy: z.string({ error: "is required" }).trim().min(1, "is required").max(80, "at most 80 characters"),
    reference: z.string({ error: "is required" }).trim().min(1, "is required").max(200, "at most 200 characters"),
    offsets: z.preprocess((v) => {
      if (v === undefined || v === "" || v === null) return {};
      if (typeof v !== "string") return v;
      try {
        return JSON.parse(v);
      } catch {
        return "bad";
      }
    }, offsetsSchema.or(z.literal("bad")).refine((v) => v !== "bad", 'not valid JSON, e.g. {"1": -0.2, "2": 0.1}')),
    expandedUncertainty: optionalNumber("a number (°C)", 0, 20),
    dueAt: z.preprocess(blank, plantDate("a date as YYYY-MM-DD").optional()),
  })
  .transform((v) => ({ ...v, offsets: v.offsets as Record<string, number> }))
  .refine((v) => !v.dueAt || v.dueAt > v.performedAt, { message: "must be after the calibration date", path: ["dueAt"] });
export type CalibrationInput = z.infer<typeof calibrationSchema>;

export const CALIBRATION_DUE_SOON_DAYS = 30;
