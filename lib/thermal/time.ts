import { parseDecimal } from "./numbers";

/** How a logger file writes its time column. */
export type TimeFormat = "seconds" | "mm:ss" | "hh:mm:ss" | "datetime";

const YEAR_FIRST = /^\s*(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})(?:(?:[T ]|\s+)(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?\s*$/i;
const DAY_OR_MONTH_FIRST = /^\s*(\d{1,2})([./-])(\d{1,2})\2(\d{4}|\d{2})(?:[ T,]+(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?\s*([AP]M)?)?\s*$/i;
const LOOKS_LIKE_DATE = /\d{4}[-/.]\d{1,2}[-/.]\d{1,2}|\d{1,2}[./-]\d{1,2}[./-]\d{2,4}/;

/** Format of a time column, judged from its first cell. */
export function detectTimeFormat(cell: string): TimeFormat {
  if (LOOKS_LIKE_DATE.test(cell)) return "datetime";
  const colons = cell.split(":").length - 1;
  if (colons === 1) return "mm:ss";
  if (colons === 2) return "hh:mm:ss";
  return "seconds";
}

function fraction(digits: string | undefined): number {
  return digits ? Number(`0.${digits}`) : 0;
}

/** Seconds since the Unix epoch for a date-time cell, or NaN. Without a zone, read as UTC. */
export function parseDateTime(cell: string): number {
  let year: number, month: number, day: number;
  let hour = 0, minute = 0, second = 0, frac = 0, offsetMinutes = 0;
  let m = YEAR_FIRST.exec(cell);
  if (m) {
    year = +m[1]; month = +m[2]; day = +m[3];
    if (m[4] !== undefined) { hour = +m[4]; minute = +m[5]; second = m[6] ? +m[6] : 0; frac = fraction(m[7]); }
    const zone = m[8];
    if (zone && zone.toUpperCase() !== "Z") {
      const sign = zone[0] === "-" ? -1 : 1;
      const digits = zone.slice(1).replace(":", "");
      offsetMinutes = sign * (Number(digits.slice(0, 2)) * 60 + (digits.length > 2 ? Number(digits.slice(2)) : 0));
    }
  } else {
    m = DAY_OR_MONTH_FIRST.exec(cell);
    if (!m) return NaN;
    const a = +m[1], b = +m[3];
    // Day first unless that is impossible; "/" is the US month-first habit. Only differences matter.
    const monthFirst = a > 12 ? false : b > 12 ? true : m[2] === "/";
    month = monthFirst ? a : b;
    day = monthFirst ? b : a;
    year = m[4].length === 2 ? 2000 + +m[4] : +m[4];
    if (m[5] !== undefined) { hour = +m[5]; minute = +m[6]; second = m[7] ? +m[7] : 0; frac = fraction(m[8]); }
    const meridiem = m[9]?.toUpperCase();
    if (meridiem) {
      if (hour < 1 || hour > 12) return NaN;
      hour = (hour % 12) + (meridiem === "PM" ? 12 : 0);
    }
  }
  if (month < 1 || month > 12 || day < 1 || day > 31 || hour > 23 || minute > 59 || second > 60) return NaN;
  return Date.UTC(year, month - 1, day, hour, minute, second) / 1000 + frac - offsetMinutes * 60;
}

/** Seconds for "mm:ss" or "hh:mm:ss" (seconds may carry a fraction with "." or ","), or NaN. */
export function parseClock(cell: string, format: "mm:ss" | "hh:mm:ss"): number {
  const parts = cell.trim().split(":");
  if (parts.length !== (format === "mm:ss" ? 2 : 3)) return NaN;
  const last = parts[parts.length - 1];
  const seconds = parseDecimal(last, last.includes(","));
  if (!(seconds >= 0 && seconds < 60)) return NaN;
  let total = seconds;
  let scale = 60;
  for (let i = parts.length - 2; i >= 0; i--) {
    const p = parts[i].trim();
    if (!/^\d+$/.test(p)) return NaN;
    const v = Number(p);
    if (format === "hh:mm:ss" && i === 1 && v > 59) return NaN;
    total += v * scale;
    scale *= 60;
  }
  return total;
}

/**
 * A stateful reader for one time column: turns each cell into seconds (NaN if unreadable).
 * Clock times that fall back by more than 12 h are read as crossing midnight.
 */
export function timeReader(format: TimeFormat, decimalComma: boolean, secondsScale = 1): (cell: string) => number {
  if (format === "seconds") return (cell) => parseDecimal(cell, decimalComma) * secondsScale;
  if (format === "datetime") return parseDateTime;
  let dayOffset = 0;
  let previous = -Infinity;
  return (cell) => {
    const raw = parseClock(cell, format);
    if (Number.isNaN(raw)) return NaN;
    if (format === "hh:mm:ss" && raw + dayOffset < previous - 43200) dayOffset += 86400;
    const value = raw + dayOffset;
    previous = value;
    return value;
  };
}
