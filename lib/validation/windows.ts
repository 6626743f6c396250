import { z } from "zod";
import { findWindowPreset, processWindowSchema, WINDOW_PRESETS } from "@/lib/thermal/windows";

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);
const num = (v: unknown) => (typeof v === "string" ? (v.trim() === "" ? undefined : Number(v.trim().replace(",", "."))) : v);

export const WINDOW_FIELDS = [
  "liquidus", "peakMin", "peakMax", "talMin", "talMax", "soakStart", "soakEnd", "soakMin", "soakMax",
  "rampUpMax", "rampDownMax", "rampWindow", "heatUpFrom", "heatUpTo", "deltaTMax", "timeToPeakMax", "criticalSpreadMax",
] as const;

/** Accepts either `values` (JSON or object) or the window fields flat, as a form posts them. */
const valuesFrom = (raw: Record<string, unknown>): unknown => {
  if (raw.values !== undefined) {
    if (typeof raw.values === "string") {
      try {
        return JSON.parse(raw.values);
      } catch {
        return raw.values;
      }
    }
    return raw.values;
  }
  const out: Record<string, unknown> = {};
  for (const f of WINDOW_FIELDS) if (raw[f] !== undefined && num(raw[f]) !== undefined) out[f] = num(raw[f]);
  return out;
};

const base = z.object({
  name: z.string({ error: "is required" }).trim().min(1, "is required").max(80, "at most 80 characters"),
  presetId: z.preprocess(blank, z.string().refine((id) => findWindowPreset(id) !== undefined, `one of ${WINDOW_PRESETS.map((p) => p.id).join(", ")}`).optional()),
  notes: z.preprocess(blank, z.string().trim().max(2000, "at most 2000 characters").optional()),
});

export const windowCreateSchema = z.preprocess(
  (raw) => (raw && typeof raw === "object" ? { ...(raw as object), values: valuesFrom(raw as Record<string, unknown>) } : raw),
  base.extend({ values: processWindowSchema }),
);
export const windowUpdateSchema = z.preprocess(
  (raw) => {
    if (!raw || typeof raw !== "object") return raw;
    const r = raw as Record<string, unknown>;
    const hasValues = r.values !== undefined || WINDOW_FIELDS.some((f) => r[f] !== undefined);
    return { ...r, values: hasValues ? valuesFrom(r) : undefined };
  },
  base.partial().extend({ values: processWindowSchema.optional() }),
);
export type WindowCreateInput = z.infer<typeof windowCreateSchema>;
export type WindowUpdateInput = z.infer<typeof windowUpdateSchema>;

export const probePositionSchema = z.object({
  label: z.string().trim().min(1, "a label").max(40, "at most 40 characters"),
  x: z.coerce.number().finite().min(0, "inside the outline"),
  y: z.coerce.number().finite().min(0, "inside the outline"),
  sitsOn: z.string().trim().max(120, "at most 120 characters").default(""),
});

const probesField = z.preprocess((v) => {
  if (typeof v !== "string") return v;
  try {
    return JSON.parse(v);
  } catch {
    return v;
  }
}, z.array(probePositionSchema, { error: 'a JSON list like [{"label":"P1","x":10,"y":20,"sitsOn":"QFN centre"}]' }).min(1, "at least one probe").max(64, "at most 64 probes"));

const boardBase = z.object({
  name: z.string({ error: "is required" }).trim().min(1, "is required").max(80, "at most 80 characters"),
  widthMm: z.coerce.number({ error: "a number (mm)" }).finite().gt(0, "greater than 0 mm").max(2000, "at most 2000 mm"),
  heightMm: z.coerce.number({ error: "a number (mm)" }).finite().gt(0, "greater than 0 mm").max(2000, "at most 2000 mm"),
  probes: probesField,
  notes: z.preprocess(blank, z.string().trim().max(2000, "at most 2000 characters").optional()),
});
const checkProbes = (b: { widthMm?: number; heightMm?: number; probes?: z.infer<typeof probePositionSchema>[] }, ctx: z.RefinementCtx) => {
  if (!b.probes) return;
  const seen = new Set<string>();
  b.probes.forEach((p, i) => {
    if (seen.has(p.label)) ctx.addIssue({ code: "custom", path: ["probes", i, "label"], message: `label ${p.label} is used twice` });
    seen.add(p.label);
    if (b.widthMm !== undefined && p.x > b.widthMm) ctx.addIssue({ code: "custom", path: ["probes", i, "x"], message: `${p.label} lies outside the board's width` });
    if (b.heightMm !== undefined && p.y > b.heightMm) ctx.addIssue({ code: "custom", path: ["probes", i, "y"], message: `${p.label} lies outside the board's height` });
  });
};
export const boardCreateSchema = boardBase.superRefine(checkProbes);
export const boardUpdateSchema = boardBase.partial().superRefine(checkProbes);
export type BoardCreateInput = z.infer<typeof boardCreateSchema>;
export type BoardUpdateInput = z.infer<typeof boardUpdateSchema>;

export const ovenDefaultsSchema = z.object({
  ovenId: z.coerce.number().int().positive(),
  defaultWindowId: z.preprocess(blank, z.coerce.number().int().positive().nullable().default(null)),
  defaultBoardId: z.preprocess(blank, z.coerce.number().int().positive().nullable().default(null)),
});
