import { describe, expect, it } from "vitest";
import { expandOccurrences, expandResolvedOccurrences } from "@/lib/maintenance/recurrence";
import { intlOffsetChanges, intlWall } from "./intl-clock";

/*
 * Daylight-saving changes, hand-worked from the tz database rules (from memory) and checked a
 * second time against Node's Intl (ICU's tz data; intl-clock.ts uses neither rrule nor our code).
 *
 * EU rule (Europe/Dublin, Europe/Berlin): clocks change at 01:00 UTC on the last Sunday of March
 * and of October.
 *   2026-01-01 is a Thursday, so 2026-03-01 is a Sunday (Jan 31 + Feb 28 = 59 days = 8 weeks + 3)
 *   → Sundays 1, 8, 15, 22, 29 March → last Sunday 2026-03-29.
 *   2026-10-01 is a Thursday → Sundays 4, 11, 18, 25 October → 2026-10-25.
 *   2027-01-01 is a Friday; 2027-03-01 a Monday → Sundays 7 … 28 March → 2027-03-28.
 *   2027-10-01 is a Friday → Sundays 3 … 31 October → 2027-10-31.
 * US rule (America/New_York, America/Chicago): 02:00 local on the second Sunday of March and the
 * first Sunday of November.
 *   2026-03-01 is a Sunday → second Sunday 2026-03-08; 2026-11-01 is a Sunday → 2026-11-01.
 *   2027-03-01 is a Monday → Sundays 7, 14 → 2027-03-14; 2027-11-01 a Monday → 2027-11-07.
 * 02:00 EST = 07:00 UTC, 02:00 EDT = 06:00 UTC; 02:00 CST = 08:00 UTC, 02:00 CDT = 07:00 UTC.
 */
const HAND_WORKED: Record<string, Record<number, [string, string]>> = {
  "Europe/Dublin": { 2026: ["2026-03-29T01:00:00.000Z", "2026-10-25T01:00:00.000Z"], 2027: ["2027-03-28T01:00:00.000Z", "2027-10-31T01:00:00.000Z"] },
  "Europe/Berlin": { 2026: ["2026-03-29T01:00:00.000Z", "2026-10-25T01:00:00.000Z"], 2027: ["2027-03-28T01:00:00.000Z", "2027-10-31T01:00:00.000Z"] },
  "America/New_York": { 2026: ["2026-03-08T07:00:00.000Z", "2026-11-01T06:00:00.000Z"], 2027: ["2027-03-14T07:00:00.000Z", "2027-11-07T06:00:00.000Z"] },
  "America/Chicago": { 2026: ["2026-03-08T08:00:00.000Z", "2026-11-01T07:00:00.000Z"], 2027: ["2027-03-14T08:00:00.000Z", "2027-11-07T07:00:00.000Z"] },
};

const HOUR = 3_600_000;

describe("hand-worked DST dates agree with Intl (second reference)", () => {
  for (const [zone, years] of Object.entries(HAND_WORKED)) {
    for (const [year, expected] of Object.entries(years)) {
      it(`${zone} ${year}`, () => {
        const changes = intlOffsetChanges(zone, new Date(`${year}-01-01T00:00Z`), new Date(`${+year + 1}-01-01T00:00Z`));
        expect(changes.map((c) => c.at.toISOString())).toEqual(expected);
        // Spring forward by one hour, fall back by one hour.
        expect(changes.map((c) => c.toOffset - c.fromOffset)).toEqual([60, -60]);
      });
    }
  }
});

describe("a daily 07:00 task stays at 07:00 local across DST changes", () => {
  for (const [zone, years] of Object.entries(HAND_WORKED)) {
    for (const [year, [spring, autumn]] of Object.entries(years)) {
      it(`${zone} ${year}: 07:00 every day; the UTC instant moves by exactly one hour on the change days`, () => {
        const due = expandOccurrences({
          rrule: "RRULE:FREQ=DAILY",
          dtstartLocal: `${year}-01-01T07:00`,
          timeZone: zone,
          from: new Date(`${year}-01-01T00:00Z`),
          to: new Date(`${year}-12-31T23:59Z`),
        });
        expect(due).toHaveLength(365); // 2026 and 2027 are not leap years
        for (const d of due) expect(intlWall(d, zone).time).toBe("07:00");
        const gaps = due.slice(1).map((d, i) => ({ day: intlWall(d, zone).date, hours: (d.getTime() - due[i].getTime()) / HOUR }));
        const odd = gaps.filter((g) => g.hours !== 24);
        // The first 07:00 after each change is the one on the change day itself (the change is
        // earlier that morning in both regions): 23 h after the previous in spring, 25 h in autumn.
        expect(odd).toEqual([
          { day: spring.slice(0, 10), hours: 23 },
          { day: autumn.slice(0, 10), hours: 25 },
        ]);
      });
    }
  }

  it("Europe/Dublin around 2026-03-29: 07:00 GMT = 07:00Z before, 07:00 IST = 06:00Z from that day", () => {
    const due = expandOccurrences({
      rrule: "FREQ=DAILY", dtstartLocal: "2026-03-20T07:00", timeZone: "Europe/Dublin",
      from: new Date("2026-03-27T00:00Z"), to: new Date("2026-03-31T00:00Z"),
    });
    expect(due.map((d) => d.toISOString())).toEqual([
      "2026-03-27T07:00:00.000Z", "2026-03-28T07:00:00.000Z",
      "2026-03-29T06:00:00.000Z", "2026-03-30T06:00:00.000Z",
    ]);
  });
});

describe("spring gap and autumn overlap (policy of RFC 5545 §3.3.5)", () => {
  it("RFC 5545 §3.3.5's own examples: New_York 20070311T023000 → 03:30 EDT; 20071104T013000 → 01:30 EDT", () => {
    // Published values: 2007-03-11 02:30 does not exist and "indicates March 11, 2007 at 3:30 A.M.
    // EDT (UTC-04:00)" = 07:30Z; 2007-11-04 01:30 occurs twice and refers to the first, EDT = 05:30Z.
    const one = (dtstartLocal: string) =>
      expandOccurrences({ rrule: "FREQ=DAILY;COUNT=1", dtstartLocal, timeZone: "America/New_York", from: new Date("2007-01-01Z"), to: new Date("2008-01-01Z") });
    expect(one("2007-03-11T02:30").map((d) => d.toISOString())).toEqual(["2007-03-11T07:30:00.000Z"]);
    expect(one("2007-11-04T01:30").map((d) => d.toISOString())).toEqual(["2007-11-04T05:30:00.000Z"]);
  });

  it("02:30 daily in New York: on 2026-03-08 (02:00→03:00) it moves to 03:30 EDT = 07:30Z", () => {
    const occ = expandResolvedOccurrences({
      rrule: "FREQ=DAILY", dtstartLocal: "2026-03-01T02:30", timeZone: "America/New_York",
      from: new Date("2026-03-07T00:00Z"), to: new Date("2026-03-10T00:00Z"),
    });
    // 02:30 EST = 07:30Z on 03-07; shifted on 03-08; 02:30 EDT = 06:30Z on 03-09.
    expect(occ.map((o) => [o.localWallTime, o.dueAt.toISOString(), o.resolution])).toEqual([
      ["2026-03-07T02:30", "2026-03-07T07:30:00.000Z", "exact"],
      ["2026-03-08T02:30", "2026-03-08T07:30:00.000Z", "shifted-forward"],
      ["2026-03-09T02:30", "2026-03-09T06:30:00.000Z", "exact"],
    ]);
    // Intl: that instant reads 03:30 on the 8th, the gap's length (60 min) later than asked.
    expect(intlWall(occ[1].dueAt, "America/New_York")).toMatchObject({ date: "2026-03-08", time: "03:30", offsetMinutes: -240 });
  });

  it("01:30 daily in New York: on 2026-11-01 01:30 happens twice; the first (EDT, 05:30Z) is taken", () => {
    const occ = expandResolvedOccurrences({
      rrule: "FREQ=DAILY", dtstartLocal: "2026-10-01T01:30", timeZone: "America/New_York",
      from: new Date("2026-10-31T00:00Z"), to: new Date("2026-11-03T00:00Z"),
    });
    expect(occ.map((o) => [o.dueAt.toISOString(), o.resolution])).toEqual([
      ["2026-10-31T05:30:00.000Z", "exact"],
      ["2026-11-01T05:30:00.000Z", "earlier-of-two"],
      ["2026-11-02T06:30:00.000Z", "exact"],
    ]);
    // Intl: both 05:30Z and 06:30Z read 01:30 that day; ours is the one still on EDT (−4 h).
    expect(intlWall(new Date("2026-11-01T06:30Z"), "America/New_York").time).toBe("01:30");
    expect(intlWall(occ[1].dueAt, "America/New_York")).toMatchObject({ time: "01:30", offsetMinutes: -240 });
  });

  it("Europe/Dublin: 01:30 on 2026-03-29 (01:00→02:00) → 02:30 IST = 01:30Z; 01:30 on 2026-10-25 → first, IST = 00:30Z", () => {
    const at = (dtstartLocal: string) =>
      expandOccurrences({ rrule: "FREQ=DAILY;COUNT=1", dtstartLocal, timeZone: "Europe/Dublin", from: new Date("2026-01-01Z"), to: new Date("2027-01-01Z") })[0];
    expect(at("2026-03-29T01:30").toISOString()).toBe("2026-03-29T01:30:00.000Z");
    expect(intlWall(at("2026-03-29T01:30"), "Europe/Dublin").time).toBe("02:30");
    expect(at("2026-10-25T01:30").toISOString()).toBe("2026-10-25T00:30:00.000Z");
    expect(intlWall(at("2026-10-25T01:30"), "Europe/Dublin")).toMatchObject({ time: "01:30", offsetMinutes: 60 });
  });
});
