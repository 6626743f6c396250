import { describe, expect, it } from "vitest";
import { buildRrule, describeRrule, ordinalSuffix, recurrenceSpecSchema } from "@/lib/maintenance/rrule-builder";
import { validateRrule } from "@/lib/maintenance/rrule-parse";
import { expandOccurrences, nextOccurrences, validateRecurrence } from "@/lib/maintenance/recurrence";

describe("validateRrule names what is wrong", () => {
  const cases: [string, string][] = [
    ["", "The rule is empty; give at least FREQ, e.g. FREQ=WEEKLY;BYDAY=MO."],
    ["INTERVAL=2", "FREQ is missing; use DAILY, WEEKLY, MONTHLY or YEARLY."],
    ["FREQ=HOURLY", "FREQ=HOURLY is not supported for maintenance plans; use DAILY, WEEKLY, MONTHLY or YEARLY."],
    ["FREQ=WEEKLY;INTERVAL=abc", 'INTERVAL must be a whole number of 1 or more; got "abc".'],
    ["FREQ=WEEKLY;INTERVAL=0", 'INTERVAL must be a whole number of 1 or more; got "0".'],
    ["FREQ=WEEKLY;BYDAY=XX", 'BYDAY value "XX" is not a weekday such as MO, 2TU or -1FR.'],
    ["FREQ=WEEKLY;BYDAY=2MO", 'BYDAY value "2MO" has an ordinal, which RFC 5545 allows only with FREQ=MONTHLY or YEARLY.'],
    ["FREQ=MONTHLY;BYMONTHDAY=32", 'BYMONTHDAY value "32" must be a whole number in ±1–31 (not 0).'],
    ["FREQ=MONTHLY;BYMONTHDAY=0", 'BYMONTHDAY value "0" must be a whole number in ±1–31 (not 0).'],
    ["FREQ=WEEKLY;BYMONTHDAY=3", "BYMONTHDAY cannot be used with FREQ=WEEKLY (RFC 5545)."],
    ["FREQ=YEARLY;BYMONTH=13", 'BYMONTH value "13" must be a whole number in 1–12.'],
    ["FREQ=DAILY;COUNT=3;UNTIL=20261231T000000Z", "COUNT and UNTIL cannot both be given (RFC 5545)."],
    ["FREQ=DAILY;UNTIL=2026-12-31", 'UNTIL "2026-12-31" must look like 20261231T235959Z (UTC) or 20261231.'],
    ["FREQ=DAILY;UNTIL=20260230", 'UNTIL "20260230" is not a real date and time.'],
    ["FREQ=DAILY;FREQ=WEEKLY", "FREQ is given more than once."],
    ["FREQ=DAILY;COLOR=red", 'Unknown or unsupported rule part "COLOR"; supported: FREQ, INTERVAL, COUNT, UNTIL, BYDAY, BYMONTHDAY, BYMONTH, BYSETPOS, BYYEARDAY, BYWEEKNO, BYHOUR, BYMINUTE, WKST.'],
    ["FREQ=DAILY;INTERVAL", 'Rule part "INTERVAL" is not NAME=VALUE.'],
    ["FREQ=MONTHLY;BYSETPOS=1", "BYSETPOS needs another BYxxx part to select from (RFC 5545)."],
    ["FREQ=WEEKLY;WKST=XY", 'WKST "XY" is not a weekday (MO, TU, WE, TH, FR, SA, SU).'],
    ["DTSTART:20260101T070000\nRRULE:FREQ=DAILY", "Only the RRULE value is accepted; the start date-time is set separately."],
  ];
  for (const [rule, message] of cases) {
    it(JSON.stringify(rule), () => expect(validateRrule(rule)).toBe(message));
  }

  it("accepts good rules with or without the RRULE: prefix and in lower case", () => {
    for (const ok of ["FREQ=WEEKLY;BYDAY=MO", "RRULE:FREQ=WEEKLY;BYDAY=MO", "rrule:freq=monthly;byday=-1fr", "FREQ=MONTHLY;BYDAY=MO,TU;BYSETPOS=-1", "FREQ=DAILY;UNTIL=20261231T235959Z;"]) {
      expect(validateRrule(ok), ok).toBeNull();
    }
  });

  it("validateRecurrence also checks the start and the zone", () => {
    const base = { rrule: "FREQ=DAILY", dtstartLocal: "2026-03-23T07:00", timeZone: "Europe/Dublin" };
    expect(validateRecurrence(base)).toBeNull();
    expect(validateRecurrence({ ...base, timeZone: "Europe/Atlantis" })).toBe('Unknown time zone "Europe/Atlantis"; use an IANA name such as Europe/Dublin.');
    expect(validateRecurrence({ ...base, dtstartLocal: "2026-03-23 07:00" })).toMatch(/^Start: "2026-03-23 07:00" is not a local date-time/);
    expect(validateRecurrence({ ...base, rrule: "FREQ=SOMETIMES" })).toMatch(/^FREQ=SOMETIMES is not supported/);
    expect(() => expandOccurrences({ ...base, rrule: "FREQ=", from: new Date(0), to: new Date(1) })).toThrow("FREQ has no value.");
  });
});

describe("buildRrule: friendly editor → RRULE", () => {
  const cases: [unknown, string][] = [
    [{ kind: "daily" }, "FREQ=DAILY"],
    [{ kind: "daily", interval: 3 }, "FREQ=DAILY;INTERVAL=3"],
    [{ kind: "weekly", interval: 2, weekdays: ["TH", "MO", "TH"] }, "FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,TH"],
    [{ kind: "monthly-day", dayOfMonth: 31 }, "FREQ=MONTHLY;BYMONTHDAY=31"],
    [{ kind: "monthly-day", interval: 3, dayOfMonth: -1 }, "FREQ=MONTHLY;INTERVAL=3;BYMONTHDAY=-1"],
    [{ kind: "monthly-weekday", ordinal: 2, weekday: "TU" }, "FREQ=MONTHLY;BYDAY=2TU"],
    [{ kind: "monthly-weekday", ordinal: -1, weekday: "FR", ends: { type: "after", count: 6 } }, "FREQ=MONTHLY;BYDAY=-1FR;COUNT=6"],
    [{ kind: "yearly" }, "FREQ=YEARLY"],
    [{ kind: "yearly", month: 3, dayOfMonth: 23 }, "FREQ=YEARLY;BYMONTH=3;BYMONTHDAY=23"],
    // Form values arrive as strings; the schema coerces them.
    [{ kind: "daily", interval: "2" }, "FREQ=DAILY;INTERVAL=2"],
  ];
  for (const [spec, rule] of cases) {
    it(`${JSON.stringify(spec)} → ${rule}`, () => {
      const built = buildRrule(spec as never, { timeZone: "Europe/Dublin" });
      expect(built).toBe(rule);
      expect(validateRrule(built)).toBeNull();
    });
  }

  it("an end date is the end of that local day, in UTC as RFC 5545 requires", () => {
    // Dublin keeps GMT (+0) in December: 2026-12-31 23:59:59 local = 23:59:59Z.
    expect(buildRrule({ kind: "daily", ends: { type: "on", date: "2026-12-31" } }, { timeZone: "Europe/Dublin" })).toBe("FREQ=DAILY;UNTIL=20261231T235959Z");
    // New York is on EST (−5) in December: 23:59:59 local = 04:59:59Z the next day.
    expect(buildRrule({ kind: "daily", ends: { type: "on", date: "2026-12-31" } }, { timeZone: "America/New_York" })).toBe("FREQ=DAILY;UNTIL=20270101T045959Z");
    // … and the last occurrence is on that day: 07:00 daily until Dec 31 ends with Dec 31.
    const rule = buildRrule({ kind: "daily", ends: { type: "on", date: "2026-12-31" } }, { timeZone: "America/New_York" });
    const due = expandOccurrences({ rrule: rule, dtstartLocal: "2026-12-29T07:00", timeZone: "America/New_York", from: new Date("2026-12-01Z"), to: new Date("2027-02-01Z") });
    expect(due.map((d) => d.toISOString())).toEqual(["2026-12-29T12:00:00.000Z", "2026-12-30T12:00:00.000Z", "2026-12-31T12:00:00.000Z"]);
    expect(() => buildRrule({ kind: "daily", ends: { type: "on", date: "2026-12-31" } })).toThrow("An end date needs the site's time zone.");
  });

  it("the zod schema refuses what the editor cannot mean", () => {
    const bad = [
      { kind: "weekly", weekdays: [] },
      { kind: "weekly", weekdays: ["XX"] },
      { kind: "daily", interval: 0 },
      { kind: "monthly-day", dayOfMonth: 0 },
      { kind: "monthly-weekday", ordinal: 5, weekday: "MO" },
      { kind: "fortnightly" },
    ];
    for (const spec of bad) expect(recurrenceSpecSchema.safeParse(spec).success, JSON.stringify(spec)).toBe(false);
    expect(() => buildRrule({ kind: "yearly", month: 3 })).toThrow("A yearly plan needs both month and day");
  });

  it("a built 'last day of month' rule lands on 31, 28, 31, 30 in early 2026", () => {
    const due = nextOccurrences({ rrule: buildRrule({ kind: "monthly-day", dayOfMonth: -1 }), dtstartLocal: "2026-01-31T07:00", timeZone: "UTC", after: new Date("2026-01-01Z") }, 4);
    expect(due.map((d) => d.toISOString().slice(0, 10))).toEqual(["2026-01-31", "2026-02-28", "2026-03-31", "2026-04-30"]);
  });
});

describe("describeRrule: RRULE → plain English", () => {
  const cases: [string, string][] = [
    ["FREQ=DAILY", "Every day"],
    ["FREQ=DAILY;INTERVAL=3", "Every 3 days"],
    ["FREQ=WEEKLY;BYDAY=MO", "Every week on Monday"],
    ["RRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=TH,MO", "Every 2 weeks on Monday and Thursday"],
    ["FREQ=WEEKLY;BYDAY=MO,WE,FR", "Every week on Monday, Wednesday and Friday"],
    ["FREQ=MONTHLY;BYMONTHDAY=15", "Every month on the 15th"],
    ["FREQ=MONTHLY;BYMONTHDAY=31", "Every month on the 31st (months without a 31st are skipped)"],
    ["FREQ=MONTHLY;INTERVAL=3;BYMONTHDAY=-1", "Every 3 months on the last day"],
    ["FREQ=MONTHLY;BYDAY=2TU", "Every month on the 2nd Tuesday"],
    ["FREQ=MONTHLY;BYDAY=-1FR;COUNT=6", "Every month on the last Friday, 6 times"],
    ["FREQ=YEARLY;BYMONTH=3;BYMONTHDAY=23", "Every year on 23 March"],
    ["FREQ=YEARLY;INTERVAL=2", "Every 2 years"],
    ["FREQ=DAILY;UNTIL=20270101T045959Z", "Every day, until 1 January 2027 (UTC)"],
    // rrule's toText ignores BYSETPOS; our fallback shows the rule instead of misleading.
    ["FREQ=MONTHLY;BYDAY=MO,TU;BYSETPOS=-1", "Custom schedule (FREQ=MONTHLY;BYDAY=MO,TU;BYSETPOS=-1)"],
    // Other shapes use rrule's toText, capitalised.
    ["FREQ=YEARLY;BYWEEKNO=20;BYDAY=MO", "Every year on Monday in week 20"],
    ["FREQ=SOMETIMES", "Invalid rule: FREQ=SOMETIMES is not supported for maintenance plans; use DAILY, WEEKLY, MONTHLY or YEARLY."],
  ];
  for (const [rule, text] of cases) it(rule, () => expect(describeRrule(rule)).toBe(text));

  it("shows UNTIL as the site's local date when the zone is given", () => {
    expect(describeRrule("FREQ=DAILY;UNTIL=20270101T045959Z", { timeZone: "America/New_York" })).toBe("Every day, until 31 December 2026");
  });

  it("ordinal suffixes", () => {
    expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 23, 31].map(ordinalSuffix)).toEqual(["1st", "2nd", "3rd", "4th", "11th", "12th", "13th", "21st", "22nd", "23rd", "31st"]);
  });
});
