import { describe, expect, it } from "vitest";
import { expandOccurrences, nextOccurrences } from "@/lib/maintenance/recurrence";
import { intlWall } from "./intl-clock";

/*
 * Published check values from RFC 5545 §3.8.5.3 ("Examples", America/New_York, 1997–98), and
 * hand-worked 2026 calendars. 1997's US rule (first Sunday of April, last Sunday of October) puts
 * the change on 1997-10-26, so the RFC marks later dates "9:00 AM EST" — a check of historical
 * tz data as well as of the expansion.
 */

const NY = "America/New_York";
const wide = { from: new Date("1997-01-01T00:00Z"), to: new Date("1999-01-01T00:00Z") };
const localDays = (dates: Date[], zone: string) => dates.map((d) => intlWall(d, zone).date);

describe("RFC 5545 §3.8.5.3 examples", () => {
  it("Monthly on the first Friday for 10 occurrences (DTSTART 19970905T090000, COUNT=10;BYDAY=1FR)", () => {
    // RFC: (1997 9:00 AM EDT) September 5; October 3 / (1997 9:00 AM EST) November 7; December 5 /
    // (1998 9:00 AM EST) January 2; February 6; March 6; April 3 / (1998 9:00 AM EDT) May 1; June 5
    const due = expandOccurrences({ rrule: "RRULE:FREQ=MONTHLY;COUNT=10;BYDAY=1FR", dtstartLocal: "1997-09-05T09:00", timeZone: NY, ...wide });
    expect(due.map((d) => d.toISOString())).toEqual([
      "1997-09-05T13:00:00.000Z", "1997-10-03T13:00:00.000Z", // EDT, UTC−4
      "1997-11-07T14:00:00.000Z", "1997-12-05T14:00:00.000Z", // EST, UTC−5
      "1998-01-02T14:00:00.000Z", "1998-02-06T14:00:00.000Z", "1998-03-06T14:00:00.000Z", "1998-04-03T14:00:00.000Z",
      "1998-05-01T13:00:00.000Z", "1998-06-05T13:00:00.000Z",
    ]);
    for (const d of due) expect(intlWall(d, NY)).toMatchObject({ time: "09:00", weekday: "Fri" });
  });

  it("Every other week on MO, WE, FR until 19971224T000000Z (UNTIL in UTC), WKST=SU — 25 occurrences", () => {
    // RFC: (1997 9:00 AM EDT) September 1,3,5,15,17,19,29; October 1,3,13,15,17
    //      (1997 9:00 AM EST) October 27,29,31; November 10,12,14,24,26,28; December 8,10,12,22
    const due = expandOccurrences({
      rrule: "FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR",
      dtstartLocal: "1997-09-01T09:00", timeZone: NY, ...wide,
    });
    const days = (m: string, ds: number[]) => ds.map((d) => `1997-${m}-${String(d).padStart(2, "0")}`);
    expect(localDays(due, NY)).toEqual([
      ...days("09", [1, 3, 5, 15, 17, 19, 29]), ...days("10", [1, 3, 13, 15, 17, 27, 29, 31]),
      ...days("11", [10, 12, 14, 24, 26, 28]), ...days("12", [8, 10, 12, 22]),
    ]);
    expect(due.map((d) => intlWall(d, NY).offsetMinutes).filter((o) => o === -240)).toHaveLength(12);
    for (const d of due) expect(intlWall(d, NY).time).toBe("09:00");
  });
});

describe("hand-worked 2026 calendars (2026-01-01 is a Thursday)", () => {
  it("2nd Tuesday of each month (BYDAY=2TU), Europe/Dublin 07:00", () => {
    // First days of the 2026 months: Jan Thu, Feb Sun, Mar Sun, Apr Wed, May Fri, Jun Mon,
    // Jul Wed, Aug Sat, Sep Tue, Oct Thu, Nov Sun, Dec Tue → second Tuesdays as listed.
    const due = expandOccurrences({
      rrule: "FREQ=MONTHLY;BYDAY=2TU", dtstartLocal: "2026-01-13T07:00", timeZone: "Europe/Dublin",
      from: new Date("2026-01-01T00:00Z"), to: new Date("2026-12-31T23:00Z"),
    });
    expect(localDays(due, "Europe/Dublin")).toEqual([
      "2026-01-13", "2026-02-10", "2026-03-10", "2026-04-14", "2026-05-12", "2026-06-09",
      "2026-07-14", "2026-08-11", "2026-09-08", "2026-10-13", "2026-11-10", "2026-12-08",
    ]);
    // Independent check with Intl: each is a Tuesday on day 8–14, at 07:00 local.
    for (const d of due) {
      const w = intlWall(d, "Europe/Dublin");
      expect(w.weekday).toBe("Tue");
      expect(+w.date.slice(8)).toBeGreaterThanOrEqual(8);
      expect(+w.date.slice(8)).toBeLessThanOrEqual(14);
      expect(w.time).toBe("07:00");
    }
  });

  it("last Friday (BYDAY=-1FR), America/Chicago, first four months", () => {
    // Jan 31 is a Sat → Fri 30; Feb 28 is a Sat → Fri 27; Mar 31 is a Tue → Fri 27; Apr 30 is a Thu → Fri 24.
    const due = nextOccurrences({ rrule: "FREQ=MONTHLY;BYDAY=-1FR", dtstartLocal: "2026-01-01T06:00", timeZone: "America/Chicago", after: new Date("2026-01-01T00:00Z") }, 4);
    expect(localDays(due, "America/Chicago")).toEqual(["2026-01-30", "2026-02-27", "2026-03-27", "2026-04-24"]);
    for (const d of due) expect(intlWall(d, "America/Chicago")).toMatchObject({ weekday: "Fri", time: "06:00" });
  });

  it("BYMONTHDAY=31 skips months without a 31st (RFC 5545 §3.3.10: invalid dates are ignored)", () => {
    // Months with 31 days: Jan, Mar, May, Jul, Aug, Oct, Dec.
    const due = expandOccurrences({
      rrule: "FREQ=MONTHLY;BYMONTHDAY=31", dtstartLocal: "2026-01-31T07:00", timeZone: "Europe/Berlin",
      from: new Date("2026-01-01T00:00Z"), to: new Date("2026-12-31T23:00Z"),
    });
    expect(localDays(due, "Europe/Berlin")).toEqual([
      "2026-01-31", "2026-03-31", "2026-05-31", "2026-07-31", "2026-08-31", "2026-10-31", "2026-12-31",
    ]);
  });

  it("weekly on Monday and Thursday every 2 weeks, America/New_York, across 2026-03-08", () => {
    // Start Mon 2026-02-23; weeks of Feb 23, Mar 9, Mar 23 → Mon/Thu of those weeks.
    const due = expandOccurrences({
      rrule: "FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,TH", dtstartLocal: "2026-02-23T07:00", timeZone: NY,
      from: new Date("2026-02-20T00:00Z"), to: new Date("2026-03-28T00:00Z"),
    });
    expect(localDays(due, NY)).toEqual(["2026-02-23", "2026-02-26", "2026-03-09", "2026-03-12", "2026-03-23", "2026-03-26"]);
    // 07:00 EST = 12:00Z before the change, 07:00 EDT = 11:00Z after.
    expect(due.map((d) => d.getUTCHours())).toEqual([12, 12, 11, 11, 11, 11]);
  });
});
