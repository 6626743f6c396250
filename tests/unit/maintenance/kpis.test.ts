import { describe, expect, it } from "vitest";
import { KPI_DEFINITIONS } from "@/lib/maintenance/kpi-definitions";
import { backlogByAge, fleetKpis, ovenKpis, pmCompliance, type KpiOrder } from "@/lib/maintenance/kpis";

/*
 * Hand-worked examples. Period: April 2026 in UTC, [2026-04-01T00:00Z, 2026-05-01T00:00Z)
 * = 30 days × 1440 = 43 200 minutes. now = 2026-05-05T00:00Z.
 */
const d = (s: string) => new Date(s);
const APRIL = { from: d("2026-04-01T00:00Z"), to: d("2026-05-01T00:00Z"), now: d("2026-05-05T00:00Z") };

let n = 0;
const wo = (o: Partial<KpiOrder> & Pick<KpiOrder, "kind" | "state">): KpiOrder => ({
  id: `wo-${++n}`, ovenId: "A", createdAt: d("2026-03-01T00:00Z"), dueAt: null, completedAt: null, ...o,
});
const pm = (due: string, state: KpiOrder["state"], completed?: string, ovenId = "A") =>
  wo({ kind: "preventive", state, dueAt: d(due), completedAt: completed ? d(completed) : null, ovenId });
const breakdown = (failure: string, state: KpiOrder["state"], downtimeMinutes: number | null, ovenId = "A") =>
  wo({ kind: "corrective", breakdown: true, state, failureStartedAt: d(failure), downtimeMinutes, ovenId, completedAt: state === "done" ? d(failure) : null });

const ovenA: KpiOrder[] = [
  pm("2026-04-02T07:00Z", "done", "2026-04-02T06:30Z"), // on time
  pm("2026-04-09T07:00Z", "done", "2026-04-10T10:00Z"), // late (27 h)
  pm("2026-04-16T07:00Z", "done", "2026-04-16T07:00Z"), // on time (exactly at due)
  pm("2026-04-23T07:00Z", "cancelled"), // excluded
  pm("2026-04-30T07:00Z", "open"), // due, not done → not on time
  pm("2026-05-07T07:00Z", "open"), // outside the period
  pm("2026-03-26T07:00Z", "done", "2026-03-26T07:00Z"), // outside the period
  wo({ kind: "calibration", state: "done", dueAt: d("2026-04-05T07:00Z"), completedAt: d("2026-04-05T07:00Z") }), // not preventive
  breakdown("2026-04-05T10:00Z", "done", 120),
  breakdown("2026-04-20T22:00Z", "done", 300),
  breakdown("2026-04-30T23:00Z", "done", 180), // 60 min in April, 120 in May
  breakdown("2026-03-31T23:30Z", "done", 90), // started in March; 60 min fall in April
  breakdown("2026-04-12T00:00Z", "cancelled", 500), // raised in error: ignored
  wo({ kind: "corrective", state: "done", failureStartedAt: d("2026-04-14T00:00Z"), downtimeMinutes: 45 }), // not a breakdown
];

describe("PM compliance", () => {
  it("done on time ÷ due, cancelled excluded: 2 / 4 = 0.5", () => {
    // Due in April and not cancelled: 04-02 (on time), 04-09 (late), 04-16 (on time), 04-30 (open).
    expect(pmCompliance(ovenA, APRIL)).toEqual({ value: 0.5, doneOnTime: 2, due: 4, cancelledExcluded: 1 });
  });
  it("a running period counts only orders already due: at 04-20, 2 / 3", () => {
    // 04-30 is not due yet at 2026-04-20T00:00Z.
    expect(pmCompliance(ovenA, { ...APRIL, now: d("2026-04-20T00:00Z") })).toMatchObject({ value: 2 / 3, due: 3 });
  });
  it("a grace allowance counts slightly late work as on time (27 h late needs > 1620 min)", () => {
    expect(pmCompliance(ovenA, APRIL, 24 * 60).value).toBe(0.5);
    expect(pmCompliance(ovenA, APRIL, 27 * 60).value).toBe(0.75);
  });
  it("is null, with a reason, when nothing was due", () => {
    expect(pmCompliance([], APRIL)).toMatchObject({ value: null, reason: "No preventive work orders were due in the period." });
  });
});

describe("MTBF, MTTR, availability for one oven", () => {
  it("April, oven A", () => {
    const k = ovenKpis({ ...APRIL, ovenId: "A", orders: ovenA });
    // Breakdowns starting in April: 04-05 (120), 04-20 (300), 04-30 (180) → 3, all repaired.
    expect(k.breakdowns).toEqual({ breakdowns: 3, repaired: 3, repairMinutes: 600, downtimeMinutesInPeriod: 540 });
    // Downtime inside April: 120 + 300 + 60 (04-30 23:00 → 05-01 00:00) + 60 (03-31 23:30 + 90 min) = 540.
    // MTBF = (43 200 − 540) / 3 = 14 220 min = 237 h.
    expect(k.mtbfHours).toEqual({ value: 237 });
    // MTTR = (120 + 300 + 180) / 3 = 200 min (full repair times, not clipped to the period).
    expect(k.mttrMinutes).toEqual({ value: 200 });
    // Availability = (43 200 − 540) / 43 200 = 0.9875.
    expect(k.availability).toEqual({ value: 0.9875 });
  });

  it("an ongoing repair counts its downtime up to now but has no repair time yet", () => {
    // Failure 04-29 00:00Z, still in progress at now (05-05): inside April 04-29 → 05-01 = 2880 min.
    const orders = [breakdown("2026-04-29T00:00Z", "in_progress", null, "C")];
    const k = ovenKpis({ ...APRIL, ovenId: "C", orders });
    expect(k.breakdowns.downtimeMinutesInPeriod).toBe(2880);
    expect(k.mtbfHours).toEqual({ value: (43200 - 2880) / 60 }); // 672 h
    expect(k.mttrMinutes).toEqual({ value: null, reason: "No breakdown that started in the period has been repaired yet." });
    expect(k.availability.value).toBeCloseTo(40320 / 43200, 12); // 0.9333…
  });

  it("no breakdowns → MTBF and MTTR null with reasons; a Dublin month is 743 h because of the DST hour", () => {
    // March 2026 on the Dublin calendar: 2026-03-01T00:00 GMT → 2026-04-01T00:00 IST (= 03-31T23:00Z):
    // 31 × 1440 − 60 = 44 580 min = 743 h.
    const k = ovenKpis({ from: d("2026-03-01T00:00Z"), to: d("2026-03-31T23:00Z"), now: d("2026-04-02Z"), ovenId: "B", orders: [] });
    expect(k.periodMinutes).toBe(44580);
    expect(k.mtbfHours).toEqual({ value: null, reason: "No breakdowns started in the period (743.0 h of operation without one)." });
    expect(k.mttrMinutes).toEqual({ value: null, reason: "No breakdowns started in the period." });
    expect(k.availability).toEqual({ value: 1 });
  });
});

describe("backlog by age", () => {
  it("buckets unfinished orders by whole days waiting, from due (or raised) time", () => {
    const now = d("2026-05-05T00:00Z");
    const orders = [
      pm("2026-04-30T07:00Z", "open"), // 4 d 17 h → 4 → 0–7
      pm("2026-04-28T00:00Z", "in_progress"), // 7 → 0–7
      pm("2026-04-05T00:00Z", "on_hold"), // 30 → 8–30
      pm("2026-04-27T00:00Z", "open"), // 8 → 8–30
      wo({ kind: "corrective", state: "open", createdAt: d("2026-02-04T00:00Z") }), // 28+31+30+1 = 90 → 31–90
      wo({ kind: "corrective", state: "open", createdAt: d("2026-02-03T00:00Z") }), // 91 → over 90
      pm("2026-05-07T07:00Z", "open"), // not yet due → not backlog
      pm("2026-01-01T07:00Z", "done", "2026-01-02T00:00Z"), // finished → not backlog
      pm("2026-01-01T07:00Z", "cancelled"), // finished → not backlog
    ];
    expect(backlogByAge(orders, now)).toEqual({ "0-7": 2, "8-30": 2, "31-90": 1, "over-90": 1, total: 6 });
  });
});

describe("fleet KPIs sum counts, never average ratios", () => {
  it("ovens A and B in April", () => {
    const ovenB = [pm("2026-04-10T07:00Z", "done", "2026-04-10T06:00Z", "B")];
    const r = fleetKpis({ ...APRIL, ovens: [{ ovenId: "A" }, { ovenId: "B", operatingMinutes: 28800 }], orders: [...ovenA, ...ovenB] });
    expect(r.perOven.map((k) => k.ovenId)).toEqual(["A", "B"]);
    expect(r.perOven[1].mtbfHours.value).toBeNull();
    // PM: (2 + 1) / (4 + 1) = 0.6 (the mean of 0.5 and 1.0 would be 0.75).
    expect(r.fleet.pmCompliance.value).toBe(0.6);
    // MTBF: ((43 200 − 540) + (28 800 − 0)) / 3 = 71 460 / 3 = 23 820 min = 397 h
    // (B runs two shifts: 16 h × 30 d = 28 800 min of operating time).
    expect(r.fleet.mtbfHours).toEqual({ value: 397 });
    expect(r.fleet.mttrMinutes).toEqual({ value: 200 });
    // Availability: (2 × 43 200 − 540) / 86 400 = 0.99375.
    expect(r.fleet.availability).toEqual({ value: 0.99375 });
  });
});

describe("KPI definitions for the page", () => {
  it("each states the rule the code applies", () => {
    expect(KPI_DEFINITIONS.pmCompliance).toMatch(/Cancelled orders are left out/);
    expect(KPI_DEFINITIONS.mtbf).toMatch(/divided by the number of breakdowns that started in the period/);
    expect(KPI_DEFINITIONS.mttr).toMatch(/divided by their number/);
    expect(KPI_DEFINITIONS.availability).toMatch(/divided by the period's minutes/);
    expect(KPI_DEFINITIONS.backlogAge).toMatch(/0–7, 8–30, 31–90 and over 90/);
  });
});
