import { describe, expect, it } from "vitest";
import { welchTTest, welchTTestFromSummary } from "@/lib/drift/welch-t-test";

describe("Welch's t-test — R `sleep` data (Cushny & Peebles 1905; REFERENCES §5a)", () => {
  const group1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
  const group2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];
  // R's t.test(extra ~ group) reports group1 − group2, so group1 plays "after" here.
  const r = welchTTest(group2, group1)!;

  it("t = −1.8608, df = 17.776, two-sided p = 0.07939 (R t.test output [MEMORY]; afex docs t = −1.861, df = 17.78, p = 0.07939 [OPENED])", () => {
    expect(r.t).toBeCloseTo(-1.8608, 4);
    expect(r.df).toBeCloseTo(17.776, 3);
    expect(r.pTwoSided).toBeCloseTo(0.07939, 5);
  });

  it("95 % CI −3.3654832 to 0.2054832 (R t.test output [MEMORY])", () => {
    expect(r.ci[0]).toBeCloseTo(-3.3654832, 6);
    expect(r.ci[1]).toBeCloseTo(0.2054832, 6);
    expect(r.difference).toBeCloseTo(-1.58, 10);
  });

  it("swapping the groups flips the sign of t and the CI, not p", () => {
    const s = welchTTest(group1, group2)!;
    expect(s.t).toBeCloseTo(1.8608, 4);
    expect(s.pTwoSided).toBeCloseTo(r.pTwoSided, 12);
    expect(s.ci[0]).toBeCloseTo(-r.ci[1], 10);
  });
});

describe("Welch's t-test — NIST AUTO83B summary statistics via Boost.Math students_t_two_samples (REFERENCES §5b)", () => {
  // Sample 1 (n 249, mean 20.14458, sd 6.414700) as "after", sample 2 as "before", so t has Boost's sign.
  const r = welchTTestFromSummary({ n: 79, mean: 30.48101, sd: 6.10771 }, { n: 249, mean: 20.14458, sd: 6.4147 })!;

  it("t = −12.946 and df = 136.87 (Boost example output)", () => {
    expect(r.t).toBeCloseTo(-12.946, 3);
    expect(r.df).toBeCloseTo(136.87, 2);
  });

  it("one-sided p = 7.855e−26 (Boost example output), compared by relative error", () => {
    const oneSided = r.pLower;
    expect(oneSided).toBeCloseTo(r.pTwoSided / 2, 40);
    expect(Math.abs(oneSided - 7.855e-26) / 7.855e-26).toBeLessThan(1e-3);
    expect(Math.abs(Math.log(oneSided) - Math.log(7.855e-26))).toBeLessThan(1e-3);
  });

  it("returns null when a group has a single run", () => {
    expect(welchTTest([1], [2, 3])).toBeNull();
  });
});
