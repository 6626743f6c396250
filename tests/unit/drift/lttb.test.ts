// LTTB on invented series: exact output size, endpoints kept, spikes kept.
import { describe, expect, it } from "vitest";
import { downsampleForChart, lttb } from "@/lib/drift/lttb";
import { DAY, T0 } from "./helpers";

describe("lttb", () => {
  const n = 5000;
  const spikes = new Map([[1234, 100], [3777, -80], [4998, 55]]);
  const series = Array.from({ length: n }, (_, k) => ({ at: T0 + k * DAY, value: spikes.get(k) ?? Math.sin(k / 50) }));

  it("returns exactly the threshold count, keeping first and last", () => {
    const out = downsampleForChart(series);
    expect(out).toHaveLength(1000);
    expect(out[0]).toBe(series[0]);
    expect(out[999]).toBe(series[n - 1]);
  });

  it("keeps the spikes (extremes) of the series", () => {
    const out = downsampleForChart(series);
    for (const k of spikes.keys()) expect(out).toContain(series[k]);
    expect(Math.max(...out.map((p) => p.value))).toBe(100);
    expect(Math.min(...out.map((p) => p.value))).toBe(-80);
  });

  it("keeps time order and picks each point at most once", () => {
    const out = lttb(series, 137, (p) => p.at, (p) => p.value);
    expect(out).toHaveLength(137);
    for (let k = 1; k < out.length; k++) expect(out[k].at).toBeGreaterThan(out[k - 1].at);
  });

  it("leaves short series alone and rejects thresholds below 3", () => {
    const short = series.slice(0, 1000);
    expect(downsampleForChart(short)).toEqual(short);
    expect(() => lttb(series, 2, (p) => p.at, (p) => p.value)).toThrow(RangeError);
  });
});
