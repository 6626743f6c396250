// Runs-needed planner: runs per group to detect a shift δ with a two-sided test at level α
// and the given power, normal approximation: n = 2·((z₁₋α/₂ + z_power)·σ/δ)², rounded up.
// A result below 2 is raised to 2, the least a before/after comparison can use.
import { normalQuantile } from "./normal-quantile";

export interface RunsNeeded {
  nPerGroup: number;
  exact: number;
  zAlpha: number;
  zPower: number;
}

/** Null when δ is 0 (no finite number of runs detects no difference). */
export function runsNeeded(args: { delta: number; sigma: number; alpha?: number; power?: number }): RunsNeeded | null {
  const alpha = args.alpha ?? 0.05;
  const power = args.power ?? 0.8;
  if (!(alpha > 0 && alpha < 1) || !(power > 0 && power < 1)) throw new RangeError("runsNeeded: α and power must be in (0, 1)");
  if (!(args.sigma >= 0)) throw new RangeError("runsNeeded: σ must be ≥ 0");
  const delta = Math.abs(args.delta);
  if (delta === 0) return null;
  const zAlpha = normalQuantile(1 - alpha / 2);
  const zPower = normalQuantile(power);
  const exact = 2 * ((zAlpha + zPower) * args.sigma / delta) ** 2;
  // Guard against 16.000000000000004-style rounding pushing a whole number up by one.
  const nPerGroup = Math.max(2, Math.ceil(exact - 1e-9));
  return { nPerGroup, exact, zAlpha, zPower };
}
