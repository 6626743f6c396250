import { describe, expect, it } from "vitest";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { computeMetrics } from "@/lib/thermal/metrics";
import { DEFAULT_WINDOW } from "@/lib/thermal/windows";
import { expectThreeChannelMetrics } from "./helpers/expected";
import { at, lagged, P, raised, SECONDS_0_TO_420, threeChannels, writeFile } from "./helpers/profiles";

/*
 * Exact values hand-derived from piecewise-linear curves (knots in helpers/profiles.ts), sampled
 * every 1 s from 0 to 420 s. Window: the default SAC305 window (liquidus 217, soak 150→200,
 * heat-up 50→150, ramp window 10 s). Derivations:
 *
 * A = P:  crossings at sample times or halfway between them:
 *   25 °C at t = 4 (20 + 1.25·4);  50 °C at 24;  150 °C at 104;  200 °C at 194 (knot).
 *   217 °C up: P(202) = 216, P(203) = 218 → 202.5;  down: P(265) = 218, P(266) = 216 → 265.5.
 *   peak 240, first at 214;  TAL = 265.5 − 202.5 = 63;  heat-up = 100 / (104 − 24) = 1.25;
 *   soak = 194 − 104 = 90;  time to peak = 214 − 4 = 210.
 *   ramps: 10 s windows fit inside the 2 °C/s rise [194, 214] and the −2 °C/s fall [254, 344];
 *   a least-squares slope over a window across a knot lies between the two segment slopes,
 *   so rampUpMax = rampDownMax = 2.
 * B = P + 4:  25 at 0.8;  50 at 20.8;  150 at 100.8;  200 where P = 196, in the soak:
 *   104 + 46·9/5 = 186.8;  217 where P = 213: up 200.5, down 267.5 → TAL 67;
 *   heat-up 100/80 = 1.25;  soak 186.8 − 100.8 = 86;  peak 244 at 214;  to peak 214 − 0.8 = 213.2.
 * C = P 6 s later: every crossing 6 s later, so TAL 63, heat-up 1.25, soak 90, peak 240 at 220,
 *   time to peak 220 − 10 = 210; ramps 2 and 2.
 * Board: peaks 240…244 → ΔT 4; slowest heat-up 1.25; soak 86…90; TAL 63…67; time to peak ≤ 213.2.
 * Critical spread: t_start = earliest crossing of 200 = 186.8 (B), t_end = latest peak time = 220 (C).
 *   For 200 ≤ t ≤ 214 all three rise at 2 °C/s: B − C = 4 + 2·6 = 16; elsewhere in the phase
 *   less (soak: 4 + 6·5/9 = 7.33; 214…220: 244 − C(t) falls from 16 to 4) → 16.
 */
describe("metrics on a hand-derived three-probe profile (°C, comma-separated, seconds)", () => {
  const text = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels() });
  const result = analyzeLoggerFile({ text });

  it("gives every channel and board metric exactly", () => {
    expect(result.channels.map((c) => c.name)).toEqual(["TC1", "TC2", "TC3"]);
    expectThreeChannelMetrics(result);
  });

  it("judges it against the SAC305 window with the hand-computed window use", () => {
    // SAC305: peak 235–245 (centre 240, half 5): worse of 240 → 0 % and 244 → 80 %.
    // TAL 50–70 (60 ± 10): 67 → 70 %. Soak 60–120 (90 ± 30): 86 → 13.33 %. Ramp-up 2/3 → 66.67 %.
    // Ramp-down 2/4 → 50 %. ΔT 4/10 → 40 %. Time to peak 213.2/480 → 44.4167 %. Largest 80 % → pass.
    const items = result.verdict.items;
    expect(items.peak).toBeCloseTo(80, 9);
    expect(items.tal).toBeCloseTo(70, 9);
    expect(items.soakTime).toBeCloseTo(40 / 3, 9);
    expect(items.rampUp).toBeCloseTo(200 / 3, 9);
    expect(items.rampDown).toBeCloseTo(50, 9);
    expect(items.deltaT).toBeCloseTo(40, 9);
    expect(items.timeToPeak).toBeCloseTo((213.2 / 480) * 100, 9);
    expect(items.criticalSpread).toBeUndefined();
    expect(result.verdict.windowUse).toBeCloseTo(80, 9);
    expect(result.verdict.status).toBe("pass");
  });

  it("adds the critical-spread item when the window limits it (16 °C of 20 → 80 %, of 15 → fail)", () => {
    const within = analyzeLoggerFile({ text }, { window: { ...DEFAULT_WINDOW, criticalSpreadMax: 20 } });
    expect(within.verdict.items.criticalSpread).toBeCloseTo(80, 9);
    const over = analyzeLoggerFile({ text }, { window: { ...DEFAULT_WINDOW, criticalSpreadMax: 15 } });
    expect(over.verdict.items.criticalSpread).toBeCloseTo((16 / 15) * 100, 9);
    expect(over.verdict.status).toBe("fail");
  });

  it("reports the run's meta data", () => {
    expect(result.meta).toMatchObject({ rows: 421, channels: 3, durationSeconds: 420, sampleInterval: 1, units: "C", skewSeconds: 0, offsets: {} });
    expect(result.meta.thermocouple).toBeUndefined();
  });
});

describe("computeMetrics without a file", () => {
  it("gives the same numbers from arrays (for seeds and re-judging)", () => {
    const time = SECONDS_0_TO_420;
    const b = raised(4);
    const c = lagged(6);
    const series = {
      time,
      channels: [
        { name: "TC1", values: time.map((t) => at(P, t)) },
        { name: "TC2", values: time.map((t) => at(b, t)) },
        { name: "TC3", values: time.map((t) => at(c, t)) },
      ],
    };
    const { channels, board } = computeMetrics(series, DEFAULT_WINDOW);
    expect(channels[1].tal).toBeCloseTo(67, 9);
    expect(channels[2].timeAtPeak).toBe(220);
    expect(board.criticalSpread).toBeCloseTo(16, 9);
  });

  it("makes a statistic null with a warning when a probe never crosses its threshold, and fails the run", () => {
    // TC2 = P − 30: peak 210 °C, never reaches the 217 °C liquidus → its TAL is null, board TAL null.
    const low = raised(-30);
    const text = writeFile({
      times: SECONDS_0_TO_420,
      channels: [{ header: "TC1", celsius: (t) => at(P, t) }, { header: "TC2", celsius: (t) => at(low, t) }],
    });
    const result = analyzeLoggerFile({ text }, { units: "C" });
    expect(result.channels[1].tal).toBeNull();
    expect(result.channels[0].tal).toBeCloseTo(63, 9);
    expect(result.board.talMin).toBeNull();
    expect(result.board.talMax).toBeNull();
    expect(result.verdict.items.tal).toBeNull();
    expect(result.verdict.status).toBe("fail");
    expect(result.meta.warnings.some((w) => w.includes('"TC2"') && w.includes("217"))).toBe(true);
  });

  it("makes soak and critical spread null when a probe never reaches the soak end", () => {
    // TC2 = P − 45 peaks at 195 °C < 200 °C: its soak time and the critical-phase spread are null.
    const low = raised(-45);
    const text = writeFile({
      times: SECONDS_0_TO_420,
      channels: [{ header: "TC1 (°C)", celsius: (t) => at(P, t) }, { header: "TC2 (°C)", celsius: (t) => at(low, t) }],
    });
    const result = analyzeLoggerFile({ text });
    expect(result.channels[1].soakTime).toBeNull();
    expect(result.board.soakTimeMin).toBeNull();
    expect(result.board.criticalSpread).toBeNull();
    expect(result.verdict.status).toBe("fail");
    expect(result.meta.warnings.filter((w) => w.includes('"TC2"')).length).toBeGreaterThanOrEqual(2);
  });

  it("takes the slowest probe's heat-up rate and the fastest probe's ramps for the board", () => {
    // S: (0, 20) → (130, 150) at 1 °C/s, then P from (194, 200): 50 °C at 30 s, 150 °C at 130 s → 1.0 °C/s.
    // Its soak segment (130, 150) → (194, 200) rises at 50/64 °C/s; ramps: up 2 (as P), down 2.
    // F: P with a faster fall, (254, 240) → (314, 60) at −3 °C/s: ramp-down 3.
    const slow: Array<readonly [number, number]> = [[0, 20], [130, 150], ...P.slice(2)];
    const fast: Array<readonly [number, number]> = [...P.slice(0, 5), [314, 60], [424, 40]];
    const time = SECONDS_0_TO_420;
    const { channels, board } = computeMetrics({
      time,
      channels: [
        { name: "P", values: time.map((t) => at(P, t)) },
        { name: "S", values: time.map((t) => at(slow, t)) },
        { name: "F", values: time.map((t) => at(fast, t)) },
      ],
    }, DEFAULT_WINDOW);
    expect(channels.map((c) => c.heatUpRate)).toEqual([1.25, 1, 1.25]);
    expect(board.heatUpRate).toBe(1);
    expect(channels[2].rampDownMax).toBeCloseTo(3, 9);
    expect(board.rampDownMax).toBeCloseTo(3, 9);
    expect(board.rampUpMax).toBeCloseTo(2, 9);
  });

  it("fails a run whose heat-up rate is unavailable even though every judged item is in window", () => {
    // P starts at 20 °C, so it never rises through a heat-up start of 15 °C: heat-up rate null.
    // Everything judged is in window (TAL 63, peak 240, soak 90, ramps 2/2, ΔT 0, time to peak 210).
    const text = writeFile({ times: SECONDS_0_TO_420, channels: [{ header: "TC1 (°C)", celsius: (t) => at(P, t) }] });
    const result = analyzeLoggerFile({ text }, { window: { ...DEFAULT_WINDOW, heatUpFrom: 15 } });
    expect(result.channels[0].heatUpRate).toBeNull();
    expect(result.board.heatUpRate).toBeNull();
    expect(result.verdict.windowUse).toBeCloseTo(200 / 3, 9);
    expect(result.verdict.status).toBe("fail");
    expect(result.meta.warnings).toContain('Probe "TC1" never rises through 15 °C (heat-up start), so its heat-up rate is not available and the run fails.');
  });

  it("measures time to peak from the first sample when the curve starts above 25 °C", () => {
    // P + 10 starts at 30 °C, so time to peak = timeAtPeak − 0 = 214.
    const warm = raised(10);
    const { channels } = computeMetrics({ time: SECONDS_0_TO_420, channels: [{ name: "A", values: SECONDS_0_TO_420.map((t) => at(warm, t)) }] }, DEFAULT_WINDOW);
    expect(channels[0].timeToPeak).toBe(214);
  });
});
