import { describe, expect, it } from "vitest";
import { isCalendarDate, plantDate } from "@/lib/validation/dates";
import { calibrationSchema } from "@/lib/validation/instruments";
import { ovenUpdateSchema } from "@/lib/validation/oven";
import { runListQuerySchema } from "@/lib/validation/runs";

// JavaScript dates reach the year 275 760 (ECMA-262, 21.4.1.1: ±8.64e15 ms from 1970). A date that
// far out passed validation, then adding a year to it gave an invalid date and the insert failed
// with a 500 (found by the route fuzzing: a calibration "performed" at 8 640 000 000 000 000 ms).
describe("dates Ovenward accepts", () => {
  it("refuses the far edge of JavaScript's range, naming the field", () => {
    const r = calibrationSchema.safeParse({ performedAt: 8_640_000_000_000_000, performedBy: "Kestrel Metrology", reference: "dry-well", offsets: {} });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => [i.path.join("."), i.message])).toEqual([["performedAt", "a date between 1970 and 2200"]]);
    expect(plantDate("a date").safeParse("275760-09-13").success).toBe(false);
    expect(plantDate("a date").safeParse("1969-12-31T23:59:59Z").success).toBe(false);
  });

  it("takes ordinary dates and date-times, and a list's filter dates", () => {
    expect(plantDate("a date").parse("2026-03-01").toISOString()).toBe("2026-03-01T00:00:00.000Z");
    expect(plantDate("a date").parse("2026-03-01T08:30:00Z").toISOString()).toBe("2026-03-01T08:30:00.000Z");
    expect(runListQuerySchema.safeParse({ from: "2026-01-31" }).success).toBe(true);
    expect(runListQuerySchema.safeParse({ from: "99999-01-31" }).success).toBe(false);
  });

  it("knows which calendar days exist (Gregorian leap-year rule: common knowledge, no source)", () => {
    expect(isCalendarDate("2024-02-29")).toBe(true); // divisible by 4
    expect(isCalendarDate("2000-02-29")).toBe(true); // divisible by 400
    expect(isCalendarDate("2100-02-29")).toBe(false); // divisible by 100, not by 400
    expect(isCalendarDate("2026-02-30")).toBe(false);
    expect(isCalendarDate("2026-13-01")).toBe(false);
    expect(isCalendarDate("2026-04-31")).toBe(false);
    expect(isCalendarDate("2026-03-29T02:30")).toBe(true); // a local wall time; the site's time zone decides later
    expect(isCalendarDate("2026-03-29T24:00")).toBe(false);
    expect(isCalendarDate("2026-03-29T23:60")).toBe(false);
    expect(isCalendarDate("0000-00-00")).toBe(false);
    expect(ovenUpdateSchema.safeParse({ installedOn: "2026-02-30" }).error?.issues[0]?.message).toBe("a day that exists, between 1970 and 2200");
    expect(ovenUpdateSchema.safeParse({ installedOn: "2019-05-14" }).success).toBe(true);
  });
});
