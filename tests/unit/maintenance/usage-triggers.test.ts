import { describe, expect, it } from "vitest";
import { dueByMeter, dueByRuns, forecastThreshold, validateMeterReading } from "@/lib/maintenance/usage-triggers";

const d = (s: string) => new Date(s);
const days = (from: number, to: number, hour = "08:00") =>
  Array.from({ length: to - from + 1 }, (_, i) => d(`2026-03-${String(from + i).padStart(2, "0")}T${hour}Z`));

describe("dueByRuns", () => {
  // One verification run a day at 08:00Z, 1–25 March 2026; plan started 2026-03-01T00:00Z.
  const base = { planId: "p9", everyRuns: 10, runs: days(1, 25), since: d("2026-03-01T00:00Z"), now: d("2026-03-25T12:00Z") };

  it("reports the thresholds crossed since the last order, with stable keys", () => {
    const r = dueByRuns({ ...base, lastTriggeredThreshold: 10 });
    expect(r.used).toBe(25);
    expect(r.usedSinceLastOrder).toBe(15);
    expect(r.crossed).toEqual([{ occurrenceKey: "p9:runs:20", threshold: 20, reachedAt: d("2026-03-20T08:00Z") }]);
    expect(r.nextThreshold).toBe(30);
  });

  it("with no order yet, lists every crossed threshold (10 and 20)", () => {
    const r = dueByRuns({ ...base, lastTriggeredThreshold: null });
    expect(r.crossed.map((c) => [c.occurrenceKey, c.reachedAt.toISOString()])).toEqual([
      ["p9:runs:10", "2026-03-10T08:00:00.000Z"],
      ["p9:runs:20", "2026-03-20T08:00:00.000Z"],
    ]);
  });

  it("forecasts the next threshold by linear extrapolation", () => {
    // Points: (03-01 00:00, 0) … (03-25 08:00, 25): 25 runs in 24 d 8 h = 24.3333 d.
    // 5 more runs take 24.3333 × 5/25 = 4.86667 d = 4 d 20 h 48 min → 2026-03-30T04:48Z.
    const r = dueByRuns({ ...base, lastTriggeredThreshold: 20 });
    expect(r.crossed).toEqual([]);
    expect(r.forecast.at?.toISOString()).toBe("2026-03-30T04:48:00.000Z");
    expect(r.forecast.at === null ? NaN : r.forecast.ratePerDay).toBeCloseTo(25 / 24.333333, 6);
  });

  it("ignores runs before the plan's start and after now; applying the result is idempotent", () => {
    const runs = [d("2026-02-20T08:00Z"), ...days(1, 25), d("2026-03-26T08:00Z")];
    const r = dueByRuns({ ...base, runs, lastTriggeredThreshold: null });
    expect(r.used).toBe(25);
    const again = dueByRuns({ ...base, runs, lastTriggeredThreshold: r.crossed.at(-1)!.threshold });
    expect(again.crossed).toEqual([]);
  });

  it("refuses a non-whole interval", () => {
    expect(() => dueByRuns({ ...base, everyRuns: 2.5, lastTriggeredThreshold: null })).toThrow("everyRuns must be a whole number of 1 or more; got 2.5.");
  });
});

describe("dueByMeter", () => {
  // Hour meter: 12000 h at the plan's start (baseline) on 2026-01-01, 12300 on 01-11, 12600 on 01-31.
  const readings = [
    { at: d("2026-01-01T00:00Z"), value: 12000 },
    { at: d("2026-01-11T00:00Z"), value: 12300 },
    { at: d("2026-01-31T00:00Z"), value: 12600 },
  ];
  const base = { planId: "p3", everyHours: 500, readings, baselineValue: 12000, now: d("2026-02-01T00:00Z") };

  it("crosses 500 h since baseline at the 01-31 reading; next threshold 1000 h", () => {
    const r = dueByMeter({ ...base, lastTriggeredThreshold: null });
    expect(r.used).toBe(600);
    expect(r.crossed).toEqual([{ occurrenceKey: "p3:hours:500", threshold: 500, reachedAt: d("2026-01-31T00:00Z") }]);
    expect(r.nextThreshold).toBe(1000);
    // 30-day window holds all three readings: 600 h / 30 d = 20 h/d; 400 h to go = 20 d → 02-20.
    expect(r.forecast).toEqual({ at: d("2026-02-20T00:00Z"), ratePerDay: 20 });
  });

  it("a shorter rate window uses the last two readings when it holds fewer than two", () => {
    // 10-day window before 01-31 holds only that reading → last two: 300 h / 20 d = 15 h/d;
    // 400 h to go = 26.667 d = 26 d 16 h → 2026-02-26T16:00Z.
    const r = dueByMeter({ ...base, lastTriggeredThreshold: 500, rateWindowDays: 10 });
    expect(r.crossed).toEqual([]);
    expect(r.usedSinceLastOrder).toBe(100);
    expect(r.forecast.at?.toISOString()).toBe("2026-02-26T16:00:00.000Z");
  });

  it("throws on a decreasing series, naming the reading", () => {
    const bad = [...readings, { at: d("2026-01-31T12:00Z"), value: 12590 }];
    expect(() => dueByMeter({ ...base, readings: bad, lastTriggeredThreshold: null })).toThrow(/^Meter reading 4: The reading 12590 h is lower than the previous reading 12600 h/);
  });
});

describe("forecastThreshold edge cases", () => {
  const now = d("2026-02-01T00:00Z");
  it("needs two readings and a rising usage", () => {
    expect(forecastThreshold([{ at: now, value: 1 }], 10, now)).toEqual({ at: null, reason: "At least two readings are needed to estimate the usage rate." });
    expect(forecastThreshold([{ at: d("2026-01-01Z"), value: 5 }, { at: d("2026-01-20Z"), value: 5 }], 10, now).at).toBeNull();
  });
  it("a forecast in the past (readings late) is reported as now", () => {
    // 0 → 400 h in 10 days = 40 h/d; 500 h would be reached 01-13 12:00, before now (02-01).
    const f = forecastThreshold([{ at: d("2026-01-01Z"), value: 0 }, { at: d("2026-01-11Z"), value: 400 }], 500, now);
    expect(f).toEqual({ at: now, ratePerDay: 40 });
  });
});

describe("validateMeterReading", () => {
  const now = d("2026-03-10T12:00Z");
  const prev = { at: d("2026-03-09T08:00Z"), value: 1300 };
  it("accepts a later, higher or equal reading", () => {
    expect(validateMeterReading(prev, { at: d("2026-03-10T08:00Z"), value: 1320 }, now)).toBeNull();
    expect(validateMeterReading(prev, { at: d("2026-03-10T08:00Z"), value: 1300 }, now)).toBeNull();
    expect(validateMeterReading(null, { at: now, value: 0 }, now)).toBeNull();
  });
  it("rejects a decreasing reading", () => {
    expect(validateMeterReading(prev, { at: d("2026-03-10T08:00Z"), value: 1234.5 }, now)).toBe(
      "The reading 1234.5 h is lower than the previous reading 1300 h on 2026-03-09 08:00 UTC; an hour meter only counts up. If the meter was replaced or reset, set a new baseline on the plan.",
    );
  });
  it("rejects a reading in the future", () => {
    expect(validateMeterReading(prev, { at: d("2026-03-10T12:01Z"), value: 1320 }, now)).toBe(
      "The reading is dated 2026-03-10 12:01 UTC, which is in the future; record readings when they are taken.",
    );
  });
  it("rejects out-of-order, negative and non-numeric readings", () => {
    expect(validateMeterReading(prev, { at: prev.at, value: 1400 }, now)).toMatch(/not after the previous reading/);
    expect(validateMeterReading(null, { at: now, value: -1 }, now)).toBe("A meter reading must be a number of 0 or more.");
    expect(validateMeterReading(null, { at: now, value: Number.NaN }, now)).toBe("A meter reading must be a number of 0 or more.");
    expect(validateMeterReading(null, { at: new Date("nope"), value: 1 }, now)).toBe("The reading has no valid date and time.");
  });
});
