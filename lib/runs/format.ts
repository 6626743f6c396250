/** Numbers for people: fixed decimals, a dash for a missing value. */
export function fmt(value: number | null | undefined, decimals = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return value.toFixed(decimals);
}

export const METRIC_LABELS = {
  peak: "Peak",
  tal: "Time above liquidus",
  soakTime: "Soak time",
  rampUp: "Ramp-up rate",
  rampDown: "Ramp-down rate",
  deltaT: "ΔT at peak",
  timeToPeak: "Time to peak",
  criticalSpread: "Critical-phase spread",
} as const;
