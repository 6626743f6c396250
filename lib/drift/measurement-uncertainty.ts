// Measurement-system uncertainty after the GUM (JCGM 100:2008): each component becomes a
// standard uncertainty (rectangular a/√3, triangular a/√6, certificate U/k, Type A s/√n),
// times its sensitivity coefficient; u_c is their root sum of squares (uncorrelated inputs)
// and U = k·u_c with k = 2 (about 95 %).
//
// Difference of two means (change impact) — the rule we apply: a component marked
// `systematic` is a fixed error of the same instrument and probes (calibration offset, a
// probe's tolerance offset); on the same instrument it is identical before and after and
// cancels in the difference. Every other component enters each side independently, so the
// difference carries √2 times it. If the instrument or probes changed (or were recalibrated)
// between the two sides, nothing cancels: all components count, each √2 times. Run-to-run
// scatter is already in the Welch standard error; this is the measurement floor on top of it.
// A difference is "resolvable" when |difference| > U.

export type UncertaintyComponent = {
  label: string;
  /** Sensitivity coefficient cᵢ; 1 when the input is in the measurand's unit. */
  sensitivity?: number;
  systematic?: boolean;
} & (
  | { kind: "rectangular"; halfWidth: number }
  | { kind: "triangular"; halfWidth: number }
  /** A digital resolution step: rectangular with half-width step/2. */
  | { kind: "resolution"; step: number }
  /** A certificate's expanded uncertainty U at coverage factor k. */
  | { kind: "expanded"; expanded: number; k: number }
  /** Type A: standard deviation of the mean of n readings, s/√n. */
  | { kind: "typeA"; sd: number; n: number }
  | { kind: "standard"; u: number }
);

export interface UncertaintyBudget {
  components: { label: string; u: number; systematic: boolean }[];
  combined: number;
  coverageFactor: number;
  expanded: number;
}

export function standardUncertainty(c: UncertaintyComponent): number {
  let u: number;
  switch (c.kind) {
    case "rectangular":
      u = c.halfWidth / Math.sqrt(3);
      break;
    case "triangular":
      u = c.halfWidth / Math.sqrt(6);
      break;
    case "resolution":
      u = c.step / 2 / Math.sqrt(3);
      break;
    case "expanded":
      u = c.expanded / c.k;
      break;
    case "typeA":
      u = c.sd / Math.sqrt(c.n);
      break;
    case "standard":
      u = c.u;
      break;
  }
  return Math.abs((c.sensitivity ?? 1) * u);
}

export function measurementUncertainty(
  components: readonly UncertaintyComponent[],
  options: { coverageFactor?: number } = {},
): UncertaintyBudget {
  const k = options.coverageFactor ?? 2;
  const rows = components.map((c) => ({ label: c.label, u: standardUncertainty(c), systematic: c.systematic === true }));
  const combined = Math.sqrt(rows.reduce((s, r) => s + r.u * r.u, 0));
  return { components: rows, combined, coverageFactor: k, expanded: k * combined };
}

/** The budget that applies to (mean after − mean before); see the rule at the top of the file. */
export function differenceUncertainty(
  components: readonly UncertaintyComponent[],
  options: { sameInstrument: boolean; coverageFactor?: number },
): UncertaintyBudget {
  const kept = options.sameInstrument ? components.filter((c) => c.systematic !== true) : components;
  const perSide = measurementUncertainty(kept, options);
  const rows = perSide.components.map((r) => ({ ...r, label: `${r.label} (before and after)`, u: r.u * Math.SQRT2 }));
  const combined = perSide.combined * Math.SQRT2;
  return { components: rows, combined, coverageFactor: perSide.coverageFactor, expanded: perSide.coverageFactor * combined };
}

export function differenceResolvable(args: { difference: number; expandedUncertainty: number }): boolean {
  return Math.abs(args.difference) > args.expandedUncertainty;
}
