import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  occurrenceKey,
  planOccurrencesToGenerate,
  regenerateAfterPlanEdit,
  type CalendarPlan,
  type ExistingOrder,
} from "@/lib/maintenance/generation";

const plan: CalendarPlan = {
  id: "plan-7",
  rrule: "FREQ=WEEKLY;BYDAY=MO,TH",
  dtstartLocal: "2026-03-02T07:00",
  timeZone: "Europe/Dublin",
  createdAt: new Date("2026-03-01T12:00Z"),
};

describe("planOccurrencesToGenerate", () => {
  it("generates the look-ahead window (default 14 days) with wall-time keys", () => {
    // now = Wed 2026-03-18 10:00Z → horizon Wed 2026-04-01 10:00Z. Created 03-01, so
    // Mondays/Thursdays 03-02 … 03-30 are due: 2, 5, 9, 12, 16, 19, 23, 26, 30 March.
    // 03-29 is the EU change (01:00Z): 07:00 IST = 06:00Z on 03-30.
    const out = planOccurrencesToGenerate({ plan, existingOccurrenceKeys: new Set(), now: new Date("2026-03-18T10:00Z") });
    expect(out.map((o) => o.occurrenceKey)).toEqual(
      ["02", "05", "09", "12", "16", "19", "23", "26", "30"].map((d) => `plan-7:2026-03-${d}T07:00`),
    );
    expect(out.at(-1)!.dueAt.toISOString()).toBe("2026-03-30T06:00:00.000Z");
    expect(out[0].dueAt.toISOString()).toBe("2026-03-02T07:00:00.000Z");
  });

  it("skips keys that exist, honours lookAheadDays and never goes before the plan was created", () => {
    const existing = new Set([occurrenceKey("plan-7", "2026-03-02T07:00"), occurrenceKey("plan-7", "2026-03-05T07:00")]);
    const late = { ...plan, createdAt: new Date("2026-03-04T00:00Z"), lookAheadDays: 3 };
    // Created 03-04: 03-02 is before creation; 03-05 exists; horizon = 03-09 08:00Z includes 03-09 07:00Z.
    const out = planOccurrencesToGenerate({ plan: late, existingOccurrenceKeys: existing, now: new Date("2026-03-06T08:00Z") });
    expect(out.map((o) => o.localWallTime)).toEqual(["2026-03-09T07:00"]);
  });

  it("stops at UNTIL and COUNT", () => {
    const counted = { ...plan, rrule: "FREQ=DAILY;COUNT=3", dtstartLocal: "2026-03-02T07:00" };
    expect(planOccurrencesToGenerate({ plan: counted, existingOccurrenceKeys: new Set(), now: new Date("2026-03-10Z") })).toHaveLength(3);
    const until = { ...plan, rrule: "FREQ=DAILY;UNTIL=20260304T070000Z" };
    expect(planOccurrencesToGenerate({ plan: until, existingOccurrenceKeys: new Set(), now: new Date("2026-03-10Z") }).map((o) => o.localWallTime))
      .toEqual(["2026-03-02T07:00", "2026-03-03T07:00", "2026-03-04T07:00"]);
  });

  it("reads UNTIL in UTC as an instant, not as site wall time", () => {
    const until = (timeZone: string, utc: string) =>
      planOccurrencesToGenerate({
        plan: { ...plan, timeZone, rrule: `FREQ=DAILY;UNTIL=${utc}` },
        existingOccurrenceKeys: new Set(),
        now: new Date("2026-03-10Z"),
      }).at(-1)!.localWallTime;
    // New York (EST, −5): 11:00Z on 03-04 is 06:00 local, before that day's 07:00 → last is 03-03.
    expect(until("America/New_York", "20260304T110000Z")).toBe("2026-03-03T07:00");
    // Berlin (CET, +1): 06:30Z on 03-04 is 07:30 local, after that day's 07:00 → last is 03-04.
    expect(until("Europe/Berlin", "20260304T063000Z")).toBe("2026-03-04T07:00");
  });

  it("refuses a nonsense look-ahead", () => {
    expect(() => planOccurrencesToGenerate({ plan: { ...plan, lookAheadDays: -1 }, existingOccurrenceKeys: new Set(), now: new Date() }))
      .toThrow("lookAheadDays must be a whole number of days in 0–366; got -1.");
  });
});

const ZONES = ["Europe/Dublin", "Europe/Berlin", "America/New_York", "America/Chicago"];
const RULES = [
  "FREQ=DAILY", "FREQ=DAILY;INTERVAL=2", "FREQ=WEEKLY;BYDAY=MO,TH", "FREQ=WEEKLY;INTERVAL=2;BYDAY=TU",
  "FREQ=MONTHLY;BYDAY=2TU", "FREQ=MONTHLY;BYMONTHDAY=31", "FREQ=MONTHLY;BYDAY=-1FR", "FREQ=DAILY;BYHOUR=1,2,3;BYMINUTE=30",
];
const DAY = 86_400_000;
const planArb = fc.record({
  id: fc.constantFrom("p1", "p2"),
  rrule: fc.constantFrom(...RULES),
  timeZone: fc.constantFrom(...ZONES),
  startDay: fc.integer({ min: 0, max: 400 }),
  hour: fc.integer({ min: 0, max: 23 }),
  minute: fc.constantFrom(0, 30),
  lookAheadDays: fc.integer({ min: 0, max: 40 }),
  createdOffsetDays: fc.integer({ min: -30, max: 30 }),
  nowOffsetDays: fc.integer({ min: 0, max: 120 }),
}).map((r) => {
  const startWall = new Date(Date.UTC(2026, 0, 1) + r.startDay * DAY);
  const dtstartLocal = `${startWall.toISOString().slice(0, 10)}T${String(r.hour).padStart(2, "0")}:${String(r.minute).padStart(2, "0")}`;
  const createdAt = new Date(startWall.getTime() + r.createdOffsetDays * DAY);
  const p: CalendarPlan = { id: r.id, rrule: r.rrule, timeZone: r.timeZone, dtstartLocal, lookAheadDays: r.lookAheadDays, createdAt };
  return { plan: p, now: new Date(createdAt.getTime() + r.nowOffsetDays * DAY) };
});

describe("generation is idempotent (properties)", () => {
  it("keys unique; applying the output and running again yields nothing; all within bounds", () => {
    fc.assert(
      fc.property(planArb, ({ plan: p, now }) => {
        const first = planOccurrencesToGenerate({ plan: p, existingOccurrenceKeys: new Set(), now });
        const keys = first.map((o) => o.occurrenceKey);
        expect(new Set(keys).size).toBe(keys.length);
        const horizon = now.getTime() + (p.lookAheadDays ?? 14) * DAY;
        for (const o of first) {
          expect(o.dueAt.getTime()).toBeLessThanOrEqual(horizon);
          expect(o.dueAt.getTime()).toBeGreaterThanOrEqual(p.createdAt.getTime());
          expect(o.occurrenceKey).toBe(`${p.id}:${o.localWallTime}`);
        }
        expect(planOccurrencesToGenerate({ plan: p, existingOccurrenceKeys: new Set(keys), now })).toEqual([]);
      }),
      { numRuns: 150 },
    );
  });

  it("running at an earlier time and then later equals one run at the later time, and never repeats a key", () => {
    fc.assert(
      fc.property(planArb, fc.integer({ min: 1, max: 30 }), ({ plan: p, now }, laterDays) => {
        const later = new Date(now.getTime() + laterDays * DAY);
        // One call returns at most 500 occurrences and the next call continues (generation.ts,
        // MAX_PER_RUN), so "a run" here is repeated calls until nothing is left.
        const drain = (at: Date, have: Set<string>) => {
          const out: ReturnType<typeof planOccurrencesToGenerate> = [];
          for (;;) {
            const batch = planOccurrencesToGenerate({ plan: p, existingOccurrenceKeys: have, now: at });
            if (!batch.length) return out;
            for (const o of batch) have.add(o.occurrenceKey);
            out.push(...batch);
          }
        };
        const a = drain(now, new Set());
        const b = drain(later, new Set(a.map((o) => o.occurrenceKey)));
        const once = drain(later, new Set());
        const aKeys = new Set(a.map((o) => o.occurrenceKey));
        for (const o of b) expect(aKeys.has(o.occurrenceKey)).toBe(false);
        expect([...a, ...b].map((o) => o.occurrenceKey).sort()).toEqual(once.map((o) => o.occurrenceKey).sort());
      }),
      { numRuns: 100 },
    );
  });
});

describe("regenerateAfterPlanEdit", () => {
  const now = new Date("2026-03-10T12:00Z"); // a Tuesday
  const order = (wall: string, dueAt: string, state: ExistingOrder["state"], touched = false): ExistingOrder =>
    ({ occurrenceKey: `plan-7:${wall}`, dueAt: new Date(dueAt), state, touched });
  const oldOrders: ExistingOrder[] = [
    order("2026-03-09T07:00", "2026-03-09T07:00Z", "done", true), // past: history
    order("2026-03-12T07:00", "2026-03-12T07:00Z", "open"), // future, untouched Thu → replaceable
    order("2026-03-16T07:00", "2026-03-16T07:00Z", "open", true), // future Mon, but touched → kept
    order("2026-03-19T07:00", "2026-03-19T07:00Z", "in_progress", true), // started → kept
    order("2026-03-23T07:00", "2026-03-23T07:00Z", "open"), // future Mon, untouched, still wanted → kept
  ];

  it("moving Mon+Thu to Mon+Wed cancels only future untouched Thursdays and creates Wednesdays", () => {
    const newPlan = { ...plan, rrule: "FREQ=WEEKLY;BYDAY=MO,WE" };
    const r = regenerateAfterPlanEdit({ oldOrders, newPlan, now });
    // Horizon 03-24 12:00Z. New plan after now: Wed 11, Mon 16, Wed 18, Mon 23.
    expect(r.cancelKeys).toEqual(["plan-7:2026-03-12T07:00"]);
    expect(r.create.map((o) => o.occurrenceKey)).toEqual(["plan-7:2026-03-11T07:00", "plan-7:2026-03-18T07:00"]);
    expect(r.reschedule).toEqual([]);
    // The touched Thursday 03-19 (in progress) is not cancelled even though the plan dropped it.
    expect(r.cancelKeys).not.toContain("plan-7:2026-03-19T07:00");
  });

  it("an edit never back-dates: the new Monday 03-09 (before now) is not created", () => {
    const r = regenerateAfterPlanEdit({ oldOrders: [], newPlan: { ...plan, rrule: "FREQ=WEEKLY;BYDAY=MO" }, now });
    expect(r.create.map((o) => o.localWallTime)).toEqual(["2026-03-16T07:00", "2026-03-23T07:00"]);
  });

  it("a zone change keeps untouched orders under their key but reschedules them", () => {
    const r = regenerateAfterPlanEdit({
      oldOrders: [order("2026-03-12T07:00", "2026-03-12T07:00Z", "open")],
      newPlan: { ...plan, timeZone: "Europe/Berlin", lookAheadDays: 3 },
      now,
    });
    // 07:00 CET (UTC+1) on 03-12 = 06:00Z.
    expect(r).toEqual({ cancelKeys: [], create: [], reschedule: [{ occurrenceKey: "plan-7:2026-03-12T07:00", dueAt: new Date("2026-03-12T06:00Z") }] });
  });

  it("an order generated under a longer look-ahead is not cancelled just for lying beyond today's horizon", () => {
    const far = order("2026-04-02T07:00", "2026-04-02T06:00Z", "open"); // Thu, IST
    const r = regenerateAfterPlanEdit({ oldOrders: [far], newPlan: { ...plan, lookAheadDays: 7 }, now });
    expect(r.cancelKeys).toEqual([]);
    expect(r.create.every((o) => o.dueAt <= new Date("2026-03-17T12:00Z"))).toBe(true);
  });
});
