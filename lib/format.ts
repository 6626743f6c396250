import { TZDate } from "@date-fns/tz";
import { format, formatDistanceStrict } from "date-fns";

/** A date-time in the site's time zone, with the zone's abbreviation, e.g. "2 Dec 2026, 07:30 GMT". */
export function formatDateTime(at: Date, timeZone: string): string {
  const local = new TZDate(at.getTime(), timeZone);
  const zone = new Intl.DateTimeFormat("en-GB", { timeZone, timeZoneName: "short" }).formatToParts(at).find((p) => p.type === "timeZoneName")?.value ?? timeZone;
  return `${format(local, "d MMM yyyy, HH:mm")} ${zone}`;
}

export function formatAgo(at: Date, now = new Date()): string {
  return formatDistanceStrict(at, now, { addSuffix: true });
}
