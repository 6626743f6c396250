import { z } from "zod";

/**
 * A process window: the limits a run is judged against. Temperatures in °C, times in s, rates in
 * °C/s. This file imports only zod so forms, actions and route handlers can share the schema.
 */
const celsius = (field: string) =>
  z.number({ error: `${field} must be a number (°C).` }).finite().min(-50, `${field} must be at least -50 °C.`).max(500, `${field} must be at most 500 °C.`);
const seconds = (field: string) =>
  z.number({ error: `${field} must be a number of seconds.` }).finite().min(0, `${field} cannot be negative.`).max(36000, `${field} must be at most 36000 s.`);
const rate = (field: string) =>
  z.number({ error: `${field} must be a number (°C/s).` }).finite().gt(0, `${field} must be greater than 0 °C/s.`).max(100, `${field} must be at most 100 °C/s.`);

const windowShape = z.object({
  liquidus: celsius("liquidus"),
  peakMin: celsius("peakMin"),
  peakMax: celsius("peakMax"),
  talMin: seconds("talMin"),
  talMax: seconds("talMax"),
  soakStart: celsius("soakStart"),
  soakEnd: celsius("soakEnd"),
  soakMin: seconds("soakMin"),
  soakMax: seconds("soakMax"),
  rampUpMax: rate("rampUpMax"),
  rampDownMax: rate("rampDownMax"),
  rampWindow: seconds("rampWindow").gt(0, "rampWindow must be greater than 0 s."),
  heatUpFrom: celsius("heatUpFrom"),
  heatUpTo: celsius("heatUpTo"),
  deltaTMax: z.number({ error: "deltaTMax must be a number (°C)." }).finite().gt(0, "deltaTMax must be greater than 0 °C.").max(200, "deltaTMax must be at most 200 °C."),
  timeToPeakMax: seconds("timeToPeakMax").gt(0, "timeToPeakMax must be greater than 0 s."),
  criticalSpreadMax: z.number({ error: "criticalSpreadMax must be a number (°C)." }).finite().gt(0, "criticalSpreadMax must be greater than 0 °C.").max(200, "criticalSpreadMax must be at most 200 °C.").optional(),
});

type Shape = z.infer<typeof windowShape>;

const ORDERED: ReadonlyArray<[keyof Shape, keyof Shape, string]> = [
  ["peakMin", "peakMax", "°C"],
  ["talMin", "talMax", "s"],
  ["soakStart", "soakEnd", "°C"],
  ["soakMin", "soakMax", "s"],
  ["heatUpFrom", "heatUpTo", "°C"],
  ["liquidus", "peakMin", "°C"],
];

export const processWindowSchema = windowShape.superRefine((w, ctx) => {
  for (const [low, high, unit] of ORDERED) {
    const a = w[low] as number;
    const b = w[high] as number;
    if (!(a < b)) {
      ctx.addIssue({ code: "custom", path: [high], message: `${high} (${b} ${unit}) must be greater than ${low} (${a} ${unit}).` });
    }
  }
});

export type ProcessWindow = z.infer<typeof processWindowSchema>;

export interface WindowPreset {
  id: string;
  name: string;
  /** Where the limits come from. */
  source: string;
  /** Our choices for parameters the source does not give, and cautions. */
  note: string;
  window: ProcessWindow;
}

const ANALYSIS_DEFAULTS = { rampWindow: 10, heatUpFrom: 50, heatUpTo: 150 } as const;
const DEFAULTS_NOTE =
  "Not in the source, Ovenward defaults: rampWindow 10 s (least-squares slope; the trade has no standard window), " +
  "heat-up rate measured from 50 °C to 150 °C, and deltaTMax 10 °C (common practice: assembly ΔT at peak below about 10 °C).";

export const WINDOW_PRESETS: readonly WindowPreset[] = [
  {
    id: "sac305-typical",
    name: "SAC305 paste, typical window",
    source:
      "Typical SAC305 (Sn96.5Ag3.0Cu0.5) assembly profile, Tuya CB3S module datasheet p. 23: liquidus 217 °C, ramp 1–3 °C/s, " +
      "soak 150–200 °C for 60–120 s, time above liquidus 50–70 s, peak 235–245 °C, ramp-down 1–4 °C/s. The Lantronix PW2050 " +
      "integration guide p. 27 gives the same peak and soak (and accepts 40–90 s above 217 °C). Time 25 °C to peak: 8 min max, IPC/JEDEC J-STD-020 Pb-free.",
    note: `${DEFAULTS_NOTE} Check the paste maker's datasheet for the paste actually used; this is a general window, not a paste recipe.`,
    window: {
      liquidus: 217, peakMin: 235, peakMax: 245, talMin: 50, talMax: 70,
      soakStart: 150, soakEnd: 200, soakMin: 60, soakMax: 120,
      rampUpMax: 3, rampDownMax: 4, deltaTMax: 10, timeToPeakMax: 480, ...ANALYSIS_DEFAULTS,
    },
  },
  {
    id: "sn63pb37-typical",
    name: "Sn63Pb37 paste, typical window",
    source:
      "Typical Sn63/Pb37 assembly profile, Ebyte E18 user manual §8.1: preheat 100–150 °C for 60–120 s, liquidus 183 °C, " +
      "time above liquidus 60–90 s, peak 220–235 °C, ramp-up at most 3 °C/s, ramp-down at most 6 °C/s, 25 °C to peak at most 6 min.",
    note: `${DEFAULTS_NOTE} Check the paste maker's datasheet for the paste actually used.`,
    window: {
      liquidus: 183, peakMin: 220, peakMax: 235, talMin: 60, talMax: 90,
      soakStart: 100, soakEnd: 150, soakMin: 60, soakMax: 120,
      rampUpMax: 3, rampDownMax: 6, deltaTMax: 10, timeToPeakMax: 360, ...ANALYSIS_DEFAULTS,
    },
  },
  {
    id: "jstd020-pb-free",
    name: "J-STD-020 Pb-free classification limits",
    source:
      "IPC/JEDEC J-STD-020D Table 5-2, Pb-free assembly (as reproduced in the Pericom/SaRonix and Diodes Inc. application notes): " +
      "Tsmin 150 °C, Tsmax 200 °C, ts 60–120 s, ramp-up (TL to Tp) 3 °C/s max, TL 217 °C, tL 60–150 s, ramp-down 6 °C/s max, 25 °C to peak 8 min max. " +
      "Peak 245–260 °C spans the Table 4-2 classification temperatures Tc.",
    note:
      `Classification limits are component limits (what a package must survive), not a paste recipe: board profiles should stay inside them, ` +
      `and the peak must not exceed the Tc of the most sensitive package (245, 250 or 260 °C by thickness and volume). ${DEFAULTS_NOTE}`,
    window: {
      liquidus: 217, peakMin: 245, peakMax: 260, talMin: 60, talMax: 150,
      soakStart: 150, soakEnd: 200, soakMin: 60, soakMax: 120,
      rampUpMax: 3, rampDownMax: 6, deltaTMax: 10, timeToPeakMax: 480, ...ANALYSIS_DEFAULTS,
    },
  },
  {
    id: "jstd020-snpb",
    name: "J-STD-020 Sn-Pb eutectic classification limits",
    source:
      "IPC/JEDEC J-STD-020D Table 5-2, Sn-Pb eutectic assembly (as reproduced in the Pericom/SaRonix and Diodes Inc. application notes): " +
      "Tsmin 100 °C, Tsmax 150 °C, ts 60–120 s, ramp-up (TL to Tp) 3 °C/s max, TL 183 °C, tL 60–150 s, ramp-down 6 °C/s max, 25 °C to peak 6 min max. " +
      "Peak 220–235 °C spans the Table 4-1 classification temperatures Tc (Table 4-1 values from memory, corroborated by the TDK B57820M datasheet).",
    note:
      `Classification limits are component limits (what a package must survive), not a paste recipe: board profiles should stay inside them, ` +
      `and the peak must not exceed the Tc of the most sensitive package (220 or 235 °C by thickness and volume). ${DEFAULTS_NOTE}`,
    window: {
      liquidus: 183, peakMin: 220, peakMax: 235, talMin: 60, talMax: 150,
      soakStart: 100, soakEnd: 150, soakMin: 60, soakMax: 120,
      rampUpMax: 3, rampDownMax: 6, deltaTMax: 10, timeToPeakMax: 360, ...ANALYSIS_DEFAULTS,
    },
  },
];

export const DEFAULT_WINDOW_PRESET_ID = "sac305-typical";

export function findWindowPreset(id: string): WindowPreset | undefined {
  return WINDOW_PRESETS.find((p) => p.id === id);
}

/** The default process window: the typical SAC305 paste window. */
export const DEFAULT_WINDOW: ProcessWindow = findWindowPreset(DEFAULT_WINDOW_PRESET_ID)!.window;
