import { expect } from "vitest";
import type { AnalysisResult } from "@/lib/thermal/types";

/*
 * Expected metrics of the three-probe profile of helpers/profiles.ts (A = P, B = P + 4 °C,
 * C = P 6 s later) against the SAC305 window; derived by hand in metrics-piecewise.test.ts.
 */
export const expectedChannels = {
  TC1: { peak: 240, timeAtPeak: 214, tal: 63, heatUpRate: 1.25, rampUpMax: 2, rampDownMax: 2, soakTime: 90, timeToPeak: 210 },
  TC2: { peak: 244, timeAtPeak: 214, tal: 67, heatUpRate: 1.25, rampUpMax: 2, rampDownMax: 2, soakTime: 86, timeToPeak: 213.2 },
  TC3: { peak: 240, timeAtPeak: 220, tal: 63, heatUpRate: 1.25, rampUpMax: 2, rampDownMax: 2, soakTime: 90, timeToPeak: 210 },
};

export const expectedBoard = {
  peakMin: 240, peakMax: 244, deltaTPeak: 4, criticalSpread: 16, heatUpRate: 1.25, rampUpMax: 2, rampDownMax: 2,
  soakTimeMin: 86, soakTimeMax: 90, talMin: 63, talMax: 67, timeToPeakMax: 213.2,
};

/** Tolerances per metric kind for files whose encoding loses a little (e.g. millivolts). */
export interface Tolerance { temperature: number; time: number; rate: number }
export const EXACT: Tolerance = { temperature: 1e-9, time: 1e-9, rate: 1e-9 };

const KIND: Record<string, keyof Tolerance> = {
  peak: "temperature", peakMin: "temperature", peakMax: "temperature", deltaTPeak: "temperature", criticalSpread: "temperature",
  timeAtPeak: "time", tal: "time", soakTime: "time", timeToPeak: "time", soakTimeMin: "time", soakTimeMax: "time",
  talMin: "time", talMax: "time", timeToPeakMax: "time",
  heatUpRate: "rate", rampUpMax: "rate", rampDownMax: "rate",
};

export function expectThreeChannelMetrics(result: AnalysisResult, tolerance: Tolerance = EXACT, names = ["TC1", "TC2", "TC3"]): void {
  expect(result.channels.map((c) => c.name)).toEqual(names);
  for (const channel of result.channels) {
    const expected = expectedChannels[channel.name as keyof typeof expectedChannels];
    for (const [key, value] of Object.entries(expected)) {
      const actual = channel[key as keyof typeof channel] as number;
      expect(Math.abs(actual - value), `${channel.name}.${key} = ${actual}, expected ${value}`).toBeLessThanOrEqual(tolerance[KIND[key]]);
    }
  }
  for (const [key, value] of Object.entries(expectedBoard)) {
    const actual = result.board[key as keyof typeof result.board] as number;
    expect(Math.abs(actual - value), `board.${key} = ${actual}, expected ${value}`).toBeLessThanOrEqual(tolerance[KIND[key]]);
  }
}
