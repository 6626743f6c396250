// Published worked examples from the NIST/SEMATECH e-Handbook of Statistical Methods,
// section 6.3.2 (values as quoted in REFERENCES.md §4, tagged [SECONDARY] there: the
// handbook pages were read through verbatim quotes, not opened directly).
import { describe, expect, it } from "vitest";
import { CONTROL_CHART_CONSTANTS, D2, D4_MOVING_RANGE } from "@/lib/drift/constants";
import { cusumSeries } from "@/lib/drift/cusum";
import { computeDriftSeries } from "@/lib/drift/drift-series";
import { ewmaAsymptoticLimits, ewmaExactLimits } from "@/lib/drift/ewma";
import { individualsLimits, individualsStats, movingRanges } from "@/lib/drift/individuals-chart";

const toPoints = (values: number[]) => values.map((value, k) => ({ value, at: k * 86_400_000, runId: `g${k + 1}` }));

describe("EWMA — NIST/SEMATECH e-Handbook 6.3.2.4 (λ = 0.3, k = 3, s = 2.0539, target 50)", () => {
  const data = [52.0, 47.0, 53.0, 49.3, 50.1, 47.0, 51.0, 50.1, 51.2, 50.5, 49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1];
  // NIST 6.3.2.4 table, EWMA₁ … EWMA₂₀ (EWMA₀ = 50.00 omitted).
  const published = [50.6, 49.52, 50.56, 50.18, 50.16, 49.21, 49.75, 49.85, 50.26, 50.33, 50.11, 49.36, 49.52, 50.05, 49.38, 49.92, 50.73, 51.23, 51.94, 51.99];
  const params = { lambda: 0.3, L: 3, cusumK: 0.5, cusumH: 5 };
  const series = computeDriftSeries({ mean: 50, sigma: 2.0539 }, toPoints(data), params);

  it("reproduces all 20 EWMA values to 2 dp (NIST 6.3.2.4)", () => {
    expect(series.points.map((p) => Number(p.ewma.toFixed(2)))).toEqual(published);
  });

  it("steady-state limits 52.5884 / 47.4116 (NIST 6.3.2.4; LCL printed 47.4115 from the rounded 0.4201)", () => {
    const lim = ewmaAsymptoticLimits(50, 2.0539, 0.3, 3);
    expect(Math.abs(lim.ucl - 52.5884)).toBeLessThan(1e-4);
    expect(Math.abs(lim.lcl - 47.4115)).toBeLessThanOrEqual(1.5e-4);
    expect(Math.abs(lim.lcl - 47.4116)).toBeLessThan(1e-4);
  });

  it("no point is out of control against the handbook's limits (NIST 6.3.2.4)", () => {
    const lim = ewmaAsymptoticLimits(50, 2.0539, 0.3, 3);
    for (const p of series.points) {
      expect(p.ewma).toBeLessThan(lim.ucl);
      expect(p.ewma).toBeGreaterThan(lim.lcl);
    }
  });

  it("exact time-varying limits: [48.1515, 51.8485] at t = 1, [47.4116, 52.5884] at t = 20 (REFERENCES §4a [COMPUTED] from the NIST formula)", () => {
    expect(series.points[0].ewmaLcl).toBeCloseTo(48.1515, 4);
    expect(series.points[0].ewmaUcl).toBeCloseTo(51.8485, 4);
    expect(series.points[19].ewmaLcl).toBeCloseTo(47.4116, 4);
    expect(series.points[19].ewmaUcl).toBeCloseTo(52.5884, 4);
    const direct = ewmaExactLimits(50, 2.0539, 0.3, 3, 1);
    expect(direct.ucl).toBe(series.points[0].ewmaUcl);
  });
});

describe("CUSUM — NIST/SEMATECH e-Handbook 6.3.2.3 (target 325, σ_x̄ = 0.635, k = 0.3175, h = 4.1959)", () => {
  const data = [324.925, 324.675, 324.725, 324.35, 325.35, 325.225, 324.125, 324.525, 325.225, 324.6, 324.625, 325.15, 328.325, 327.25, 327.825, 328.5, 326.675, 327.775, 326.875, 328.35];
  // NIST 6.3.2.3 table, S_hi for groups 13–20, printed to 2 dp (S_lo is 0 throughout).
  const publishedHigh = [3.01, 4.94, 7.45, 10.63, 11.99, 14.44, 16.0, 19.04];

  it("S_hi of groups 13–20 within 0.005 and S_lo = 0 there (NIST 6.3.2.3)", () => {
    const sums = cusumSeries(data, 325, 0.3175);
    sums.slice(12).forEach((s, k) => {
      expect(Math.abs(s.high - publishedHigh[k])).toBeLessThanOrEqual(0.005 + 1e-9);
      expect(s.low).toBe(0);
    });
  });

  it("first signal at group 14, and groups 14–20 all flagged (NIST 6.3.2.3), via the σ-unit parameters", () => {
    const params = { lambda: 0.2, L: 3, cusumK: 0.5, cusumH: 4.1959 / 0.635 };
    const series = computeDriftSeries({ mean: 325, sigma: 0.635 }, toPoints(data), params);
    const flagged = series.points.filter((p) => p.signals.includes("cusum")).map((p) => p.runId);
    expect(flagged).toEqual(["g14", "g15", "g16", "g17", "g18", "g19", "g20"]);
  });
});

describe("Individuals / moving range — NIST/SEMATECH e-Handbook 6.3.2.2 (flow-rate example)", () => {
  const data = [49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1];

  it("moving ranges 2.0 2.3 1.4 3.5 3.4 1.4 0.2 1.2 1.5 (NIST 6.3.2.2)", () => {
    const mr = movingRanges(data).map((v) => Number(v.toFixed(1)));
    expect(mr).toEqual([2.0, 2.3, 1.4, 3.5, 3.4, 1.4, 0.2, 1.2, 1.5]);
  });

  it("x̄ = 50.81, MR̄ = 1.8778, UCL 55.8041, LCL 45.8159 (NIST 6.3.2.2)", () => {
    const stats = individualsStats(data);
    const lim = individualsLimits(stats);
    expect(stats.mean).toBeCloseTo(50.81, 4);
    expect(stats.mrBar).toBeCloseTo(1.8778, 4);
    expect(lim.ucl).toBeCloseTo(55.8041, 4);
    expect(lim.lcl).toBeCloseTo(45.8159, 4);
  });

  it("MR chart UCL = 3.267 × 1.8778 = 6.1347 (REFERENCES §4c [COMPUTED] from the published constants)", () => {
    expect(individualsLimits(individualsStats(data)).mrUcl).toBeCloseTo(6.1347, 4);
  });

  it("the process is in control: no point beyond 3σ (NIST 6.3.2.2)", () => {
    const stats = individualsStats(data);
    const series = computeDriftSeries(stats, toPoints(data));
    expect(series.points.some((p) => p.signals.includes("beyond3Sigma"))).toBe(false);
  });
});

describe("control-chart constants (standard tables, REFERENCES §4d [MEMORY]; d2(2), d2(3), D4(2) [OPENED])", () => {
  it("d₂ = 1.128 and D₄ = 3.267 for n = 2", () => {
    expect(D2).toBe(1.128);
    expect(D4_MOVING_RANGE).toBe(3.267);
    expect(CONTROL_CHART_CONSTANTS[2]).toEqual({ d2: 1.128, d3: 0.853, D3: 0, D4: 3.267 });
    expect(CONTROL_CHART_CONSTANTS[3].d2).toBe(1.693);
  });

  it("tabled d₂ agree with the numerically integrated values within 6e-4 (REFERENCES §4d [COMPUTED])", () => {
    const integrated = [1.1284, 1.6926, 2.0588, 2.3259, 2.5344, 2.7044, 2.8472, 2.97, 3.0775];
    integrated.forEach((d2, k) => expect(Math.abs(CONTROL_CHART_CONSTANTS[k + 2].d2 - d2)).toBeLessThan(6e-4));
  });

  it("E₂ = 3/d₂ = 2.66 (REFERENCES §4d)", () => {
    expect(3 / D2).toBeCloseTo(2.66, 2);
  });
});
