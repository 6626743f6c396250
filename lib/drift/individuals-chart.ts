// Individuals (X) and moving-range (MR) chart from a baseline: centre = mean,
// σ̂ = MR̄ / d₂ (d₂ = 1.128 for ranges of two consecutive values), limits centre ± 3σ̂.
import { D2, D4_MOVING_RANGE } from "./constants";
import { mean } from "./stats";

export interface IndividualsStats {
  mean: number;
  /** Average moving range of consecutive values. */
  mrBar: number;
  /** MR̄ / 1.128; 0 when every value is equal. */
  sigma: number;
  n: number;
}

export interface IndividualsLimits {
  centre: number;
  sigma: number;
  ucl: number;
  lcl: number;
  /** Moving-range chart: centre MR̄, UCL = 3.267·MR̄, LCL = 0. */
  mrCentre: number;
  mrUcl: number;
}

export function movingRanges(values: readonly number[]): number[] {
  const out: number[] = [];
  for (let i = 1; i < values.length; i++) out.push(Math.abs(values[i] - values[i - 1]));
  return out;
}

/** Baseline statistics; needs at least two values (one moving range). */
export function individualsStats(values: readonly number[]): IndividualsStats {
  if (values.length < 2) throw new RangeError("individualsStats: needs at least two values");
  const mrBar = mean(movingRanges(values));
  return { mean: mean(values), mrBar, sigma: mrBar / D2, n: values.length };
}

export function individualsLimits(stats: { mean: number; sigma: number; mrBar?: number }, width = 3): IndividualsLimits {
  const mrBar = stats.mrBar ?? stats.sigma * D2;
  return {
    centre: stats.mean,
    sigma: stats.sigma,
    ucl: stats.mean + width * stats.sigma,
    lcl: stats.mean - width * stats.sigma,
    mrCentre: mrBar,
    mrUcl: D4_MOVING_RANGE * mrBar,
  };
}
