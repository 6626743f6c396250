import type { ProcessWindow } from "@/lib/thermal/windows";

// The run metrics Ovenward tracks for drift, how they are named, and which window limit each
// one is projected towards (direction: the side on which crossing the limit is bad).
export const TRACKED_METRICS = ["deltaTPeak", "criticalSpread", "heatUpRate", "peakMin", "talMin", "timeToPeakMax"] as const;
export type TrackedMetric = (typeof TRACKED_METRICS)[number];

export const METRIC_INFO: Record<TrackedMetric, { label: string; unit: string; decimals: number; limit: (w: ProcessWindow) => { value: number; direction: "above" | "below" } | null }> = {
  deltaTPeak: { label: "ΔT at peak", unit: "°C", decimals: 1, limit: (w) => ({ value: w.deltaTMax, direction: "above" }) },
  criticalSpread: { label: "Critical-phase spread", unit: "°C", decimals: 1, limit: (w) => (w.criticalSpreadMax != null ? { value: w.criticalSpreadMax, direction: "above" } : null) },
  heatUpRate: { label: "Heat-up rate", unit: "°C/s", decimals: 2, limit: () => null },
  peakMin: { label: "Peak of the coldest probe", unit: "°C", decimals: 1, limit: (w) => ({ value: w.peakMin, direction: "below" }) },
  talMin: { label: "Shortest time above liquidus", unit: "s", decimals: 1, limit: (w) => ({ value: w.talMin, direction: "below" }) },
  timeToPeakMax: { label: "Time to peak", unit: "s", decimals: 0, limit: (w) => ({ value: w.timeToPeakMax, direction: "above" }) },
};

export function isTrackedMetric(v: string): v is TrackedMetric {
  return (TRACKED_METRICS as readonly string[]).includes(v);
}
