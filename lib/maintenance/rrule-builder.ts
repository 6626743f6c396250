import { z } from "zod";
import { RRule } from "./rrule-interop";
import { parseRrule, stripRrulePrefix, WEEKDAY_CODES, type ParsedRule, type WeekdayCode } from "./rrule-parse";
import { formatWallMs, instantToWallMs, parseLocalDateTime, wallMsToInstant } from "./wall-time";

/*
 * The friendly plan editor's model: a few shapes a technician thinks in, turned into an RRULE
 * and back into plain English. Anything richer is typed as a raw RRULE and still described.
 */

const weekday = z.enum(WEEKDAY_CODES);
const interval = (max: number) => z.coerce.number().int().min(1).max(max).default(1);

const endsSchema = z
  .discriminatedUnion("type", [
    z.object({ type: z.literal("never") }),
    z.object({ type: z.literal("after"), count: z.coerce.number().int().min(1).max(10_000) }),
    /** Last local day on which the plan may fall (inclusive). */
    z.object({ type: z.literal("on"), date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "Use YYYY-MM-DD.") }),
  ])
  .default({ type: "never" });

export const recurrenceSpecSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("daily"), interval: interval(366), ends: endsSchema }),
  z.object({
    kind: z.literal("weekly"),
    interval: interval(52),
    weekdays: z.array(weekday).min(1, "Pick at least one weekday."),
    ends: endsSchema,
  }),
  z.object({
    kind: z.literal("monthly-day"),
    interval: interval(24),
    /** 1–31, or -1 for the last day of the month. Months without the day are skipped (RFC 5545). */
    dayOfMonth: z.coerce.number().int().refine((d) => d === -1 || (d >= 1 && d <= 31), "Use 1–31 or -1 (last day)."),
    ends: endsSchema,
  }),
  z.object({
    kind: z.literal("monthly-weekday"),
    interval: interval(24),
    /** 1–4 for first…fourth, -1 for last. */
    ordinal: z.coerce.number().int().refine((n) => n === -1 || (n >= 1 && n <= 4), "Use 1–4 or -1 (last)."),
    weekday,
    ends: endsSchema,
  }),
  z.object({
    kind: z.literal("yearly"),
    interval: interval(10),
    /** Both omitted: on the start date's month and day each year. */
    month: z.coerce.number().int().min(1).max(12).optional(),
    dayOfMonth: z.coerce.number().int().min(1).max(31).optional(),
    ends: endsSchema,
  }),
]);

export type RecurrenceSpec = z.input<typeof recurrenceSpecSchema>;

const MONTH_NAMES = [
  "January", "February", "March", "April", "May", "June",
  "July", "August", "September", "October", "November", "December",
];
const DAY_NAMES: Record<WeekdayCode, string> = {
  MO: "Monday", TU: "Tuesday", WE: "Wednesday", TH: "Thursday",
  FR: "Friday", SA: "Saturday", SU: "Sunday",
};

/**
 * RRULE value (no "RRULE:" prefix) for a spec. An end date needs the site's zone, because
 * RFC 5545 wants UNTIL in UTC beside a zoned start: the end of that local day is converted.
 */
export function buildRrule(specInput: RecurrenceSpec, options: { timeZone?: string } = {}): string {
  const spec = recurrenceSpecSchema.parse(specInput);
  const parts = [`FREQ=${{ daily: "DAILY", weekly: "WEEKLY", "monthly-day": "MONTHLY", "monthly-weekday": "MONTHLY", yearly: "YEARLY" }[spec.kind]}`];
  if (spec.interval > 1) parts.push(`INTERVAL=${spec.interval}`);
  if (spec.kind === "weekly") {
    const days = WEEKDAY_CODES.filter((d) => spec.weekdays.includes(d));
    parts.push(`BYDAY=${days.join(",")}`);
  } else if (spec.kind === "monthly-day") {
    parts.push(`BYMONTHDAY=${spec.dayOfMonth}`);
  } else if (spec.kind === "monthly-weekday") {
    parts.push(`BYDAY=${spec.ordinal}${spec.weekday}`);
  } else if (spec.kind === "yearly") {
    if ((spec.month === undefined) !== (spec.dayOfMonth === undefined)) {
      throw new Error("A yearly plan needs both month and day, or neither (then the start date is used).");
    }
    if (spec.month !== undefined) parts.push(`BYMONTH=${spec.month}`, `BYMONTHDAY=${spec.dayOfMonth}`);
  }
  if (spec.ends.type === "after") parts.push(`COUNT=${spec.ends.count}`);
  if (spec.ends.type === "on") {
    if (!options.timeZone) throw new Error("An end date needs the site's time zone.");
    const endWall = parseLocalDateTime(`${spec.ends.date}T23:59:59`);
    if ("error" in endWall) throw new Error(`End date: ${endWall.error}`);
    const { instant } = wallMsToInstant(endWall.wallMs, options.timeZone);
    parts.push(`UNTIL=${instant.toISOString().replace(/[-:]/g, "").slice(0, 15)}Z`);
  }
  return parts.join(";");
}

export function ordinalSuffix(n: number): string {
  const mod100 = n % 100;
  if (mod100 >= 11 && mod100 <= 13) return `${n}th`;
  return `${n}${{ 1: "st", 2: "nd", 3: "rd" }[n % 10] ?? "th"}`;
}

function joinAnd(items: string[]): string {
  return items.length <= 1 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items.at(-1)}`;
}

function every(n: number, unit: string): string {
  return n === 1 ? `Every ${unit}` : `Every ${n} ${unit}s`;
}

function describeEnd(rule: ParsedRule, timeZone?: string): string {
  if (rule.count !== null) return rule.count === 1 ? ", once" : `, ${rule.count} times`;
  if (!rule.until) return "";
  let wall = rule.until.wallMs;
  let suffix = "";
  if (rule.until.kind === "utc") {
    if (timeZone) wall = instantToWallMs(new Date(rule.until.wallMs), timeZone);
    else suffix = " (UTC)";
  }
  const d = new Date(wall);
  return `, until ${d.getUTCDate()} ${MONTH_NAMES[d.getUTCMonth()]} ${d.getUTCFullYear()}${suffix}`;
}

function dayOfMonthText(d: number): string {
  if (d === -1) return "the last day";
  if (d < 0) return `the ${ordinalSuffix(-d)} last day`;
  return `the ${ordinalSuffix(d)}`;
}

/** The shapes the editor produces, in our own words; null for anything else. */
function describeShape(r: ParsedRule): string | null {
  const extra = r.bySetPos.length + r.byYearDay.length + r.byWeekNo.length + r.byHour.length + r.byMinute.length;
  if (extra > 0) return null;
  const plainDays = r.byDay.every((d) => d.ordinal === null);
  if (r.freq === "DAILY" && !r.byDay.length && !r.byMonthDay.length && !r.byMonth.length) {
    return every(r.interval, "day");
  }
  if (r.freq === "WEEKLY" && plainDays && !r.byMonth.length) {
    const base = every(r.interval, "week");
    if (!r.byDay.length) return base;
    const names = WEEKDAY_CODES.filter((c) => r.byDay.some((d) => d.weekday === c)).map((c) => DAY_NAMES[c]);
    return `${base} on ${joinAnd(names)}`;
  }
  if (r.freq === "MONTHLY" && !r.byMonth.length) {
    const base = every(r.interval, "month");
    if (!r.byDay.length && !r.byMonthDay.length) return base;
    if (!r.byDay.length && r.byMonthDay.length === 1) {
      const d = r.byMonthDay[0];
      const skip = d > 28 ? ` (months without a ${ordinalSuffix(d)} are skipped)` : "";
      return `${base} on ${dayOfMonthText(d)}${skip}`;
    }
    if (!r.byMonthDay.length && r.byDay.length === 1 && r.byDay[0].ordinal !== null) {
      const { ordinal, weekday: day } = r.byDay[0];
      const which = ordinal === -1 ? "last" : ordinal! < 0 ? `${ordinalSuffix(-ordinal!)} last` : ordinalSuffix(ordinal!);
      return `${base} on the ${which} ${DAY_NAMES[day]}`;
    }
    return null;
  }
  if (r.freq === "YEARLY" && !r.byDay.length) {
    const base = every(r.interval, "year");
    if (!r.byMonth.length && !r.byMonthDay.length) return base;
    if (r.byMonth.length === 1 && r.byMonthDay.length === 1 && r.byMonthDay[0] > 0) {
      return `${base} on ${r.byMonthDay[0]} ${MONTH_NAMES[r.byMonth[0] - 1]}`;
    }
  }
  return null;
}

/**
 * Plain-English description, e.g. "Every 2 weeks on Monday and Thursday". Editor shapes get our
 * own wording; other valid rules fall back to rrule's toText, capitalised — except where toText
 * is known to mislead (it ignores BYSETPOS, so "last Monday or Tuesday of the month" would read
 * "on Monday, Tuesday") or reads badly (BYHOUR/BYMINUTE: "at 7 and 19"); those show the rule
 * itself. Invalid rules get "Invalid rule: …" with the reason.
 */
export function describeRrule(text: string, options: { timeZone?: string } = {}): string {
  const parsed = parseRrule(text);
  if ("error" in parsed) return `Invalid rule: ${parsed.error}`;
  const r = parsed.rule;
  const shape = describeShape(r);
  if (shape !== null) return shape + describeEnd(r, options.timeZone);
  const body = stripRrulePrefix(text);
  if (r.bySetPos.length || r.byHour.length || r.byMinute.length) return `Custom schedule (${body})`;
  const words = RRule.fromString(body.toUpperCase()).toText();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** Local start "YYYY-MM-DDTHH:mm" for an instant, for prefilling the editor. */
export function localStartFor(instant: Date, timeZone: string): string {
  return formatWallMs(instantToWallMs(instant, timeZone));
}
