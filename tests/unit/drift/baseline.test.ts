// Baseline selection rules (invented run lists), plus the NIST/SEMATECH 6.3.2.2 flow-rate
// data as a baseline to check the stats it carries.
import { describe, expect, it } from "vitest";
import { runsAfterBaseline, selectBaseline, type BaselineRun } from "@/lib/drift/baseline";
import { computeDriftSeries } from "@/lib/drift/drift-series";
import { DAY, T0 } from "./helpers";

const runs = (values: number[], startDay = 0): BaselineRun[] =>
  values.map((value, k) => ({ runId: `r${startDay + k + 1}`, at: T0 + (startDay + k) * DAY, value }));
const seq = (n: number, f: (k: number) => number) => Array.from({ length: n }, (_, k) => f(k));

describe("selectBaseline", () => {
  it("no change logged: the first ten runs ever", () => {
    // NIST/SEMATECH e-Handbook 6.3.2.2 flow-rate data as the first ten runs: x̄ = 50.81, MR̄ = 1.8778.
    const nist = [49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1];
    const b = selectBaseline(runs([...nist, 60, 61, 62]), [])!;
    expect(b.source).toBe("first-runs");
    expect(b.provisional).toBe(false);
    expect([b.n, b.fromRunId, b.toRunId]).toEqual([10, "r1", "r10"]);
    expect(b.mean).toBeCloseTo(50.81, 4);
    expect(b.sigma).toBeCloseTo(1.8778 / 1.128, 4);
    expect(b.mrBar).toBeCloseTo(1.8778, 4);
  });

  it("the first ten runs at or after the latest change", () => {
    const all = runs(seq(30, (k) => k));
    const b = selectBaseline(all, [{ at: T0 + 3 * DAY + 1 }, { at: T0 + 12 * DAY }])!;
    expect(b.source).toBe("after-latest-change");
    expect([b.fromRunId, b.toRunId, b.n, b.provisional]).toEqual(["r13", "r22", 10, false]);
    expect(b.segmentStart).toBe(T0 + 12 * DAY);
  });

  it("fewer than ten but at least two after the latest change: those runs, provisional", () => {
    const b = selectBaseline(runs(seq(16, (k) => k)), [{ at: T0 + 11.5 * DAY }])!;
    expect([b.source, b.fromRunId, b.toRunId, b.n, b.provisional]).toEqual(["after-latest-change", "r13", "r16", 4, true]);
  });

  it("fewer than two after the latest change: the previous configuration's first ten, provisional", () => {
    const all = runs(seq(40, (k) => k));
    const b = selectBaseline(all, [{ at: T0 + 5 * DAY }, { at: T0 + 39 * DAY }])!;
    expect([b.source, b.fromRunId, b.toRunId, b.provisional]).toEqual(["earlier-segment", "r6", "r15", true]);
  });

  it("one change with a single run after it: falls back to the first ten runs ever", () => {
    const b = selectBaseline(runs(seq(12, (k) => k)), [{ at: T0 + 11 * DAY }])!;
    expect([b.source, b.fromRunId, b.toRunId]).toEqual(["earlier-segment", "r1", "r10"]);
  });

  it("an explicit range wins, in either order", () => {
    const all = runs(seq(20, (k) => k % 3));
    const a = selectBaseline(all, [{ at: T0 + 15 * DAY }], { range: { fromRunId: "r4", toRunId: "r9" } })!;
    const b = selectBaseline(all, [], { range: { fromRunId: "r9", toRunId: "r4" } })!;
    expect([a.source, a.fromRunId, a.toRunId, a.n]).toEqual(["range", "r4", "r9", 6]);
    expect(b.mean).toBe(a.mean);
    expect(() => selectBaseline(all, [], { range: { fromRunId: "nope", toRunId: "r4" } })).toThrow(RangeError);
  });

  it("null with fewer than two usable runs; non-finite values are skipped", () => {
    expect(selectBaseline(runs([5]), [])).toBeNull();
    expect(selectBaseline(runs([5, NaN]), [])).toBeNull();
    expect(selectBaseline(runs([5, NaN, 7]), [])!.n).toBe(2);
  });

  it("all-equal values give σ = 0 without dividing by zero, and monitoring stays finite", () => {
    const b = selectBaseline(runs(seq(10, () => 4.2)), [])!;
    expect(b.sigma).toBe(0);
    const series = computeDriftSeries(b, runs([4.2, 4.3, 9], 10)).points;
    for (const p of series) for (const v of [p.ewma, p.ewmaUcl, p.ewmaLcl, p.cusumHigh, p.cusumLow]) expect(Number.isFinite(v)).toBe(true);
    expect(series.flatMap((p) => p.signals)).toEqual([]);
  });

  it("rejects unsorted runs", () => {
    expect(() => selectBaseline([...runs([1, 2, 3])].reverse(), [])).toThrow(/sorted/);
  });
});

describe("runsAfterBaseline", () => {
  it("returns the runs after the baseline's last run", () => {
    const all = runs(seq(14, (k) => k));
    const b = selectBaseline(all, [])!;
    expect(runsAfterBaseline(all, b).map((r) => r.runId)).toEqual(["r11", "r12", "r13", "r14"]);
  });
});
