/*
 * A strict reader for the RRULE value (RFC 5545 §3.3.10). rrule's own parser accepts nonsense
 * silently (INTERVAL=abc, BYDAY=XX), so plans are checked here first and every error names the
 * rule part that is wrong.
 */

export const FREQUENCIES = ["DAILY", "WEEKLY", "MONTHLY", "YEARLY"] as const;
export type Frequency = (typeof FREQUENCIES)[number];
export const WEEKDAY_CODES = ["MO", "TU", "WE", "TH", "FR", "SA", "SU"] as const;
export type WeekdayCode = (typeof WEEKDAY_CODES)[number];

export type ByDayEntry = { ordinal: number | null; weekday: WeekdayCode };

export type ParsedRule = {
  freq: Frequency;
  interval: number;
  count: number | null;
  /** UNTIL as written: a UTC instant ("...Z"), a floating local date-time, or a date. */
  until: { kind: "utc" | "local" | "date"; wallMs: number } | null;
  byDay: ByDayEntry[];
  byMonthDay: number[];
  byMonth: number[];
  bySetPos: number[];
  byYearDay: number[];
  byWeekNo: number[];
  byHour: number[];
  byMinute: number[];
  wkst: WeekdayCode | null;
};

const PARTS = [
  "FREQ", "INTERVAL", "COUNT", "UNTIL", "BYDAY", "BYMONTHDAY", "BYMONTH", "BYSETPOS",
  "BYYEARDAY", "BYWEEKNO", "BYHOUR", "BYMINUTE", "WKST",
] as const;
type PartName = (typeof PARTS)[number];

class RuleError extends Error {}

/** Removes an optional "RRULE:" prefix and surrounding space. */
export function stripRrulePrefix(text: string): string {
  return text.trim().replace(/^RRULE:/i, "").trim();
}

function intList(name: string, value: string, min: number, max: number, signed: boolean) {
  return value.split(",").map((raw) => {
    const n = /^[+-]?\d+$/.test(raw) ? Number(raw) : NaN;
    const ok = Number.isInteger(n) && n !== 0 && Math.abs(n) <= max && (signed || n >= min);
    if (!ok) {
      const range = signed ? `±${min}–${max} (not 0)` : `${min}–${max}`;
      throw new RuleError(`${name} value "${raw}" must be a whole number in ${range}.`);
    }
    return n;
  });
}

function plainList(name: string, value: string, min: number, max: number) {
  return value.split(",").map((raw) => {
    const n = /^\d+$/.test(raw) ? Number(raw) : NaN;
    if (!(n >= min && n <= max)) {
      throw new RuleError(`${name} value "${raw}" must be a whole number in ${min}–${max}.`);
    }
    return n;
  });
}

function positive(name: string, value: string): number {
  const n = /^\d+$/.test(value) ? Number(value) : NaN;
  if (!(n >= 1)) throw new RuleError(`${name} must be a whole number of 1 or more; got "${value}".`);
  return n;
}

function parseUntil(value: string): NonNullable<ParsedRule["until"]> {
  const m = /^(\d{4})(\d{2})(\d{2})(?:T(\d{2})(\d{2})(\d{2})(Z)?)?$/i.exec(value);
  if (!m) {
    throw new RuleError(`UNTIL "${value}" must look like 20261231T235959Z (UTC) or 20261231.`);
  }
  const [y, mo, d, h = 0, mi = 0, s = 0] = m.slice(1, 7).map((v) => (v === undefined ? 0 : Number(v)));
  const wallMs = Date.UTC(y, mo - 1, d, h, mi, s);
  const back = new Date(wallMs);
  if (back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d || h > 23 || mi > 59 || s > 59) {
    throw new RuleError(`UNTIL "${value}" is not a real date and time.`);
  }
  return { kind: m[4] === undefined ? "date" : m[7] ? "utc" : "local", wallMs };
}

function parseByDay(value: string, freq: Frequency): ByDayEntry[] {
  return value.split(",").map((raw) => {
    const m = /^([+-]?\d{1,2})?(MO|TU|WE|TH|FR|SA|SU)$/.exec(raw);
    if (!m) throw new RuleError(`BYDAY value "${raw}" is not a weekday such as MO, 2TU or -1FR.`);
    const ordinal = m[1] === undefined ? null : Number(m[1]);
    if (ordinal !== null && (ordinal === 0 || Math.abs(ordinal) > 53)) {
      throw new RuleError(`BYDAY value "${raw}" has an ordinal out of range ±1–53.`);
    }
    if (ordinal !== null && freq !== "MONTHLY" && freq !== "YEARLY") {
      throw new RuleError(
        `BYDAY value "${raw}" has an ordinal, which RFC 5545 allows only with FREQ=MONTHLY or YEARLY.`,
      );
    }
    return { ordinal, weekday: m[2] as WeekdayCode };
  });
}

function parseOrThrow(text: string): ParsedRule {
  const body = stripRrulePrefix(text);
  if (body === "") throw new RuleError("The rule is empty; give at least FREQ, e.g. FREQ=WEEKLY;BYDAY=MO.");
  if (/[\r\n]/.test(body) || /(^|[;\s])(DTSTART|EXDATE|RDATE)\b/i.test(body)) {
    throw new RuleError("Only the RRULE value is accepted; the start date-time is set separately.");
  }
  const raw = new Map<PartName, string>();
  for (const piece of body.split(";").filter((p) => p !== "")) {
    const eq = piece.indexOf("=");
    if (eq <= 0) throw new RuleError(`Rule part "${piece}" is not NAME=VALUE.`);
    const name = piece.slice(0, eq).toUpperCase();
    // Names are case-insensitive; values keep their spelling so errors quote what was typed.
    const value = piece.slice(eq + 1);
    if (!(PARTS as readonly string[]).includes(name)) {
      throw new RuleError(`Unknown or unsupported rule part "${name}"; supported: ${PARTS.join(", ")}.`);
    }
    if (raw.has(name as PartName)) throw new RuleError(`${name} is given more than once.`);
    if (value === "") throw new RuleError(`${name} has no value.`);
    raw.set(name as PartName, value);
  }
  const freqText = raw.get("FREQ")?.toUpperCase();
  if (!freqText) throw new RuleError("FREQ is missing; use DAILY, WEEKLY, MONTHLY or YEARLY.");
  if (!(FREQUENCIES as readonly string[]).includes(freqText)) {
    throw new RuleError(
      `FREQ=${freqText} is not supported for maintenance plans; use DAILY, WEEKLY, MONTHLY or YEARLY.`,
    );
  }
  const freq = freqText as Frequency;
  if (raw.has("COUNT") && raw.has("UNTIL")) {
    throw new RuleError("COUNT and UNTIL cannot both be given (RFC 5545).");
  }
  const get = (n: PartName) => raw.get(n);
  const rule: ParsedRule = {
    freq,
    interval: get("INTERVAL") ? positive("INTERVAL", get("INTERVAL")!) : 1,
    count: get("COUNT") ? positive("COUNT", get("COUNT")!) : null,
    until: get("UNTIL") ? parseUntil(get("UNTIL")!) : null,
    byDay: get("BYDAY") ? parseByDay(get("BYDAY")!.toUpperCase(), freq) : [],
    byMonthDay: get("BYMONTHDAY") ? intList("BYMONTHDAY", get("BYMONTHDAY")!, 1, 31, true) : [],
    byMonth: get("BYMONTH") ? intList("BYMONTH", get("BYMONTH")!, 1, 12, false) : [],
    bySetPos: get("BYSETPOS") ? intList("BYSETPOS", get("BYSETPOS")!, 1, 366, true) : [],
    byYearDay: get("BYYEARDAY") ? intList("BYYEARDAY", get("BYYEARDAY")!, 1, 366, true) : [],
    byWeekNo: get("BYWEEKNO") ? intList("BYWEEKNO", get("BYWEEKNO")!, 1, 53, true) : [],
    byHour: get("BYHOUR") ? plainList("BYHOUR", get("BYHOUR")!, 0, 23) : [],
    byMinute: get("BYMINUTE") ? plainList("BYMINUTE", get("BYMINUTE")!, 0, 59) : [],
    wkst: null,
  };
  const wkst = get("WKST")?.toUpperCase();
  if (wkst !== undefined) {
    if (!(WEEKDAY_CODES as readonly string[]).includes(wkst)) {
      throw new RuleError(`WKST "${wkst}" is not a weekday (MO, TU, WE, TH, FR, SA, SU).`);
    }
    rule.wkst = wkst as WeekdayCode;
  }
  if (rule.byMonthDay.length && freq === "WEEKLY") {
    throw new RuleError("BYMONTHDAY cannot be used with FREQ=WEEKLY (RFC 5545).");
  }
  if (rule.byYearDay.length && freq !== "YEARLY") {
    throw new RuleError("BYYEARDAY is supported only with FREQ=YEARLY.");
  }
  if (rule.byWeekNo.length && freq !== "YEARLY") {
    throw new RuleError("BYWEEKNO can be used only with FREQ=YEARLY (RFC 5545).");
  }
  const hasOtherBy = rule.byDay.length + rule.byMonthDay.length + rule.byMonth.length +
    rule.byYearDay.length + rule.byWeekNo.length + rule.byHour.length + rule.byMinute.length > 0;
  if (rule.bySetPos.length && !hasOtherBy) {
    throw new RuleError("BYSETPOS needs another BYxxx part to select from (RFC 5545).");
  }
  return rule;
}

/** Parses an RRULE value, or returns the error that names the wrong part. */
export function parseRrule(text: string): { rule: ParsedRule } | { error: string } {
  if (typeof text !== "string") return { error: "The rule must be text such as FREQ=WEEKLY;BYDAY=MO." };
  try {
    return { rule: parseOrThrow(text) };
  } catch (e) {
    if (e instanceof RuleError) return { error: e.message };
    throw e;
  }
}

/** Error message naming what is wrong with an RRULE, or null when it is acceptable. */
export function validateRrule(text: string): string | null {
  const parsed = parseRrule(text);
  return "error" in parsed ? parsed.error : null;
}
