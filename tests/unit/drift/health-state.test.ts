import { describe, expect, it } from "vitest";
import { healthState, worsened, type HealthInputs } from "@/lib/drift/health-state";

const clear: HealthInputs = {
  ovenServiceState: "in_service",
  openBreakdown: false,
  lastRunVerdict: "pass",
  signalsFiredRecently: [],
  projections: [],
  verificationOverdue: false,
  loggerCalibrationLapsed: false,
};
const spread = (daysToLimit: number | null) => ({ metricLabel: "Critical-phase spread", limit: 8, unit: "°C", direction: "above" as const, daysToLimit });

describe("healthState precedence: Down > Act > Watch > Steady", () => {
  it("steady when nothing applies", () => {
    const h = healthState(clear);
    expect(h.state).toBe("steady");
    expect(h.reasons).toHaveLength(1);
  });

  it("down beats everything, with every finding listed most severe first", () => {
    const h = healthState({
      ...clear,
      ovenServiceState: "down",
      openBreakdown: true,
      lastRunVerdict: "fail",
      projections: [spread(3)],
      signalsFiredRecently: [{ metricLabel: "ΔT at peak", signal: "ewma" }],
      verificationOverdue: true,
    });
    expect(h.state).toBe("down");
    expect(h.reasons[0]).toBe("The oven is marked down.");
    expect(h.reasons[1]).toBe("A breakdown work order is open.");
    expect(h.reasons).toHaveLength(6);
  });

  it("an open breakdown alone is down", () => {
    expect(healthState({ ...clear, openBreakdown: true }).state).toBe("down");
  });

  it("act for an out-of-window last run, or a projection within 7 days (inclusive)", () => {
    expect(healthState({ ...clear, lastRunVerdict: "fail" }).state).toBe("act");
    expect(healthState({ ...clear, lastRunVerdict: "marginal" }).state).toBe("steady");
    expect(healthState({ ...clear, projections: [spread(7)] }).state).toBe("act");
    expect(healthState({ ...clear, projections: [spread(7.01)] }).state).toBe("watch");
    expect(healthState({ ...clear, projections: [spread(0)] }).reasons[0]).toBe("Critical-phase spread has reached 8.0 °C on its trend line.");
  });

  it("watch for a projection within 30 days, with a plain sentence", () => {
    const h = healthState({ ...clear, projections: [spread(19.2)] });
    expect(h.state).toBe("watch");
    expect(h.reasons).toEqual(["Critical-phase spread is rising; projected to reach 8.0 °C in about 19 days."]);
    expect(healthState({ ...clear, projections: [spread(30)] }).state).toBe("watch");
    expect(healthState({ ...clear, projections: [spread(30.5), spread(null)] }).state).toBe("steady");
  });

  it("watch for a fired drift rule, overdue verification, or a lapsed logger calibration", () => {
    const fired = healthState({ ...clear, signalsFiredRecently: [{ metricLabel: "Time above liquidus", signal: "sixTrending" }, { metricLabel: "Time above liquidus", signal: "sixTrending" }] });
    expect(fired.state).toBe("watch");
    expect(fired.reasons).toEqual(["Time above liquidus: six runs in a row have moved steadily in one direction."]);
    expect(healthState({ ...clear, verificationOverdue: true }).state).toBe("watch");
    expect(healthState({ ...clear, loggerCalibrationLapsed: true }).state).toBe("watch");
  });

  it("act beats watch", () => {
    const h = healthState({ ...clear, verificationOverdue: true, projections: [spread(20), { ...spread(2), metricLabel: "Peak of the coldest probe", direction: "below", limit: 235 }] });
    expect(h.state).toBe("act");
    expect(h.reasons[0]).toBe("Peak of the coldest probe is falling; projected to reach 235.0 °C in about 2 days.");
  });
});

describe("worsened", () => {
  it("true only when the new state is more severe", () => {
    expect(worsened("steady", "watch")).toBe(true);
    expect(worsened("watch", "down")).toBe(true);
    expect(worsened("act", "act")).toBe(false);
    expect(worsened("down", "watch")).toBe(false);
    expect(worsened(null, "steady")).toBe(false);
    expect(worsened(undefined, "act")).toBe(true);
  });
});
