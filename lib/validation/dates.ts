import { z } from "zod";

/** Dates Ovenward accepts: JavaScript takes years up to 275 760, where adding a calibration interval or formatting fails. */
export const EARLIEST_YEAR = 1970;
export const LATEST_YEAR = 2200;

/** A date or date-time from a form or JSON (coerced like z.coerce.date), between 1970 and 2200. */
export function plantDate(error: string) {
  return z.coerce.date({ error }).refine((d) => d.getUTCFullYear() >= EARLIEST_YEAR && d.getUTCFullYear() <= LATEST_YEAR, `a date between ${EARLIEST_YEAR} and ${LATEST_YEAR}`);
}

/** "YYYY-MM-DD" (optionally followed by "THH:mm") naming a day that exists, e.g. not 2026-02-30, in the accepted years. */
export function isCalendarDate(text: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:T(\d{2}):(\d{2}))?$/.exec(text);
  if (!m) return false;
  const [y, mo, d, h, mi] = [m[1], m[2], m[3], m[4] ?? "0", m[5] ?? "0"].map(Number);
  // Date.UTC rolls an impossible day over (2026-02-30 → 2 March); a real day reads back unchanged.
  const date = new Date(Date.UTC(y, mo - 1, d));
  return y >= EARLIEST_YEAR && y <= LATEST_YEAR && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d && h < 24 && mi < 60;
}
