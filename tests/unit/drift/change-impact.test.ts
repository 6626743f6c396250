// Measurement-uncertainty rule for a before/after difference, and edge cases of Welch's test.
// Invented numbers except where a source is named.
import { describe, expect, it } from "vitest";
import { differenceResolvable, differenceUncertainty, measurementUncertainty, type UncertaintyComponent } from "@/lib/drift/measurement-uncertainty";
import { welchTTest } from "@/lib/drift/welch-t-test";

const budget: UncertaintyComponent[] = [
  { label: "probe tolerance", kind: "rectangular", halfWidth: 1.5, systematic: true },
  { label: "logger resolution", kind: "resolution", step: 0.1 },
  { label: "calibration certificate", kind: "expanded", expanded: 0.5, k: 2, systematic: true },
  { label: "repeatability", kind: "typeA", sd: 0.3, n: 5 },
];

describe("differenceUncertainty", () => {
  it("same instrument: systematic parts cancel, random parts count on both sides (√2)", () => {
    const random = measurementUncertainty(budget.filter((c) => !c.systematic));
    const d = differenceUncertainty(budget, { sameInstrument: true });
    expect(d.components.map((c) => c.label)).toEqual(["logger resolution (before and after)", "repeatability (before and after)"]);
    expect(d.combined).toBeCloseTo(Math.SQRT2 * random.combined, 14);
    expect(d.expanded).toBeCloseTo(2 * d.combined, 14);
  });

  it("different instrument: nothing cancels", () => {
    const all = measurementUncertainty(budget);
    expect(differenceUncertainty(budget, { sameInstrument: false }).expanded).toBeCloseTo(Math.SQRT2 * all.expanded, 14);
  });

  it("sensitivity coefficients scale a component", () => {
    const u = measurementUncertainty([{ label: "mV input", kind: "standard", u: 0.01, sensitivity: 24.4 }]);
    expect(u.combined).toBeCloseTo(0.244, 12);
  });
});

describe("differenceResolvable: |difference| > U", () => {
  it("compares the magnitude against U, strictly", () => {
    expect(differenceResolvable({ difference: -0.5, expandedUncertainty: 0.4 })).toBe(true);
    expect(differenceResolvable({ difference: 0.4, expandedUncertainty: 0.4 })).toBe(false);
    expect(differenceResolvable({ difference: 0.1, expandedUncertainty: 0.4 })).toBe(false);
  });
});

describe("welchTTest edge cases", () => {
  it("zero spread in both groups: t, df, p are NaN and the CI collapses to the difference", () => {
    const r = welchTTest([3, 3, 3], [4, 4])!;
    expect(r.difference).toBe(1);
    expect(Number.isNaN(r.t) && Number.isNaN(r.df) && Number.isNaN(r.pTwoSided)).toBe(true);
    expect(r.ci).toEqual([1, 1]);
  });

  it("equal variances and sizes give df = 2(n − 1) (Welch–Satterthwaite property)", () => {
    const r = welchTTest([1, 2, 3, 4], [11, 12, 13, 14])!;
    expect(r.df).toBeCloseTo(6, 12);
    expect(r.difference).toBe(10);
  });
});
