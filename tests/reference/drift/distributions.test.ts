import { describe, expect, it } from "vitest";
import { normalQuantile } from "@/lib/drift/normal-quantile";
import { runsNeeded } from "@/lib/drift/runs-needed";
import { studentTCdf, studentTQuantile } from "@/lib/drift/student-t";

describe("normal quantile (Wichura AS 241)", () => {
  it("z₀.₉₇₅ = 1.959964 and z₀.₈ = 0.841621 (standard normal table values, as given in the planner spec)", () => {
    expect(normalQuantile(0.975)).toBeCloseTo(1.959964, 6);
    expect(normalQuantile(0.8)).toBeCloseTo(0.841621, 6);
  });

  it("z₀.₉₉₈₆₅ ≈ 3 and P(|Z| > 3) = 0.002700 (REFERENCES §4e [COMPUTED])", () => {
    expect(normalQuantile(1 - 0.0027 / 2)).toBeCloseTo(3, 3);
  });

  // 2^-30 is used rather than 1e-12 because 1 − 2^-30 is exact in binary floating point.
  it("is antisymmetric about p = 0.5", () => {
    for (const p of [2 ** -30, 0.001, 0.1, 0.3]) expect(normalQuantile(p)).toBeCloseTo(-normalQuantile(1 - p), 9);
  });
});

describe("Student t quantile by bisection on the incomplete-beta CDF", () => {
  it("t₀.₉₇₅ with 1 df = 12.7062, 10 df = 2.2281, 18 df = 2.1009 (standard t table [MEMORY])", () => {
    expect(studentTQuantile(0.975, 1)).toBeCloseTo(12.7062, 4);
    expect(studentTQuantile(0.975, 10)).toBeCloseTo(2.2281, 4);
    expect(studentTQuantile(0.975, 18)).toBeCloseTo(2.1009, 4);
  });

  it("t(0.025, 18) = 2.10092 as used in the Montgomery, Peck & Vining Example 2.7 interval (REFERENCES §6b [COMPUTED])", () => {
    expect(studentTQuantile(0.975, 18)).toBeCloseTo(2.10092, 5);
  });

  it("1 df is the Cauchy distribution: CDF(1) = 0.75 exactly (closed form ½ + atan(t)/π)", () => {
    expect(studentTCdf(1, 1)).toBeCloseTo(0.75, 13);
    expect(studentTCdf(-3, 1)).toBeCloseTo(0.5 + Math.atan(-3) / Math.PI, 13);
  });

  it("2 df closed form: CDF(t) = ½ + t / (2√(2 + t²))", () => {
    for (const t of [-5, -0.7, 0.3, 4]) expect(studentTCdf(t, 2)).toBeCloseTo(0.5 + t / (2 * Math.sqrt(2 + t * t)), 13);
  });

  it("quantile inverts the CDF, including fractional df", () => {
    for (const df of [1.5, 17.776, 136.87]) for (const p of [0.001, 0.2, 0.975]) expect(studentTCdf(studentTQuantile(p, df), df)).toBeCloseTo(p, 12);
  });

  it("approaches the normal quantile as df grows, also in AS 241's far tail (p < e⁻²⁵)", () => {
    expect(Math.abs(studentTQuantile(0.975, 1e6) - normalQuantile(0.975))).toBeLessThan(1e-5);
    // Leading Cornish–Fisher term (z³ + z)/(4·df) ≈ 2e-6 here; the two codes share nothing.
    expect(Math.abs(studentTQuantile(1e-20, 1e8) - normalQuantile(1e-20))).toBeLessThan(5e-6);
  });

  it("AS 241's pieces join continuously at the split r = 5 (p = e⁻²⁵)", () => {
    const split = Math.exp(-25);
    expect(Math.abs(normalQuantile(split * (1 - 1e-12)) - normalQuantile(split * (1 + 1e-12)))).toBeLessThan(1e-12);
  });
});

describe("runs-needed planner (two-sample normal approximation)", () => {
  it("σ = δ gives n = 15.7 → 16 per group (standard textbook value, from memory)", () => {
    const r = runsNeeded({ delta: 0.5, sigma: 0.5 })!;
    expect(r.exact).toBeCloseTo(15.7, 1);
    expect(r.nPerGroup).toBe(16);
  });

  it("halving δ quadruples the exact n (property of the formula)", () => {
    const a = runsNeeded({ delta: 1, sigma: 0.8 })!;
    const b = runsNeeded({ delta: 0.5, sigma: 0.8 })!;
    expect(b.exact / a.exact).toBeCloseTo(4, 12);
  });

  it("at least two runs per group; null when δ = 0", () => {
    expect(runsNeeded({ delta: 10, sigma: 0.1 })!.nPerGroup).toBe(2);
    expect(runsNeeded({ delta: 0, sigma: 1 })).toBeNull();
  });
});
