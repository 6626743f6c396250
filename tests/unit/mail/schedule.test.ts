import { describe, expect, it } from "vitest";
import { dueOccurrence, icalText, ruleForWeekdays, weekdaysOfRule } from "@/lib/mail/schedule";
import { eventMessages } from "@/lib/mail/events";
import { defaultSubscriptionsFor } from "@/lib/mail/kinds";

// Instants checked with Python's zoneinfo (IANA tzdata), independent of our code:
//   datetime(2027,1,4,7,30,tzinfo=ZoneInfo("Europe/Dublin")) → 07:30Z;  (2027,6,7,7,30) → 06:30Z.
const sub = (over: Partial<Parameters<typeof dueOccurrence>[0]> = {}) => ({
  enabled: true,
  schedule: "FREQ=WEEKLY;BYDAY=MO",
  sendAt: "07:30",
  timeZone: "Europe/Dublin",
  lastEnqueuedOccurrence: null,
  createdAt: new Date("2027-01-01T00:00:00Z"),
  ...over,
});

describe("dueOccurrence", () => {
  it("is null until the instant, then that instant", () => {
    expect(dueOccurrence(sub(), new Date("2027-01-04T07:29:59.999Z"))).toBeNull();
    expect(dueOccurrence(sub(), new Date("2027-01-04T07:30:00Z"))).toEqual(new Date("2027-01-04T07:30:00Z"));
  });
  it("is null once that occurrence was enqueued", () => {
    expect(dueOccurrence(sub({ lastEnqueuedOccurrence: new Date("2027-01-04T07:30:00Z") }), new Date("2027-01-10T00:00:00Z"))).toBeNull();
  });
  it("after downtime returns only the latest missed occurrence", () => {
    expect(dueOccurrence(sub(), new Date("2027-06-08T00:00:00Z"))).toEqual(new Date("2027-06-07T06:30:00Z"));
  });
  it("reads the time on the person's own clock (New York: EST, UTC−5, in January)", () => {
    expect(dueOccurrence(sub({ timeZone: "America/New_York" }), new Date("2027-01-04T12:29:00Z"))).toBeNull();
    expect(dueOccurrence(sub({ timeZone: "America/New_York" }), new Date("2027-01-04T12:30:00Z"))).toEqual(new Date("2027-01-04T12:30:00Z"));
  });
  it("never fires when disabled or unscheduled", () => {
    expect(dueOccurrence(sub({ enabled: false }), new Date("2027-02-01T12:00:00Z"))).toBeNull();
    expect(dueOccurrence(sub({ schedule: null }), new Date("2027-02-01T12:00:00Z"))).toBeNull();
  });
});

describe("the friendly schedule", () => {
  it("makes weekly rules from weekdays (RFC 5545 BYDAY order), daily for all seven", () => {
    expect(ruleForWeekdays(["FR", "MO"])).toBe("FREQ=WEEKLY;BYDAY=MO,FR");
    expect(ruleForWeekdays(["MO", "TU", "WE", "TH", "FR", "SA", "SU"])).toBe("FREQ=DAILY");
    expect(() => ruleForWeekdays([])).toThrow(/at least one/);
    expect(weekdaysOfRule("FREQ=WEEKLY;BYDAY=MO,FR")).toEqual(["MO", "FR"]);
    expect(weekdaysOfRule("FREQ=DAILY")).toHaveLength(7);
  });
  it("shows the RFC 5545 text with the zone", () => {
    expect(icalText("FREQ=WEEKLY;BYDAY=MO", "07:30", "Europe/Dublin")).toBe("DTSTART;TZID=Europe/Dublin:20240101T073000\nRRULE:FREQ=WEEKLY;BYDAY=MO");
  });
});

describe("event fan-out and role defaults", () => {
  const subs = [{ userId: "a", enabled: true }, { userId: "b", enabled: true }, { userId: "c", enabled: false }];
  it("sends an event to every enabled subscriber, or only to the named ones who are subscribed", () => {
    const out = eventMessages([{ key: "alert:1", audience: "subscribers", props: {} }, { key: "wo:9", audience: ["b", "c", "b"], props: {} }], subs);
    expect(out.map((m) => `${m.userId}/${m.eventKey}`)).toEqual(["a/alert:1", "b/alert:1", "b/wo:9"]);
  });
  it("managers get Monday's digest at 07:30, technicians the morning list at 06:45", () => {
    expect(defaultSubscriptionsFor("manager").find((d) => d.kind === "fleet_digest")).toEqual({ kind: "fleet_digest", enabled: true, weekdays: ["MO"], sendAt: "07:30" });
    expect(defaultSubscriptionsFor("technician").find((d) => d.kind === "my_work_daily")).toMatchObject({ enabled: true, sendAt: "06:45" });
    expect(defaultSubscriptionsFor("viewer").every((d) => !d.enabled)).toBe(true);
  });
});
