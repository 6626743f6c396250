// EWMA chart (Roberts 1959; NIST/SEMATECH e-Handbook 6.3.2.4):
// zᵢ = λxᵢ + (1 − λ)zᵢ₋₁ with z₀ = the baseline centre, and limits
// centre ± Lσ√(λ/(2 − λ)·(1 − (1 − λ)^(2i))) — the exact, time-varying form, i = 1 for the
// first monitored run. As i grows they approach the asymptotic centre ± Lσ√(λ/(2 − λ)).

export interface EwmaLimits {
  ucl: number;
  lcl: number;
}

export function ewmaNext(previous: number, value: number, lambda: number): number {
  return lambda * value + (1 - lambda) * previous;
}

/** Standard-deviation multiplier of zᵢ relative to σ (exact form). */
export function ewmaExactFactor(lambda: number, i: number): number {
  return Math.sqrt((lambda / (2 - lambda)) * (1 - Math.pow(1 - lambda, 2 * i)));
}

export function ewmaAsymptoticFactor(lambda: number): number {
  return Math.sqrt(lambda / (2 - lambda));
}

export function ewmaExactLimits(centre: number, sigma: number, lambda: number, L: number, i: number): EwmaLimits {
  const half = L * sigma * ewmaExactFactor(lambda, i);
  return { ucl: centre + half, lcl: centre - half };
}

export function ewmaAsymptoticLimits(centre: number, sigma: number, lambda: number, L: number): EwmaLimits {
  const half = L * sigma * ewmaAsymptoticFactor(lambda);
  return { ucl: centre + half, lcl: centre - half };
}

/** EWMA values for a whole series, starting from z₀ = `start`. */
export function ewmaSeries(values: readonly number[], start: number, lambda: number): number[] {
  const out: number[] = [];
  let z = start;
  for (const x of values) {
    z = ewmaNext(z, x, lambda);
    out.push(z);
  }
  return out;
}
