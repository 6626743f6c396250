import fc from "fast-check";
import { TZDate } from "@date-fns/tz";
import { describe, expect, it } from "vitest";
import {
  formatWallMs,
  instantToWallMs,
  isValidTimeZone,
  localDateKey,
  parseLocalDateTime,
  wallMsToInstant,
} from "@/lib/maintenance/wall-time";
import { intlWall } from "./intl-clock";

/*
 * Wall-time conversion checked against Intl.DateTimeFormat (intl-clock.ts) as the independent
 * reference, and against @date-fns/tz's TZDate constructor as a second implementation.
 */

const ZONES = ["Europe/Dublin", "Europe/Berlin", "America/New_York", "America/Chicago", "Australia/Lord_Howe", "Asia/Kolkata", "UTC"];
// 2020-01-01 … 2030-12-31, whole minutes.
const wallOf = (local: string) => {
  const parsed = parseLocalDateTime(local);
  if ("error" in parsed) throw new Error(parsed.error);
  return parsed.wallMs;
};
const instantArb = fc.integer({ min: Date.UTC(2020, 0, 1) / 60_000, max: Date.UTC(2030, 11, 31) / 60_000 }).map((m) => new Date(m * 60_000));

describe("instant → site wall clock", () => {
  it("agrees with Intl for any instant and zone (property)", () => {
    fc.assert(
      fc.property(instantArb, fc.constantFrom(...ZONES), (instant, zone) => {
        const ours = formatWallMs(instantToWallMs(instant, zone));
        const w = intlWall(instant, zone);
        expect(ours).toBe(`${w.date}T${w.time}`);
        expect(localDateKey(instant, zone)).toBe(w.date);
      }),
      { numRuns: 500 },
    );
  });
});

describe("site wall clock → instant", () => {
  it("every instant's wall time maps back to it, or to the earlier of two in an overlap (property)", () => {
    fc.assert(
      fc.property(instantArb, fc.constantFrom(...ZONES), (instant, zone) => {
        const wall = instantToWallMs(instant, zone);
        const { instant: back, resolution } = wallMsToInstant(wall, zone);
        expect(resolution).not.toBe("shifted-forward"); // a wall time read off a real clock exists
        // Whatever was chosen reads the same wall time in Intl …
        const w = intlWall(back, zone);
        expect(`${w.date}T${w.time}`).toBe(formatWallMs(wall));
        // … and is the instant itself unless an earlier instant shows the same wall time.
        if (resolution === "exact") expect(back.getTime()).toBe(instant.getTime());
        else expect(back.getTime()).toBeLessThanOrEqual(instant.getTime());
      }),
      { numRuns: 500 },
    );
  });

  it("agrees with @date-fns/tz's TZDate constructor for any wall time (property)", () => {
    const wallArb = instantArb.map((d) => d.getTime());
    fc.assert(
      fc.property(wallArb, fc.constantFrom(...ZONES), (wallMs, zone) => {
        const d = new Date(wallMs);
        const ours = wallMsToInstant(wallMs, zone);
        // TZDate resolves wall times that occur twice differently by zone (earlier in America/*,
        // later in Europe/*), so only unambiguous wall times are compared here; overlaps and gaps
        // are checked against Intl below and in dst-transitions.test.ts.
        fc.pre(ours.resolution === "exact");
        const tzd = new TZDate(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate(), d.getUTCHours(), d.getUTCMinutes(), zone);
        expect(ours.instant.getTime()).toBe(tzd.getTime());
      }),
      { numRuns: 500 },
    );
    // Random wall times rarely land in a gap, so gaps are listed outright.
    const gaps: [string, string][] = [
      ["2026-03-08T02:30", "America/New_York"], ["2026-03-08T02:00", "America/Chicago"],
      ["2026-03-29T01:30", "Europe/Dublin"], ["2026-03-29T02:30", "Europe/Berlin"],
      ["2026-10-04T02:15", "Australia/Lord_Howe"],
    ];
    for (const [local, zone] of gaps) {
      const wallMs = wallOf(local);
      const d = new Date(wallMs);
      const tzd = new TZDate(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate(), d.getUTCHours(), d.getUTCMinutes(), zone);
      const ours = wallMsToInstant(wallMs, zone);
      expect(ours.resolution, `${local} ${zone}`).toBe("shifted-forward");
      expect(ours.instant.getTime(), `${local} ${zone}`).toBe(tzd.getTime());
    }
  });

  it("in an overlap takes the earlier of the two instants Intl shows with that wall time", () => {
    // Observed while writing this test: TZDate's choice in an overlap is not consistent — the
    // earlier instant for America/* but the later one for Europe/* and Australia/Lord_Howe —
    // which is why wall-time.ts resolves overlaps itself instead of relying on TZDate.
    const overlaps: [string, string][] = [
      ["2026-11-01T01:30", "America/New_York"], ["2026-11-01T01:59", "America/Chicago"],
      ["2026-10-25T01:30", "Europe/Dublin"], ["2026-10-25T02:30", "Europe/Berlin"],
      ["2026-04-05T01:45", "Australia/Lord_Howe"],
    ];
    for (const [local, zone] of overlaps) {
      const wallMs = wallOf(local);
      // Intl: every whole minute within ±15 h of the wall time read as UTC that shows this wall time.
      const showing: number[] = [];
      for (let t = wallMs - 15 * 3_600_000; t <= wallMs + 15 * 3_600_000; t += 60_000) {
        const w = intlWall(new Date(t), zone);
        if (`${w.date}T${w.time}` === local) showing.push(t);
      }
      expect(showing, `${local} ${zone}`).toHaveLength(2);
      const ours = wallMsToInstant(wallMs, zone);
      expect(ours.resolution).toBe("earlier-of-two");
      expect(ours.instant.getTime(), `${local} ${zone}`).toBe(Math.min(...showing));
    }
  });

  it("Lord Howe Island's 30-minute DST gap: 02:15 on 2026-10-04 is shifted by 30 min to 02:45 (+11:00)", () => {
    // tz database rule (from memory): Australia/Lord_Howe goes from +10:30 to +11:00 at 02:00
    // local on the first Sunday of October; 2026-10-04 is that Sunday. Checked with Intl below.
    const r = wallMsToInstant(wallOf("2026-10-04T02:15"), "Australia/Lord_Howe");
    expect(r.resolution).toBe("shifted-forward");
    expect(intlWall(r.instant, "Australia/Lord_Howe")).toMatchObject({ date: "2026-10-04", time: "02:45", offsetMinutes: 660 });
  });
});

describe("parsing local date-times", () => {
  it("accepts YYYY-MM-DDTHH:mm[:ss] and rejects offsets, bad dates and bad times, naming the problem", () => {
    expect(parseLocalDateTime("2026-03-23T07:00")).toEqual({ wallMs: Date.UTC(2026, 2, 23, 7, 0) });
    expect(parseLocalDateTime("2026-03-23T07:00:30")).toEqual({ wallMs: Date.UTC(2026, 2, 23, 7, 0, 30) });
    expect(parseLocalDateTime("2026-03-23T07:00Z")).toMatchObject({ error: expect.stringContaining("no offset") });
    expect(parseLocalDateTime("2026-03-23T07:00+01:00")).toMatchObject({ error: expect.stringContaining("no offset") });
    expect(parseLocalDateTime("2026-02-29T07:00")).toMatchObject({ error: "Day 29 does not exist in 2026-02." });
    expect(parseLocalDateTime("2026-13-01T07:00")).toMatchObject({ error: expect.stringContaining("Month 13") });
    expect(parseLocalDateTime("2026-03-23T24:00")).toMatchObject({ error: expect.stringContaining("out of range") });
  });

  it("knows IANA zones from nonsense", () => {
    expect(isValidTimeZone("Europe/Dublin")).toBe(true);
    expect(isValidTimeZone("Europe/Atlantis")).toBe(false);
    expect(isValidTimeZone("")).toBe(false);
  });
});
