import { describe, expect, it } from "vitest";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import type { BoardMetrics } from "@/lib/thermal/types";
import { judge, oneSidedUse, twoSidedUse } from "@/lib/thermal/verdict";
import { DEFAULT_WINDOW } from "@/lib/thermal/windows";
import { at, P, raised, writeFile } from "./helpers/profiles";

const board: BoardMetrics = {
  peakMin: 238, peakMax: 242, deltaTPeak: 4, criticalSpread: 6, heatUpRate: 1.2, rampUpMax: 1.5, rampDownMax: 2,
  soakTimeMin: 80, soakTimeMax: 100, talMin: 55, talMax: 65, timeToPeakMax: 240,
};

describe("window use", () => {
  it("normalises a two-sided statistic to its half-window (encyclopaedia 'Thermal profiling' example)", () => {
    // Window 180–220 °C, measured 188 °C → |188 − 200| / 20 = 60 % (the article's −60 %, as a magnitude).
    expect(twoSidedUse([188], 180, 220)).toBeCloseTo(60, 12);
    expect(twoSidedUse([190, 219], 180, 220)).toBeCloseTo(95, 12);
    expect(twoSidedUse([190, null], 180, 220)).toBeNull();
    expect(oneSidedUse(2.4, 3)).toBeCloseTo(80, 12);
  });

  it("judges each item and takes the largest (SAC305 window)", () => {
    // peak: 240 ± 5 → worse of |238 − 240| and |242 − 240| → 40 %; TAL 60 ± 10 → 50 %;
    // soak 90 ± 30 → 33.3 %; ramp-up 1.5/3 → 50 %; down 2/4 → 50 %; ΔT 4/10 → 40 %; to peak 240/480 → 50 %.
    const v = judge(board, DEFAULT_WINDOW);
    expect(v.items).toEqual({
      peak: expect.closeTo(40, 9), tal: expect.closeTo(50, 9), soakTime: expect.closeTo(100 / 3, 9),
      rampUp: expect.closeTo(50, 9), rampDown: expect.closeTo(50, 9), deltaT: expect.closeTo(40, 9),
      timeToPeak: expect.closeTo(50, 9),
    });
    expect(v.windowUse).toBeCloseTo(50, 9);
    expect(v.status).toBe("pass");
  });

  it("is marginal above 90 % and up to 100 %, fails above 100 %", () => {
    expect(judge({ ...board, deltaTPeak: 9 }, DEFAULT_WINDOW).status).toBe("pass");
    expect(judge({ ...board, deltaTPeak: 9.1 }, DEFAULT_WINDOW).status).toBe("marginal");
    expect(judge({ ...board, deltaTPeak: 10 }, DEFAULT_WINDOW).status).toBe("marginal");
    expect(judge({ ...board, deltaTPeak: 10.1 }, DEFAULT_WINDOW).status).toBe("fail");
    // A peak below the window is out of window too: 233 °C is |233 − 240| / 5 = 140 %.
    const low = judge({ ...board, peakMin: 233 }, DEFAULT_WINDOW);
    expect(low.items.peak).toBeCloseTo(140, 9);
    expect(low.status).toBe("fail");
  });

  it("fails when any item is null, keeping the largest of the others as window use", () => {
    const v = judge({ ...board, talMin: null, talMax: null }, DEFAULT_WINDOW);
    expect(v.items.tal).toBeNull();
    expect(v.windowUse).toBeCloseTo(50, 9);
    expect(v.status).toBe("fail");
  });

  it("fails when the heat-up rate is null although no item judges it", () => {
    const v = judge({ ...board, heatUpRate: null }, DEFAULT_WINDOW);
    expect(v.windowUse).toBeCloseTo(50, 9);
    expect(v.status).toBe("fail");
  });

  it("judges the critical spread only when the window limits it", () => {
    expect(judge(board, DEFAULT_WINDOW).items).not.toHaveProperty("criticalSpread");
    const v = judge(board, { ...DEFAULT_WINDOW, criticalSpreadMax: 6.5 });
    expect(v.items.criticalSpread).toBeCloseTo((6 / 6.5) * 100, 9);
    expect(v.status).toBe("marginal");
    expect(judge({ ...board, criticalSpread: null }, { ...DEFAULT_WINDOW, criticalSpreadMax: 8 }).status).toBe("fail");
  });
});

describe("common practice (no source): eight probes, 1 s sampling, a seven-minute run", () => {
  /*
   * Facts of the trade, no source: boards are profiled with about eight probes sampled once a
   * second over a run of about seven minutes, and a ΔT at peak of 4.7 °C is within a 5 °C
   * deltaTMax limit. Curves: probe i = P + d_i with d from −2.35 to +2.35 °C (helpers/profiles.ts),
   * so peaks run 237.65…242.35 °C: ΔT = 4.7 °C. Against SAC305 with deltaTMax 5 °C:
   * ΔT uses 4.7/5 = 94 % of its limit. Everything else stays well inside (peak 47 %, TAL
   * 63 ± 2.35 s → 23.5 %, ramps 2 °C/s → 66.7 % and 50 %), so ΔT is the run's window use.
   * Under Ovenward's bands (pass ≤ 90 %, marginal ≤ 100 %) the run is within its window but
   * reported as marginal, not failed.
   */
  const offsets = [-2.35, -1.6, -0.9, -0.2, 0.4, 1.1, 1.7, 2.35];
  const times = Array.from({ length: 421 }, (_, k) => k);
  const text = writeFile({
    times,
    channels: offsets.map((d, i) => {
      const knots = raised(d);
      return { header: `TC${i + 1} (°C)`, celsius: (t: number) => at(knots, t) };
    }),
  });
  const result = analyzeLoggerFile({ text }, { window: { ...DEFAULT_WINDOW, deltaTMax: 5 } });

  it("reads eight probes, 421 samples 1 s apart over 420 s", () => {
    expect(result.meta).toMatchObject({ channels: 8, rows: 421, sampleInterval: 1, durationSeconds: 420 });
    expect(at(P, 214)).toBe(240);
  });

  it("measures ΔT at peak 4.7 °C and finds it within the 5 °C limit", () => {
    expect(result.board.deltaTPeak).toBeCloseTo(4.7, 9);
    expect(result.verdict.items.deltaT).toBeCloseTo(94, 9);
    expect(result.verdict.items.deltaT!).toBeLessThanOrEqual(100);
    expect(result.verdict.windowUse).toBeCloseTo(94, 9);
    expect(result.verdict.status).not.toBe("fail");
    expect(result.verdict.status).toBe("marginal");
  });

  it("passes outright once the ΔT limit is the default 10 °C", () => {
    const relaxed = analyzeLoggerFile({ text });
    expect(relaxed.verdict.items.deltaT).toBeCloseTo(47, 9);
    expect(relaxed.verdict.status).toBe("pass");
  });
});
