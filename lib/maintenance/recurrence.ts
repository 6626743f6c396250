import { RRule, type RRuleInstance } from "./rrule-interop";
import { parseRrule, type ParsedRule, type WeekdayCode } from "./rrule-parse";
import {
  formatWallMs,
  instantToWallMs,
  isValidTimeZone,
  parseLocalDateTime,
  wallMsToInstant,
  type WallResolution,
} from "./wall-time";

/*
 * Calendar recurrence in the site's time zone.
 *
 * rrule's own `tzid` support hands back "floating" dates whose meaning depends on the machine's
 * zone, so we never use it. Instead the rule is expanded in UTC-as-local: the plan's local start
 * (e.g. 07:00) is given to rrule as 07:00 UTC, rrule steps through wall times, and each wall time
 * is then mapped to the real instant in the site's zone (wall-time.ts documents the gap and
 * overlap policy). A 07:00 task therefore stays at 07:00 on the site's clock across
 * daylight-saving changes, and its UTC instant moves by the offset change.
 */

export type RecurrenceSource = {
  /** RRULE value, with or without the "RRULE:" prefix, e.g. "FREQ=WEEKLY;BYDAY=MO". */
  rrule: string;
  /** Local start on the site's clock, no offset: "2026-03-23T07:00". */
  dtstartLocal: string;
  /** IANA zone of the site, e.g. "Europe/Dublin". */
  timeZone: string;
};

export type ResolvedOccurrence = {
  /** Wall time produced by the rule, "YYYY-MM-DDTHH:mm" (before any gap shift). */
  localWallTime: string;
  /** The real instant the task is due. */
  dueAt: Date;
  resolution: WallResolution;
};

export class RecurrenceError extends Error {
  readonly code = "invalid_recurrence";
}

const DAY_MS = 86_400_000;
const DEFAULT_LIMIT = 1000;
/** nextOccurrences looks no further than this; rules that never match would otherwise spin. */
const NEXT_HORIZON_MS = 50 * 366 * DAY_MS;

const WEEKDAYS: Record<WeekdayCode, number> = {
  MO: 0, TU: 1, WE: 2, TH: 3, FR: 4, SA: 5, SU: 6,
};
const FREQ = {
  YEARLY: RRule.YEARLY, MONTHLY: RRule.MONTHLY, WEEKLY: RRule.WEEKLY, DAILY: RRule.DAILY,
} as const;

type Compiled = { rule: RRuleInstance; untilInstant: Date | null; timeZone: string };

function compile(source: RecurrenceSource): Compiled {
  if (!isValidTimeZone(source.timeZone)) {
    throw new RecurrenceError(
      `Unknown time zone "${source.timeZone}"; use an IANA name such as Europe/Dublin.`,
    );
  }
  const start = parseLocalDateTime(source.dtstartLocal);
  if ("error" in start) throw new RecurrenceError(`Start: ${start.error}`);
  const parsed = parseRrule(source.rrule);
  if ("error" in parsed) throw new RecurrenceError(parsed.error);
  const { until, untilInstant } = untilFor(parsed.rule, source.timeZone);
  const r = parsed.rule;
  const byweekday = r.byDay.map((d) => {
    const day = RRule[d.weekday];
    return d.ordinal === null ? day : day.nth(d.ordinal);
  });
  const rule = new RRule({
    freq: FREQ[r.freq],
    dtstart: new Date(start.wallMs),
    tzid: null,
    interval: r.interval,
    count: r.count,
    until,
    wkst: r.wkst === null ? null : WEEKDAYS[r.wkst],
    byweekday: byweekday.length ? byweekday : null,
    bymonthday: r.byMonthDay.length ? r.byMonthDay : null,
    bymonth: r.byMonth.length ? r.byMonth : null,
    bysetpos: r.bySetPos.length ? r.bySetPos : null,
    byyearday: r.byYearDay.length ? r.byYearDay : null,
    byweekno: r.byWeekNo.length ? r.byWeekNo : null,
    byhour: r.byHour.length ? r.byHour : null,
    byminute: r.byMinute.length ? r.byMinute : null,
  });
  return { rule, untilInstant, timeZone: source.timeZone };
}

/**
 * UNTIL in UTC ("...Z", what RFC 5545 requires beside a zoned start) is converted to the site's
 * wall clock for rrule and kept as an instant for an exact final filter. A floating UNTIL is read
 * as site wall time; a date-only UNTIL includes that whole local day.
 */
function untilFor(rule: ParsedRule, timeZone: string) {
  if (!rule.until) return { until: null, untilInstant: null };
  if (rule.until.kind === "utc") {
    const instant = new Date(rule.until.wallMs);
    return { until: new Date(instantToWallMs(instant, timeZone)), untilInstant: instant };
  }
  const wall = rule.until.kind === "date" ? rule.until.wallMs + DAY_MS - 1000 : rule.until.wallMs;
  return { until: new Date(wall), untilInstant: null };
}

function walk(
  compiled: Compiled,
  fromWallMs: number,
  toWallMs: number,
  accept: (occ: ResolvedOccurrence) => "take" | "skip" | "stop",
): ResolvedOccurrence[] {
  const out: ResolvedOccurrence[] = [];
  compiled.rule.between(new Date(fromWallMs), new Date(toWallMs), true, (wall) => {
    const { instant, resolution } = wallMsToInstant(wall.getTime(), compiled.timeZone);
    if (compiled.untilInstant && instant > compiled.untilInstant) return false;
    const occ = { localWallTime: formatWallMs(wall.getTime()), dueAt: instant, resolution };
    const verdict = accept(occ);
    if (verdict === "take") out.push(occ);
    return verdict !== "stop";
  });
  return out.sort((a, b) => a.dueAt.getTime() - b.dueAt.getTime());
}

function checkRange(from: Date, to: Date) {
  if (!(from instanceof Date) || Number.isNaN(from.getTime())) throw new RecurrenceError("from is not a valid date.");
  if (!(to instanceof Date) || Number.isNaN(to.getTime())) throw new RecurrenceError("to is not a valid date.");
  if (to < from) throw new RecurrenceError("to is before from.");
}

/**
 * Occurrences with from ≤ dueAt ≤ to (both inclusive), with their wall times, earliest first.
 * At most `limit` (default 1000) are returned.
 */
export function expandResolvedOccurrences(
  input: RecurrenceSource & { from: Date; to: Date; limit?: number },
): ResolvedOccurrence[] {
  checkRange(input.from, input.to);
  const compiled = compile(input);
  const limit = input.limit ?? DEFAULT_LIMIT;
  let taken = 0;
  // A day's margin either side of the range in wall time covers any UTC offset.
  const fromWall = instantToWallMs(input.from, input.timeZone) - DAY_MS;
  const toWall = instantToWallMs(input.to, input.timeZone) + DAY_MS;
  return walk(compiled, fromWall, toWall, (occ) => {
    if (taken >= limit) return "stop";
    if (occ.dueAt < input.from || occ.dueAt > input.to) return "skip";
    taken += 1;
    return "take";
  });
}

/** UTC instants of the occurrences with from ≤ instant ≤ to, earliest first. */
export function expandOccurrences(
  input: RecurrenceSource & { from: Date; to: Date; limit?: number },
): Date[] {
  return expandResolvedOccurrences(input).map((o) => o.dueAt);
}

/** The next `count` occurrences strictly after `after` (looking at most 50 years ahead). */
export function nextOccurrences(input: RecurrenceSource & { after: Date }, count: number): Date[] {
  if (!Number.isInteger(count) || count < 1) throw new RecurrenceError("count must be a whole number of 1 or more.");
  checkRange(input.after, input.after);
  const compiled = compile(input);
  const afterWall = instantToWallMs(input.after, input.timeZone);
  let taken = 0;
  return walk(compiled, afterWall - DAY_MS, afterWall + NEXT_HORIZON_MS, (occ) => {
    if (taken >= count) return "stop";
    if (occ.dueAt <= input.after) return "skip";
    taken += 1;
    return "take";
  }).map((o) => o.dueAt);
}

/** Error message for a plan's rule, start and zone together, or null when all are usable. */
export function validateRecurrence(source: RecurrenceSource): string | null {
  try {
    compile(source);
    return null;
  } catch (e) {
    if (e instanceof RecurrenceError) return e.message;
    throw e;
  }
}
