import { describe, expect, it } from "vitest";
import { forecastCalendar, type CalendarOrder } from "@/lib/maintenance/calendar";

/*
 * Europe/Dublin around the 2026-03-29 change (01:00Z: GMT → IST, UTC+1). Range
 * [2026-03-27T00:00Z, 2026-03-30T23:00Z) = local 27 March 00:00 → 31 March 00:00 (IST), so the
 * days are 27, 28, 29 and 30 March.
 */
const plan = {
  id: "plan-1", title: "Clean conveyor", rrule: "FREQ=DAILY", dtstartLocal: "2026-03-20T07:00",
  timeZone: "Europe/Dublin", createdAt: new Date("2026-03-20T00:00Z"), ovenId: "L1-RF1",
};
const orders: CalendarOrder[] = [
  { id: "wo-1", title: "Clean conveyor", dueAt: new Date("2026-03-27T07:00Z"), state: "done", planId: "plan-1", occurrenceKey: "plan-1:2026-03-27T07:00" },
  { id: "wo-2", title: "Clean conveyor", dueAt: new Date("2026-03-28T07:00Z"), state: "cancelled", planId: "plan-1", occurrenceKey: "plan-1:2026-03-28T07:00" },
  { id: "wo-3", title: "Replace belt", dueAt: new Date("2026-03-29T10:00Z"), state: "open" }, // 11:00 IST
  { id: "wo-4", title: "Check blower", dueAt: new Date("2026-03-29T23:30Z"), state: "open" }, // 00:30 IST on the 30th
  { id: "wo-5", title: "Outside", dueAt: new Date("2026-04-02T07:00Z"), state: "open" },
];

describe("forecastCalendar", () => {
  const days = forecastCalendar({
    plans: [plan],
    existingOrders: orders,
    usageForecasts: [{ planId: "p9", title: "Inspect probes", occurrenceKey: "p9:runs:30", at: new Date("2026-03-30T04:48Z") }],
    from: new Date("2026-03-27T00:00Z"),
    to: new Date("2026-03-30T23:00Z"),
    now: new Date("2026-03-27T12:00Z"),
    timeZone: "Europe/Dublin",
  });
  const view = days.map((d) => ({
    date: d.date,
    planned: d.planned.map((e) => `${e.localTime} ${e.title} (${e.state})`),
    forecast: d.forecast.map((e) => `${e.localTime} ${e.title} [${e.basis}]`),
  }));

  it("lists each local day with planned orders and not-yet-generated occurrences", () => {
    expect(view).toEqual([
      // 07:00 on the 27th is before now (12:00Z): no forecast; the done order shows as planned.
      { date: "2026-03-27", planned: ["07:00 Clean conveyor (done)"], forecast: [] },
      // The cancelled order is hidden, and its key suppresses the forecast for that occurrence.
      { date: "2026-03-28", planned: [], forecast: [] },
      // From the 29th the 07:00 task is 07:00 IST = 06:00Z.
      { date: "2026-03-29", planned: ["11:00 Replace belt (open)"], forecast: ["07:00 Clean conveyor [calendar]"] },
      // 23:30Z on the 29th is 00:30 IST on the 30th; the usage forecast 04:48Z is 05:48 IST.
      { date: "2026-03-30", planned: ["00:30 Check blower (open)"], forecast: ["05:48 Inspect probes [usage]", "07:00 Clean conveyor [calendar]"] },
    ]);
  });

  it("forecast entries carry the occurrence key the generator will use", () => {
    const f = days.find((d) => d.date === "2026-03-29")!.forecast[0];
    expect(f).toMatchObject({ occurrenceKey: "plan-1:2026-03-29T07:00", dueAt: new Date("2026-03-29T06:00Z"), ovenId: "L1-RF1" });
  });

  it("refuses an empty or huge range", () => {
    const base = { plans: [], existingOrders: [], now: new Date(), timeZone: "UTC" };
    expect(() => forecastCalendar({ ...base, from: new Date("2026-01-02Z"), to: new Date("2026-01-01Z") })).toThrow("must end after it starts");
    expect(() => forecastCalendar({ ...base, from: new Date("2026-01-01Z"), to: new Date("2028-01-01Z") })).toThrow("at most 400 days");
  });
});
