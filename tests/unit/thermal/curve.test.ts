import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { firstUpCrossing, peakOf, scanCurve, slopeExtremes, timeAbove } from "@/lib/thermal/curve";

/** Straightforward O(n·w) reference: least-squares slope over every closed window [t_j, t_j + w] that ends within the data. */
function bruteForce(t: number[], v: number[], w: number): { up: number; down: number } | null {
  let max = -Infinity;
  let min = Infinity;
  for (let j = 0; j < t.length; j++) {
    if (t[j] + w > t[t.length - 1] + 1e-9) break;
    const xs: number[] = [];
    const ys: number[] = [];
    for (let k = j; k < t.length && t[k] <= t[j] + w + 1e-9; k++) { xs.push(t[k]); ys.push(v[k]); }
    if (xs.length < 2) continue;
    const mx = xs.reduce((a, b) => a + b) / xs.length;
    const my = ys.reduce((a, b) => a + b) / ys.length;
    let sxy = 0, sxx = 0;
    xs.forEach((x, i) => { sxy += (x - mx) * (ys[i] - my); sxx += (x - mx) ** 2; });
    const slope = sxy / sxx;
    max = Math.max(max, slope);
    min = Math.min(min, slope);
  }
  return max === -Infinity ? null : { up: Math.max(0, max), down: Math.max(0, -min) };
}

describe("sliding least-squares slopes", () => {
  it("match a brute-force computation on random curves and uneven sampling", () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ dt: fc.double({ min: 0.05, max: 2, noNaN: true }), v: fc.double({ min: -50, max: 300, noNaN: true }) }), { minLength: 2, maxLength: 300 }),
        fc.double({ min: 0.1, max: 30, noNaN: true }),
        (samples, w) => {
          const t: number[] = [];
          let now = 0;
          for (const s of samples) { now += s.dt; t.push(now); }
          const v = samples.map((s) => s.v);
          const fast = slopeExtremes(t, v, w);
          const slow = bruteForce(t, v, w);
          expect(fast === null).toBe(slow === null);
          if (fast && slow) {
            const scale = 1 + Math.max(slow.up, slow.down);
            expect(Math.abs(fast.up - slow.up)).toBeLessThanOrEqual(1e-7 * scale);
            expect(Math.abs(fast.down - slow.down)).toBeLessThanOrEqual(1e-7 * scale);
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  it("stay exact over a long 10 Hz hour (sums are rebuilt, rounding does not build up)", () => {
    // A 0.1 °C/s ramp up then 0.3 °C/s down over 3600 s at 10 Hz: slopes exactly 0.1 and 0.3.
    const n = 36001;
    const t = Array.from({ length: n }, (_, k) => k / 10);
    const v = t.map((x) => (x <= 1800 ? 25 + 0.1 * x : 205 - 0.3 * (x - 1800)));
    const r = slopeExtremes(t, v, 10)!;
    expect(r.up).toBeCloseTo(0.1, 9);
    expect(r.down).toBeCloseTo(0.3, 9);
  });

  it("use closed windows: the sample at t_j + w belongs to the window", () => {
    // Windows of 2 s on t = 0…3: [0, 2] holds 0, 0, 0 (slope 0); [1, 3] holds (1, 0), (2, 0), (3, 9):
    // x̄ = 2, ȳ = 3, Σ(x − x̄)(y − ȳ) = 3 + 0 + 6 = 9, Σ(x − x̄)² = 2 → 4.5 °C/s.
    // Half-open windows would see only (1, 0), (2, 0) and answer 0.
    expect(slopeExtremes([0, 1, 2, 3], [0, 0, 0, 9], 2)).toEqual({ up: 4.5, down: 0 });
    // The same at 10 Hz, where 0.1·k is not exact in binary: [0, 0.2] must still hold t = 0.2.
    expect(slopeExtremes([0, 0.1, 0.2, 0.30000000000000004], [0, 0, 0, 9], 0.2)!.up).toBeCloseTo(45, 9);
  });

  it("answer null when no window holds two samples or the data are shorter than the window", () => {
    expect(slopeExtremes([0, 5, 10], [1, 2, 3], 2)).toBeNull();
    expect(slopeExtremes([0, 1, 2], [1, 2, 3], 10)).toBeNull();
    // Exactly one window [0, 2] fits: slope 1.
    expect(slopeExtremes([0, 1, 2], [1, 2, 3], 2)).toEqual({ up: 1, down: 0 });
  });

  it("cost does not grow with the window length (O(n), not O(n·w))", () => {
    // 10 Hz for 2 h; a 6 s window holds 61 samples, a 600 s window 6001. An O(n·w) method would
    // take about 100 times longer with the long window; the sliding sums take about as long.
    const t = Float64Array.from({ length: 72_000 }, (_, k) => k / 10);
    const v = Float64Array.from(t, (x) => 100 + 50 * Math.sin(x / 600));
    const time = (w: number) => {
      slopeExtremes(t, v, w);
      const start = performance.now();
      for (let i = 0; i < 5; i++) slopeExtremes(t, v, w);
      return performance.now() - start;
    };
    const short = time(6);
    const long = time(600);
    expect(long / short).toBeLessThan(5);
  });
});

describe("crossings, time above and peak", () => {
  it("interpolate between the samples around a crossing", () => {
    const t = [0, 10, 20, 30];
    const v = [100, 200, 250, 150];
    expect(firstUpCrossing(t, v, 217)).toBeCloseTo(13.4, 12); // 10 + 17/50·10
    expect(firstUpCrossing(t, v, 100)).toBeNull(); // starts on it: never rises through it
    expect(firstUpCrossing(t, v, 260)).toBeNull();
    // Above 217: from 13.4 to 20 + (250 − 217)/100·10 = 23.3 → 9.9 s.
    expect(timeAbove(t, v, 217)).toBeCloseTo(9.9, 12);
    expect(timeAbove(t, v, 300)).toBe(0);
    expect(peakOf(t, [1, 3, 3, 2])).toEqual({ peak: 3, timeAtPeak: 10 });
  });

  it("count every excursion above the threshold", () => {
    // Two humps above 10: [0.5, 1.5] and [2.5, 3.5] → 2 s.
    expect(timeAbove([0, 1, 2, 3, 4], [5, 15, 5, 15, 5], 10)).toBeCloseTo(2, 12);
  });
});

describe("the one-pass curve scan", () => {
  it("agrees with the separate primitives on random curves", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 300 }), { minLength: 2, maxLength: 200 }),
        fc.array(fc.integer({ min: 0, max: 300 }), { minLength: 1, maxLength: 5 }),
        fc.integer({ min: 0, max: 300 }),
        (values, thresholds, level) => {
          const t = values.map((_, i) => i * 0.5);
          const scan = scanCurve(t, values, thresholds, level);
          expect({ peak: scan.peak, timeAtPeak: scan.timeAtPeak }).toEqual(peakOf(t, values));
          expect(scan.crossings).toEqual(thresholds.map((x) => firstUpCrossing(t, values, x)));
          expect(scan.timeAbove).toBeCloseTo(timeAbove(t, values, level), 9);
        },
      ),
      { numRuns: 300 },
    );
  });
});
