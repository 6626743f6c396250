import { z } from "zod";
import type { AnalyzeOptions } from "./analyze";
import { invalidOptions, type ThermalFileError } from "./errors";
import { findWindowPreset, processWindowSchema, WINDOW_PRESETS } from "./windows";

/**
 * Analysis options as they arrive from a form or multipart upload (all strings), shared by the
 * API route and the CLI. Empty strings count as absent. JSON fields may also arrive already parsed.
 */
const blank = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

const numberField = (field: string, min: number, max: number, unit: string) =>
  z.preprocess(
    (v) => {
      const b = blank(v);
      return typeof b === "string" ? Number(b.trim().replace(",", ".")) : b;
    },
    z
      .number({ error: `${field} must be a number (${unit}).` })
      .finite(`${field} must be a finite number (${unit}).`)
      .min(min, `${field} must be at least ${min} ${unit}.`)
      .max(max, `${field} must be at most ${max} ${unit}.`)
      .optional(),
  );

function parseJson(value: unknown, field: string, ctx: z.RefinementCtx): unknown {
  if (typeof value !== "string") return value;
  try {
    return JSON.parse(value);
  } catch {
    ctx.addIssue({ code: "custom", message: `${field} is not valid JSON.` });
    return z.NEVER;
  }
}

const windowField = z.preprocess(blank, z.unknown()).transform((value, ctx) => {
  if (value === undefined) return undefined;
  if (typeof value === "string" && !value.trim().startsWith("{")) {
    const preset = findWindowPreset(value.trim());
    if (preset) return preset.window;
    ctx.addIssue({ code: "custom", message: `window "${value}" is neither a process window (JSON) nor a preset id (${WINDOW_PRESETS.map((p) => p.id).join(", ")}).` });
    return z.NEVER;
  }
  const json = parseJson(value, "window", ctx);
  const parsed = processWindowSchema.safeParse(json);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", message: `window: ${issue.message}`, path: issue.path });
    return z.NEVER;
  }
  return parsed.data;
});

const offsetsField = z.preprocess(blank, z.unknown()).transform((value, ctx) => {
  if (value === undefined) return undefined;
  const json = parseJson(value, "offsets", ctx);
  const parsed = z.record(z.string(), z.number().finite().min(-100).max(100)).safeParse(json);
  if (!parsed.success) {
    ctx.addIssue({ code: "custom", message: 'offsets must map probe names to °C between -100 and 100, e.g. {"TC1": -0.4}.' });
    return z.NEVER;
  }
  return parsed.data;
});

const columnsField = z.preprocess(blank, z.unknown()).transform((value, ctx) => {
  if (value === undefined) return undefined;
  // A JSON array, or a comma-separated list for hand-typed input.
  const json = typeof value === "string" && !value.trim().startsWith("[") ? value.split(",").map((s) => s.trim()) : parseJson(value, "columns", ctx);
  const parsed = z.array(z.string().min(1)).min(1).max(64).safeParse(json);
  if (!parsed.success) {
    ctx.addIssue({ code: "custom", message: 'columns must list probe column names, e.g. ["TC1","TC2"].' });
    return z.NEVER;
  }
  return parsed.data;
});

export const analysisOptionsSchema = z.object({
  window: windowField,
  skewSeconds: numberField("skewSeconds", -10, 10, "s"),
  offsets: offsetsField,
  thermocouple: z.preprocess(blank, z.enum(["K", "J", "T"], { error: "thermocouple must be K, J or T." }).optional()),
  coldJunctionC: numberField("coldJunctionC", -50, 100, "°C"),
  units: z.preprocess(blank, z.enum(["C", "F", "mV"], { error: "units must be C, F or mV." }).optional()),
  setPointColumn: z.preprocess(blank, z.string({ error: "setPointColumn must be a column header." }).max(200).optional()),
  columns: columnsField,
});

export type AnalysisOptionsInput = z.input<typeof analysisOptionsSchema>;

/** Parses string fields into AnalyzeOptions, or throws a ThermalFileError (invalid_options) naming the field. */
export function toAnalyzeOptions(fields: Record<string, unknown>): AnalyzeOptions {
  const parsed = analysisOptionsSchema.safeParse(fields);
  if (!parsed.success) throw optionsError(parsed.error);
  const out: AnalyzeOptions = {};
  for (const [key, value] of Object.entries(parsed.data)) {
    if (value !== undefined) (out as Record<string, unknown>)[key] = value;
  }
  return out;
}

function optionsError(error: z.ZodError): ThermalFileError {
  const issue = error.issues[0];
  return invalidOptions(issue.path.map(String).join(".") || "options", issue.message);
}
