import { describe, expect, it } from "vitest";
import { alignChannels, applyOffsets } from "@/lib/thermal/align";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { isThermalFileError } from "@/lib/thermal/errors";
import { expectThreeChannelMetrics } from "./helpers/expected";
import { at, P, raised, SECONDS_0_TO_420, threeChannels, toFahrenheit, writeFile } from "./helpers/profiles";

describe("scan-skew alignment", () => {
  /*
   * Four probes see the same curve P; the logger reads probe i at t + 0.25·i s (rows every 1 s).
   * Aligned onto probe 0's times, probe i at grid time k is the interpolation between its samples
   * at k − 1 + 0.25i and k + 0.25i. That is exact wherever P is linear over the interval, and at a
   * knot K with slopes a before and b after it is P(K) + (b − a)·s(1 − s), s = 0.25i
   * (s(1 − s) = 0, 0.1875, 0.25, 0.1875).
   * Critical phase: probe 0 crosses 200 °C at 194; probes 1–3 are above 200 at 194 (knot 5/9 → 2,
   * b − a = 13/9) and exactly on the soak line at 193 (199.44), so t_start < 194 and sample 194 is
   * the first in the phase. Peaks: probe 0 reaches 240 at 214; probes 1–3 read 240 − 2·s(1 − s)
   * at 214 and exactly 240 at 215, so t_end = 215.
   * Spread at 194: (13/9)·0.25 = 0.3611; at 214 (knot 2 → 0): 2·0.25 = 0.5; elsewhere 0 → 0.5.
   * Unaligned, probe 3 reads P(k + 0.75): on the 2 °C/s rise it is 1.5 °C ahead → spread 1.5.
   * Probe 3 cannot be interpolated at t = 0 (its first sample is at 0.75 s): one leading row is
   * dropped, leaving 420 rows from 1 to 420 s.
   */
  const channels = [0, 1, 2, 3].map((i) => ({ header: `TC${i + 1}`, celsius: (t: number) => at(P, t) }));
  const text = writeFile({ times: SECONDS_0_TO_420, channels, skew: 0.25 });

  it("brings identical scanned curves together (critical spread 0.5 °C instead of 1.5 °C)", () => {
    const aligned = analyzeLoggerFile({ text }, { skewSeconds: 0.25, units: "C" });
    expect(aligned.board.criticalSpread).toBeCloseTo(0.5, 9);
    expect(aligned.board.deltaTPeak).toBeCloseTo(0, 9);
    expect(aligned.channels.map((c) => c.timeAtPeak)).toEqual([214, 215, 215, 215]);
    expect(aligned.meta).toMatchObject({ rows: 420, durationSeconds: 419, skewSeconds: 0.25 });
    expect(aligned.meta.warnings.some((w) => w.includes("dropped 1 leading and 0 trailing"))).toBe(true);
    const raw = analyzeLoggerFile({ text }, { units: "C" });
    expect(raw.board.criticalSpread).toBeCloseTo(1.5, 9);
  });

  it("keeps TAL exact: the liquidus crossings lie on straight segments", () => {
    const aligned = analyzeLoggerFile({ text }, { skewSeconds: 0.25, units: "C" });
    for (const c of aligned.channels) expect(c.tal).toBeCloseTo(63, 9);
  });

  it("drops trailing rows for a negative skew", () => {
    const time = [0, 1, 2, 3, 4];
    const series = { time, channels: [{ name: "a", values: [0, 1, 2, 3, 4] }, { name: "b", values: [0, 2, 4, 6, 8] }] };
    // Channel b was read at t − 0.5: its samples span −0.5…3.5, so grid time 4 needs extrapolation.
    const out = alignChannels(series, -0.5);
    expect(out.droppedLeading).toBe(0);
    expect(out.droppedTrailing).toBe(1);
    expect(Array.from(out.time)).toEqual([0, 1, 2, 3]);
    // b(t) = 2(t + 0.5) sampled at t − 0.5 → the value at grid t is 2(t + 0.5): 1, 3, 5, 7.
    expect(Array.from(out.channels[1].values)).toEqual([1, 3, 5, 7]);
  });

  it("uses the logger's scan order, not the order the columns were picked in", () => {
    // Columns picked in reverse: TC4 is still the 4th scanned channel (shift 0.75 s).
    const picked = analyzeLoggerFile({ text }, { skewSeconds: 0.25, units: "C", columns: ["TC4", "TC3", "TC2", "TC1"] });
    expect(picked.board.criticalSpread).toBeCloseTo(0.5, 9);
    expect(picked.channels.map((c) => c.timeAtPeak)).toEqual([215, 215, 215, 214]);
  });

  it("refuses a skew that leaves no common time span, naming the option", () => {
    const short = writeFile({ times: SECONDS_0_TO_420.slice(0, 12), channels, skew: 0 });
    let error: unknown;
    try {
      analyzeLoggerFile({ text: short }, { skewSeconds: 5, units: "C" });
    } catch (e) {
      error = e;
    }
    expect(isThermalFileError(error) && error.details.field).toBe("skewSeconds");
  });
});

describe("calibration offsets", () => {
  it("adds per-channel offsets after unit conversion and records them", () => {
    // TC2 = P + 4 °C written in °F; an offset of −4 °C makes it P again: ΔT 0, its TAL 63 s.
    const text = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels("°F"), encode: toFahrenheit });
    const result = analyzeLoggerFile({ text }, { offsets: { TC2: -4 } });
    expect(result.meta.offsets).toEqual({ TC2: -4 });
    expect(result.board.deltaTPeak).toBeCloseTo(0, 9);
    expect(result.channels[1].tal).toBeCloseTo(63, 9);
    expect(result.channels[1].peak).toBeCloseTo(240, 9);
  });

  it("warns about an offset for a probe the file does not have, and changes nothing", () => {
    const text = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels() });
    const result = analyzeLoggerFile({ text }, { offsets: { TC9: 1 } });
    expect(result.meta.offsets).toEqual({});
    expect(result.meta.warnings).toContain('The calibration offset for "TC9" matches no probe column and was not applied.');
    expectThreeChannelMetrics(result);
  });

  it("matches offsets by header too and leaves other channels untouched", () => {
    const b = raised(4);
    const { channels, applied } = applyOffsets(
      [{ name: "TC1", header: "TC1 (°C)", values: [1, 2] }, { name: "TC2", values: [b[0][1], 0] }],
      { "tc1 (°c)": 0.5 },
    );
    expect(applied).toEqual({ TC1: 0.5 });
    expect(Array.from(channels[0].values)).toEqual([1.5, 2.5]);
    expect(Array.from(channels[1].values)).toEqual([24, 0]);
  });
});
