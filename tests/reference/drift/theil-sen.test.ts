import { describe, expect, it } from "vitest";
import { theilSen } from "@/lib/drift/theil-sen";

describe("Theil–Sen slope and CI — R statpsych::ci.theil documented example (REFERENCES §6a)", () => {
  const y = [21, 4, 9, 12, 35, 18, 10, 22, 24, 1, 6, 8, 13, 16, 19];
  const x = [67, 28, 30, 28, 52, 40, 25, 37, 44, 10, 14, 20, 28, 40, 51];

  it("estimate 0.5, LL 0.3243243, UL 0.75 (statpsych ci.theil(.05, y, x) [OPENED])", () => {
    const fit = theilSen(x, y)!;
    expect(fit.slope).toBe(0.5);
    expect(fit.ci![0]).toBeCloseTo(0.3243243, 7);
    expect(fit.ci![1]).toBeCloseTo(0.75, 7);
  });

  it("101 pairwise slopes after dropping tied-x pairs (REFERENCES §6a [COMPUTED])", () => {
    expect(theilSen(x, y)!.pairs).toBe(101);
  });

  it("intercept median(y) − b·median(x) = −2.0, SciPy's definition (REFERENCES §6a [COMPUTED])", () => {
    expect(theilSen(x, y, { intercept: "medians" })!.intercept).toBeCloseTo(-2.0, 12);
  });
});
