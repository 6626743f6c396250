// Incremental state == batch (fast-check property over invented series), plus the state's
// contract: JSON-safe, immutable, bounded tails, out-of-order runs rejected.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeDriftSeries } from "@/lib/drift/drift-series";
import { initDriftState, stepDrift } from "@/lib/drift/drift-state";
import type { DriftState } from "@/lib/drift/drift-types";
import { T0, toPoints } from "./helpers";

// Quarter-steps on a small grid produce ties, flats and on-centre points often, which is
// where counters and look-backs could disagree.
const valueArb = fc.integer({ min: -24, max: 24 }).map((v) => v / 4);
const pointsArb = fc.array(fc.tuple(valueArb, fc.integer({ min: 0, max: 3 * 86_400_000 })), { maxLength: 60, size: "max" }).map((rows) => {
  let at = T0;
  return rows.map(([value, gap], k) => {
    at += gap;
    return { value, at, runId: k % 2 === 0 ? `run-${k}` : k };
  });
});
const baselineArb = fc.record({
  mean: fc.integer({ min: -8, max: 8 }).map((v) => v / 4),
  sigma: fc.oneof(fc.constant(0), fc.double({ min: 0.05, max: 4, noNaN: true })),
});
const paramsArb = fc.record({
  lambda: fc.double({ min: 0.01, max: 1, noNaN: true }),
  L: fc.double({ min: 1, max: 4, noNaN: true }),
  cusumK: fc.double({ min: 0, max: 2, noNaN: true }),
  cusumH: fc.double({ min: 0.5, max: 8, noNaN: true }),
});

describe("stepDrift folded over runs equals computeDriftSeries", () => {
  it("exactly, for every point result and the final state, with a JSON round trip between steps", () => {
    fc.assert(
      fc.property(baselineArb, pointsArb, paramsArb, (baseline, points, params) => {
        const batch = computeDriftSeries(baseline, points, params);
        let state: DriftState = initDriftState(baseline);
        const results = [];
        for (const p of points) {
          const r = stepDrift(JSON.parse(JSON.stringify(state)) as DriftState, p, params);
          results.push(r.pointResult);
          state = r.state;
        }
        expect(results).toEqual(batch.points);
        expect(state).toEqual(batch.state);
      }),
      { numRuns: 400 },
    );
  });

  it("a batch over the first m runs, then steps, equals the batch over all runs", () => {
    fc.assert(
      fc.property(baselineArb, pointsArb, fc.nat(), (baseline, points, cut) => {
        const m = points.length === 0 ? 0 : cut % (points.length + 1);
        let state = computeDriftSeries(baseline, points.slice(0, m)).state;
        for (const p of points.slice(m)) state = stepDrift(state, p).state;
        expect(state).toEqual(computeDriftSeries(baseline, points).state);
      }),
      { numRuns: 200 },
    );
  });
});

describe("DriftState contract", () => {
  const baseline = { mean: 10, sigma: 0.5, n: 10, fromRunId: "b1", toRunId: "b10" };
  const points = toPoints(Array.from({ length: 30 }, (_, k) => 10 + ((k * 7) % 5) / 10));

  it("keeps the last 9 values and the last 20 runs with times", () => {
    const { state } = computeDriftSeries(baseline, points);
    expect(state.recent).toEqual(points.slice(-9).map((p) => p.value));
    expect(state.history).toEqual(points.slice(-20).map((p) => ({ runId: p.runId, at: p.at, value: p.value })));
    expect(state.ewma.i).toBe(30);
    expect(state.lastAt).toBe(points[29].at);
    expect(state.baseline).toEqual(baseline);
  });

  it("is unchanged by a step (returns a new state)", () => {
    const s0 = computeDriftSeries(baseline, points.slice(0, 5)).state;
    const copy = structuredClone(s0);
    stepDrift(s0, points[5]);
    expect(s0).toEqual(copy);
  });

  it("rejects a run older than the last one, so the caller recomputes", () => {
    const s = computeDriftSeries(baseline, points.slice(0, 5)).state;
    expect(() => stepDrift(s, { ...points[2], runId: "late" })).toThrow(/recompute/);
    expect(() => computeDriftSeries(baseline, [points[3], points[1]])).toThrow(/recompute/);
  });

  it("rejects a non-finite value and bad parameters", () => {
    const s = initDriftState(baseline);
    expect(() => stepDrift(s, { value: NaN, at: T0, runId: 1 })).toThrow(RangeError);
    expect(() => stepDrift(s, points[0], { lambda: 0, L: 3, cusumK: 0.5, cusumH: 5 })).toThrow(RangeError);
  });

  it("the first step's EWMA starts from the baseline mean (z₁ = λx₁ + (1 − λ)·mean)", () => {
    const r = stepDrift(initDriftState(baseline), { value: 11, at: T0, runId: "x" });
    expect(r.pointResult.ewma).toBeCloseTo(0.2 * 11 + 0.8 * 10, 12);
    expect(r.pointResult.i).toBe(1);
  });
});
