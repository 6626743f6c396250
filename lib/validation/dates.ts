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
  const [y, mo, d, h = "0", mi = "0"] = m.slice(1).map((x) => x ?? "0");
  const date = new Date(Date.UTC(Number(y), Number(mo) - 1, Number(d), Number(h), Number(mi)));
  return (
    Number(y) >= EARLIEST_YEAR && Number(y) <= LATEST_YEAR &&
    date.getUTCMonth() === Number(mo) - 1 && date.getUTCDate() === Number(d) && Number(h) < 24 && Number(mi) < 60
  );
}
