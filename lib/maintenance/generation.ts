import { expandResolvedOccurrences, type RecurrenceSource } from "./recurrence";
import type { WorkOrderState } from "./work-order-state";

/*
 * Work-order generation from calendar plans. Idempotent by construction: every occurrence has a
 * stable key, the caller stores it with a unique index, and keys already stored are never
 * returned again — so running the generator twice, or after a crash, creates nothing new.
 */

export const DEFAULT_LOOK_AHEAD_DAYS = 14;
const DAY_MS = 86_400_000;
/** One run never returns more than this; the next run continues where it stopped. */
export const MAX_PER_RUN = 500;

export type CalendarPlan = RecurrenceSource & {
  id: string;
  /** Orders are generated this many days ahead of `now` (default 14; whole days of 24 h). */
  lookAheadDays?: number;
  createdAt: Date;
};

export type PlannedOccurrence = { occurrenceKey: string; dueAt: Date; localWallTime: string };

/**
 * `${planId}:${localWallTime}`, e.g. "plan-7:2026-03-23T07:00". The local wall time (what the
 * rule produced, before any gap shift) is used rather than the UTC instant, so an update of the
 * tz database that moves an offset does not re-key — and so duplicate — an occurrence.
 */
export function occurrenceKey(planId: string, localWallTime: string): string {
  return `${planId}:${localWallTime}`;
}

function lookAheadMs(plan: CalendarPlan): number {
  const days = plan.lookAheadDays ?? DEFAULT_LOOK_AHEAD_DAYS;
  if (!Number.isInteger(days) || days < 0 || days > 366) {
    throw new Error(`lookAheadDays must be a whole number of days in 0–366; got ${days}.`);
  }
  return days * DAY_MS;
}

function occurrencesBetween(plan: CalendarPlan, from: Date, to: Date, skip: Set<string>) {
  if (to < from) return [];
  const out: PlannedOccurrence[] = [];
  const seen = new Set(skip);
  for (const occ of expandResolvedOccurrences({ ...plan, from, to, limit: MAX_PER_RUN + skip.size })) {
    const key = occurrenceKey(plan.id, occ.localWallTime);
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ occurrenceKey: key, dueAt: occ.dueAt, localWallTime: occ.localWallTime });
    if (out.length >= MAX_PER_RUN) break;
  }
  return out;
}

/**
 * Occurrences to turn into work orders now: due between the plan's creation and
 * now + look-ahead (inclusive), within the rule's start and UNTIL/COUNT, and not in
 * `existingOccurrenceKeys`. Occurrences due before the plan was created are never generated:
 * a plan entered today with a start date last month must not invent a month of overdue orders.
 * Occurrences between creation and now are generated (overdue) — the generator may have been
 * down, and the work is still owed.
 */
export function planOccurrencesToGenerate(input: {
  plan: CalendarPlan;
  existingOccurrenceKeys: ReadonlySet<string>;
  now: Date;
}): PlannedOccurrence[] {
  const { plan, now } = input;
  const horizon = new Date(now.getTime() + lookAheadMs(plan));
  return occurrencesBetween(plan, plan.createdAt, horizon, new Set(input.existingOccurrenceKeys));
}

export type ExistingOrder = {
  occurrenceKey: string;
  dueAt: Date;
  state: WorkOrderState;
  /** True once anyone edited, assigned, commented on or started the order. */
  touched: boolean;
};

export type RegenerationPlan = {
  /** Future, untouched orders the edited plan no longer produces: cancel them. */
  cancelKeys: string[];
  /** New occurrences to create. */
  create: PlannedOccurrence[];
  /** Untouched orders the edited plan still produces, but at another instant (zone changed). */
  reschedule: { occurrenceKey: string; dueAt: Date }[];
};

/**
 * After a plan's rule, start or zone is edited, which generated orders to replace.
 *
 * Only orders due after `now` that are still open and untouched are replaceable. Everything else
 * stays as it is — past orders are history, and an order someone has touched carries their work.
 * A replaceable order whose key the new plan still produces is kept (or rescheduled if its
 * instant moved), so nothing is cancelled and re-created under the same key. New occurrences are
 * created only after `now` — an edit never back-dates overdue work — and never under a key
 * that any old order (of any state) holds.
 */
export function regenerateAfterPlanEdit(input: {
  oldOrders: readonly ExistingOrder[];
  newPlan: CalendarPlan;
  now: Date;
}): RegenerationPlan {
  const { oldOrders, newPlan, now } = input;
  const replaceable = new Map(
    oldOrders
      .filter((o) => o.dueAt > now && o.state === "open" && !o.touched)
      .map((o) => [o.occurrenceKey, o]),
  );
  const horizon = new Date(now.getTime() + lookAheadMs(newPlan));
  const from = new Date(Math.max(now.getTime() + 1, newPlan.createdAt.getTime()));
  // Look as far as the latest replaceable order, so one generated under a longer look-ahead is
  // not cancelled merely because it lies beyond today's horizon.
  const latest = Math.max(horizon.getTime(), ...[...replaceable.values()].map((o) => o.dueAt.getTime()));
  const wanted = occurrencesBetween(newPlan, from, new Date(latest), new Set());
  const wantedKeys = new Set(wanted.map((o) => o.occurrenceKey));
  const held = new Set(oldOrders.map((o) => o.occurrenceKey));

  const reschedule: RegenerationPlan["reschedule"] = [];
  for (const occ of wanted) {
    const old = replaceable.get(occ.occurrenceKey);
    if (old && old.dueAt.getTime() !== occ.dueAt.getTime()) {
      reschedule.push({ occurrenceKey: occ.occurrenceKey, dueAt: occ.dueAt });
    }
  }
  return {
    cancelKeys: [...replaceable.keys()].filter((k) => !wantedKeys.has(k)),
    create: wanted.filter((o) => !held.has(o.occurrenceKey) && o.dueAt <= horizon),
    reschedule,
  };
}
