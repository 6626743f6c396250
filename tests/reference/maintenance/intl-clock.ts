/*
 * A second, independent reading of the tz database: Node's Intl.DateTimeFormat (ICU's copy of
 * the IANA tz data). Nothing here uses rrule, @date-fns/tz or lib/maintenance, so the tests can
 * check our expansion against it.
 */

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-GB", {
      timeZone,
      hourCycle: "h23",
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      second: "2-digit",
      weekday: "short",
    });
    formatters.set(timeZone, f);
  }
  return f;
}

export type IntlWall = { date: string; time: string; weekday: string; offsetMinutes: number };

/** The wall clock at `instant` in `timeZone`, per Intl. */
export function intlWall(instant: Date, timeZone: string): IntlWall {
  const parts = Object.fromEntries(
    formatter(timeZone).formatToParts(instant).map((p) => [p.type, p.value]),
  ) as Record<string, string>;
  const date = `${parts.year}-${parts.month}-${parts.day}`;
  const time = `${parts.hour}:${parts.minute}`;
  const asUtc = Date.UTC(+parts.year, +parts.month - 1, +parts.day, +parts.hour, +parts.minute, +parts.second);
  const offsetMinutes = Math.round((asUtc - Math.floor(instant.getTime() / 1000) * 1000) / 60_000);
  return { date, time, weekday: parts.weekday, offsetMinutes };
}

/**
 * Instants in [from, to) at which the zone's UTC offset changes, found by a daily scan and a
 * minute-resolution bisection — purely from Intl.
 */
export function intlOffsetChanges(
  timeZone: string,
  from: Date,
  to: Date,
): { at: Date; fromOffset: number; toOffset: number }[] {
  const out: { at: Date; fromOffset: number; toOffset: number }[] = [];
  const step = 86_400_000;
  for (let t = from.getTime(); t < to.getTime(); t += step) {
    const a = intlWall(new Date(t), timeZone).offsetMinutes;
    const b = intlWall(new Date(t + step), timeZone).offsetMinutes;
    if (a === b) continue;
    let lo = t;
    let hi = t + step;
    while (hi - lo > 60_000) {
      const mid = lo + Math.floor((hi - lo) / 120_000) * 60_000;
      if (intlWall(new Date(mid), timeZone).offsetMinutes === a) lo = mid;
      else hi = mid;
    }
    out.push({ at: new Date(hi), fromOffset: a, toOffset: b });
  }
  return out;
}
