import { tzOffset } from "@date-fns/tz";

/*
 * Wall times ("2026-03-23T07:00" on the site's clock) are carried as "wall milliseconds": the
 * number Date.UTC would give for those calendar fields. That is the UTC-as-local trick rrule
 * needs (it computes in UTC), and it makes wall-time arithmetic free of offsets.
 */

const MINUTE_MS = 60_000;
const DAY_MS = 86_400_000;
const LOCAL_RE = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

/** How a wall time was mapped to an instant. */
export type WallResolution =
  /** The wall time exists exactly once. */
  | "exact"
  /** The wall time falls in a spring-forward gap and was moved later by the gap's length. */
  | "shifted-forward"
  /** The wall time occurs twice (autumn fall-back); the earlier instant was taken. */
  | "earlier-of-two";

export function isValidTimeZone(timeZone: string): boolean {
  if (typeof timeZone !== "string" || timeZone.trim() === "") return false;
  try {
    new Intl.DateTimeFormat("en-US", { timeZone });
    return true;
  } catch {
    return false;
  }
}

/**
 * Parses "YYYY-MM-DDTHH:mm" or "YYYY-MM-DDTHH:mm:ss" with no offset. Returns wall ms, or an
 * error message naming what is wrong.
 */
export function parseLocalDateTime(text: string): { wallMs: number } | { error: string } {
  const m = LOCAL_RE.exec(typeof text === "string" ? text.trim() : "");
  if (!m) {
    return {
      error: `"${text}" is not a local date-time; use YYYY-MM-DDTHH:mm with no offset, e.g. 2026-03-23T07:00.`,
    };
  }
  const [y, mo, d, h, mi, s] = m.slice(1).map((v) => (v === undefined ? 0 : Number(v)));
  if (mo < 1 || mo > 12) return { error: `Month ${mo} in "${text}" is out of range 01–12.` };
  if (h > 23 || mi > 59 || s > 59) return { error: `Time in "${text}" is out of range.` };
  const wallMs = Date.UTC(y, mo - 1, d, h, mi, s);
  if (new Date(wallMs).getUTCDate() !== d) {
    return { error: `Day ${d} does not exist in ${y}-${String(mo).padStart(2, "0")}.` };
  }
  return { wallMs };
}

/** Wall ms → "YYYY-MM-DDTHH:mm" (":ss" appended only when the seconds are not zero). */
export function formatWallMs(wallMs: number): string {
  const iso = new Date(wallMs).toISOString(); // "2026-03-23T07:00:00.000Z"
  const seconds = iso.slice(17, 19);
  return seconds === "00" ? iso.slice(0, 16) : iso.slice(0, 19);
}

/** The site's wall clock at an instant, as wall ms. */
export function instantToWallMs(instant: Date, timeZone: string): number {
  return instant.getTime() + tzOffset(timeZone, instant) * MINUTE_MS;
}

/** "YYYY-MM-DD" of an instant on the site's calendar. */
export function localDateKey(instant: Date, timeZone: string): string {
  return new Date(instantToWallMs(instant, timeZone)).toISOString().slice(0, 10);
}

/**
 * Maps a wall time on the site's clock to a real instant.
 *
 * Policy (the DATE-TIME rule of RFC 5545 §3.3.5, which we also apply to recurrence instances):
 * - a wall time that occurs twice in the autumn fall-back refers to the FIRST (earlier) instant,
 *   e.g. 01:30 in New York on 2026-11-01 is 01:30 EDT = 05:30 UTC;
 * - a wall time that does not exist in the spring-forward gap is read with the UTC offset in
 *   force before the gap, i.e. it moves later by the gap's length, e.g. 02:30 in New York on
 *   2026-03-08 becomes 03:30 EDT = 07:30 UTC.
 * (RFC 5545 §3.3.10 would drop a recurrence instance that falls in a gap; for maintenance a
 * skipped task is worse than one an hour late, so we shift instead.)
 */
export function wallMsToInstant(
  wallMs: number,
  timeZone: string,
): { instant: Date; resolution: WallResolution } {
  // Offsets in force a day either side bound the candidates; zones do not change offset twice
  // within 48 hours in the tz database's modern rules.
  const before = tzOffset(timeZone, new Date(wallMs - DAY_MS));
  const after = tzOffset(timeZone, new Date(wallMs + DAY_MS));
  if (Number.isNaN(before) || Number.isNaN(after)) {
    throw new Error(`Unknown time zone "${timeZone}"; use an IANA name such as Europe/Dublin.`);
  }
  const candidates = [...new Set([before, after])]
    .map((offset) => wallMs - offset * MINUTE_MS)
    .filter((ms) => instantToWallMs(new Date(ms), timeZone) === wallMs)
    .sort((a, b) => a - b);
  if (candidates.length === 1) return { instant: new Date(candidates[0]), resolution: "exact" };
  if (candidates.length > 1) {
    return { instant: new Date(candidates[0]), resolution: "earlier-of-two" };
  }
  return { instant: new Date(wallMs - before * MINUTE_MS), resolution: "shifted-forward" };
}
