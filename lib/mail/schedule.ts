import { expandOccurrences } from "@/lib/maintenance/recurrence";
import { WEEKDAY_CODES, type WeekdayCode } from "@/lib/maintenance/rrule-parse";

/*
 * When scheduled e-mails are due. A subscription holds an RRULE ("FREQ=WEEKLY;BYDAY=MO") and a
 * local send time ("07:30"), read on the person's own clock; expansion is the maintenance core's
 * (lib/maintenance/recurrence.ts), so 07:30 stays 07:30 in Dublin across daylight saving.
 */

/** A fixed Monday as DTSTART: the rules we build have no INTERVAL or COUNT, so only its time matters. */
const ANCHOR_DATE = "2024-01-01";

export type ScheduledSubscription = {
  enabled: boolean;
  schedule: string | null;
  sendAt: string | null;
  timeZone: string;
  /** The latest occurrence already enqueued (or consumed by a schedule change). */
  lastEnqueuedOccurrence: Date | null;
  createdAt: Date;
};

export function dtstartLocal(sendAt: string): string {
  return `${ANCHOR_DATE}T${sendAt}`;
}

/**
 * The occurrence to enqueue now, or null. Due when now ≥ its instant and it is later than
 * anything handled before (or than the subscription's creation, for a new one).
 *
 * After downtime several occurrences may have passed; only the latest is returned. A digest
 * is a picture of the plant at a moment: three stale Monday digests arriving at once help
 * nobody, and the latest one already says everything the others would.
 */
export function dueOccurrence(sub: ScheduledSubscription, now: Date): Date | null {
  if (!sub.enabled || !sub.schedule || !sub.sendAt) return null;
  const since = sub.lastEnqueuedOccurrence ?? sub.createdAt;
  if (since >= now) return null;
  // Strictly after `since`: expandOccurrences is inclusive at both ends.
  const from = new Date(since.getTime() + 1);
  const found = expandOccurrences({ rrule: sub.schedule, dtstartLocal: dtstartLocal(sub.sendAt), timeZone: sub.timeZone, from, to: now });
  return found.length ? found[found.length - 1] : null;
}

/** The rule the settings form makes from ticked weekdays: daily when all seven, else weekly. */
export function ruleForWeekdays(weekdays: readonly string[]): string {
  const days = WEEKDAY_CODES.filter((d) => weekdays.includes(d));
  if (days.length === 0) throw new Error("Pick at least one weekday.");
  return days.length === 7 ? "FREQ=DAILY" : `FREQ=WEEKLY;BYDAY=${days.join(",")}`;
}

/** Weekdays a rule made by ruleForWeekdays runs on (for prefilling the form). */
export function weekdaysOfRule(rule: string | null): WeekdayCode[] {
  if (!rule) return [];
  if (/FREQ=DAILY/.test(rule) && !/BYDAY=/.test(rule)) return [...WEEKDAY_CODES];
  const m = /BYDAY=([A-Z,]+)/.exec(rule);
  return m ? (m[1].split(",").filter((d) => (WEEKDAY_CODES as readonly string[]).includes(d)) as WeekdayCode[]) : [];
}

/** The RFC 5545 text of a schedule, shown beside the friendly form. */
export function icalText(rule: string, sendAt: string, timeZone: string): string {
  return `DTSTART;TZID=${timeZone}:${dtstartLocal(sendAt).replace(/[-:]/g, "")}00\nRRULE:${rule}`;
}

export const SEND_AT_PATTERN = /^([01]\d|2[0-3]):[0-5]\d$/;
