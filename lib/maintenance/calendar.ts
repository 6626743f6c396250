import { occurrenceKey, type CalendarPlan } from "./generation";
import { expandResolvedOccurrences } from "./recurrence";
import { formatWallMs, instantToWallMs, localDateKey } from "./wall-time";
import type { WorkOrderState } from "./work-order-state";

/*
 * The maintenance calendar: for each day on the site's calendar, the work orders that exist
 * ("planned") and the occurrences the generator has not reached yet ("forecast"), so the
 * coming weeks are visible beyond the look-ahead window.
 */

const DAY_MS = 86_400_000;
const MAX_DAYS = 400;

export type CalendarPlanInput = CalendarPlan & { title: string; ovenId?: string | null };

export type CalendarOrder = {
  id: string;
  title: string;
  dueAt: Date;
  state: WorkOrderState;
  planId?: string | null;
  occurrenceKey?: string | null;
  ovenId?: string | null;
};

/** A usage-triggered plan's expected next due date (from usage-triggers.ts forecasts). */
export type UsageForecastInput = {
  planId: string;
  title: string;
  occurrenceKey: string;
  at: Date;
  ovenId?: string | null;
};

export type PlannedEntry = {
  type: "planned";
  orderId: string;
  title: string;
  dueAt: Date;
  /** "HH:mm" on the site's clock. */
  localTime: string;
  state: WorkOrderState;
  planId: string | null;
  ovenId: string | null;
};

export type ForecastEntry = {
  type: "forecast";
  basis: "calendar" | "usage";
  planId: string;
  occurrenceKey: string;
  title: string;
  dueAt: Date;
  localTime: string;
  ovenId: string | null;
};

export type CalendarDay = { date: string; planned: PlannedEntry[]; forecast: ForecastEntry[] };

function localTime(instant: Date, timeZone: string): string {
  return formatWallMs(instantToWallMs(instant, timeZone)).slice(11, 16);
}

/**
 * Days from the local date of `from` through the local date just before `to`, each with its
 * entries (earliest first). Planned: existing orders due in [from, to), cancelled ones left out.
 * Forecast: plan occurrences due in [max(from, now, plan created), to) with no order under their
 * key (a cancelled order's key also suppresses its forecast: that occurrence was dealt with).
 */
export function forecastCalendar(input: {
  plans: readonly CalendarPlanInput[];
  existingOrders: readonly CalendarOrder[];
  usageForecasts?: readonly UsageForecastInput[];
  from: Date;
  to: Date;
  now: Date;
  /** The site's zone, which decides the day an entry falls on. */
  timeZone: string;
}): CalendarDay[] {
  const { from, to, now, timeZone } = input;
  if (!(to > from)) throw new Error("The calendar range must end after it starts.");
  const days = new Map<string, CalendarDay>();
  const firstWall = Date.parse(`${localDateKey(from, timeZone)}T00:00:00Z`);
  const lastWall = Date.parse(`${localDateKey(new Date(to.getTime() - 1), timeZone)}T00:00:00Z`);
  if ((lastWall - firstWall) / DAY_MS >= MAX_DAYS) throw new Error(`The calendar shows at most ${MAX_DAYS} days.`);
  for (let wall = firstWall; wall <= lastWall; wall += DAY_MS) {
    const date = new Date(wall).toISOString().slice(0, 10);
    days.set(date, { date, planned: [], forecast: [] });
  }
  const inRange = (d: Date) => d >= from && d < to;
  const dayOf = (d: Date) => days.get(localDateKey(d, timeZone))!;

  const takenKeys = new Set(input.existingOrders.flatMap((o) => (o.occurrenceKey ? [o.occurrenceKey] : [])));
  for (const o of input.existingOrders) {
    if (o.state === "cancelled" || !inRange(o.dueAt)) continue;
    dayOf(o.dueAt).planned.push({
      type: "planned", orderId: o.id, title: o.title, dueAt: o.dueAt, localTime: localTime(o.dueAt, timeZone),
      state: o.state, planId: o.planId ?? null, ovenId: o.ovenId ?? null,
    });
  }

  for (const plan of input.plans) {
    const start = new Date(Math.max(from.getTime(), now.getTime(), plan.createdAt.getTime()));
    if (!(start < to)) continue;
    for (const occ of expandResolvedOccurrences({ ...plan, from: start, to })) {
      const key = occurrenceKey(plan.id, occ.localWallTime);
      if (takenKeys.has(key) || !inRange(occ.dueAt)) continue;
      dayOf(occ.dueAt).forecast.push({
        type: "forecast", basis: "calendar", planId: plan.id, occurrenceKey: key, title: plan.title,
        dueAt: occ.dueAt, localTime: localTime(occ.dueAt, timeZone), ovenId: plan.ovenId ?? null,
      });
    }
  }

  for (const f of input.usageForecasts ?? []) {
    if (takenKeys.has(f.occurrenceKey) || !inRange(f.at)) continue;
    dayOf(f.at).forecast.push({
      type: "forecast", basis: "usage", planId: f.planId, occurrenceKey: f.occurrenceKey, title: f.title,
      dueAt: f.at, localTime: localTime(f.at, timeZone), ovenId: f.ovenId ?? null,
    });
  }

  const byTime = (a: { dueAt: Date }, b: { dueAt: Date }) => a.dueAt.getTime() - b.dueAt.getTime();
  return [...days.values()].map((d) => ({ ...d, planned: d.planned.sort(byTime), forecast: d.forecast.sort(byTime) }));
}
