// Theil–Sen projection to a limit on invented series with known slopes.
import { describe, expect, it } from "vitest";
import { projectCrossing, timeTrend } from "@/lib/drift/time-to-limit";
import { theilSen } from "@/lib/drift/theil-sen";
import { DAY, T0 } from "./helpers";

const daily = (n: number, f: (k: number) => number) => Array.from({ length: n }, (_, k) => ({ at: T0 + k * DAY, value: f(k) }));

describe("timeTrend / projectCrossing", () => {
  it("slope per day from epoch-ms times, and the day the line reaches the limit", () => {
    const points = daily(20, (k) => 5 + 0.1 * k); // reaches 6.9 on day 19
    const now = T0 + 19 * DAY;
    const p = projectCrossing({ points, limit: 8, direction: "above", now })!;
    expect(p.slopePerDay).toBeCloseTo(0.1, 12);
    expect(p.valueNow).toBeCloseTo(6.9, 10);
    expect(p.daysToLimit).toBeCloseTo(11, 9);
    expect(p.crossesAt! - (now + 11 * DAY)).toBeLessThan(1);
    expect(p.alreadyBeyond).toBe(false);
  });

  it("uses only the last 20 runs", () => {
    const points = [...daily(20, () => 50), ...daily(20, (k) => 50 - 0.5 * k).map((p) => ({ ...p, at: p.at + 20 * DAY }))];
    expect(timeTrend(points)!.slopePerDay).toBeCloseTo(-0.5, 12);
    expect(timeTrend(points)!.n).toBe(20);
  });

  it("a single wild run barely moves the slope (robust, unlike least squares)", () => {
    const points = daily(20, (k) => 5 + 0.1 * k + (k === 10 ? 40 : 0));
    expect(timeTrend(points)!.slopePerDay).toBeCloseTo(0.1, 10);
  });

  it("needs at least 8 runs", () => {
    expect(projectCrossing({ points: daily(7, (k) => k), limit: 100, direction: "above", now: T0 + 7 * DAY })).toBeNull();
    expect(projectCrossing({ points: daily(8, (k) => k), limit: 100, direction: "above", now: T0 + 7 * DAY })).not.toBeNull();
  });

  it("null crossing when the trend heads away from the limit or is flat", () => {
    const away = projectCrossing({ points: daily(12, (k) => 7 - 0.2 * k), limit: 8, direction: "above", now: T0 + 11 * DAY })!;
    expect([away.crossesAt, away.daysToLimit]).toEqual([null, null]);
    const flat = projectCrossing({ points: daily(12, () => 3), limit: 8, direction: "above", now: T0 + 11 * DAY })!;
    expect([flat.slopePerDay, flat.crossesAt, flat.daysToLimit]).toEqual([0, null, null]);
  });

  it("a lower limit (direction below)", () => {
    const p = projectCrossing({ points: daily(10, (k) => 60 - 0.5 * k), limit: 50, direction: "below", now: T0 + 9 * DAY })!;
    expect(p.daysToLimit).toBeCloseTo((55.5 - 50) / 0.5, 9);
  });

  it("already beyond the limit on the trend line: crossesAt = now, 0 days, whatever the slope", () => {
    const now = T0 + 11 * DAY;
    const p = projectCrossing({ points: daily(12, (k) => 9 - 0.01 * k), limit: 8, direction: "above", now })!;
    expect([p.crossesAt, p.daysToLimit, p.alreadyBeyond]).toEqual([now, 0, true]);
  });

  it("the slope CI brackets the slope", () => {
    const t = timeTrend(daily(20, (k) => 5 + 0.1 * k + ((k * 37) % 7) / 20))!;
    expect(t.slopeCi![0]).toBeLessThan(t.slopePerDay);
    expect(t.slopeCi![1]).toBeGreaterThan(t.slopePerDay);
  });

  it("theilSen returns null when every x is the same", () => {
    expect(theilSen([1, 1, 1], [1, 2, 3])).toBeNull();
  });
});
