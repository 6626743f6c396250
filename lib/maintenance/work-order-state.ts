/*
 * Work-order kinds, states and the transitions between states.
 *
 * Decisions beyond the list:
 * - in_progress → open is allowed: it hands the work back to the queue (started by mistake, or
 *   the technician has to leave it for someone else). The order stays "touched", so a plan edit
 *   never replaces it.
 * - on_hold → done is not allowed: resume (in progress) first, so a hold is always ended
 *   deliberately. open → done is allowed for quick tasks recorded after the fact.
 * - done and cancelled are final. A wrong close is corrected by a new order, so the record an
 *   auditor sees is never rewritten.
 */

export const WORK_ORDER_STATES = ["open", "in_progress", "on_hold", "done", "cancelled"] as const;
export type WorkOrderState = (typeof WORK_ORDER_STATES)[number];

export const WORK_ORDER_KINDS = ["preventive", "corrective", "calibration", "drift_investigation"] as const;
export type WorkOrderKind = (typeof WORK_ORDER_KINDS)[number];

export const STATE_LABELS: Record<WorkOrderState, string> = {
  open: "open",
  in_progress: "in progress",
  on_hold: "on hold",
  done: "done",
  cancelled: "cancelled",
};

export const KIND_LABELS: Record<WorkOrderKind, string> = {
  preventive: "Preventive",
  corrective: "Corrective",
  calibration: "Calibration",
  drift_investigation: "Drift investigation",
};

const ALLOWED: Record<WorkOrderState, readonly WorkOrderState[]> = {
  open: ["in_progress", "on_hold", "cancelled", "done"],
  in_progress: ["on_hold", "done", "cancelled", "open"],
  on_hold: ["in_progress", "cancelled", "open"],
  done: [],
  cancelled: [],
};

/** States reachable from `from` in one step. */
export function nextStates(from: WorkOrderState): readonly WorkOrderState[] {
  return ALLOWED[from];
}

export function canTransition(from: WorkOrderState, to: WorkOrderState): boolean {
  return ALLOWED[from]?.includes(to) ?? false;
}

export function isFinalState(state: WorkOrderState): boolean {
  return ALLOWED[state].length === 0;
}

/** Unfinished work: open, in progress or on hold. Counts toward the backlog. */
export function isOpenState(state: WorkOrderState): boolean {
  return state === "open" || state === "in_progress" || state === "on_hold";
}

export class WorkOrderTransitionError extends Error {
  readonly code = "invalid_transition";
  constructor(
    readonly from: WorkOrderState,
    readonly to: WorkOrderState,
    message: string,
  ) {
    super(message);
  }
}

/** Why a transition is refused, in words for the person who tried it; null when allowed. */
export function transitionRefusal(from: WorkOrderState, to: WorkOrderState): string | null {
  if (!(from in ALLOWED)) return `"${from}" is not a work-order state.`;
  if (!(to in ALLOWED)) return `"${to}" is not a work-order state.`;
  if (canTransition(from, to)) return null;
  const f = STATE_LABELS[from];
  const t = STATE_LABELS[to];
  if (from === to) return `The work order is already ${f}.`;
  if (from === "done") {
    return `A work order that is done cannot be moved to ${t}; reopen is not allowed. Create a new work order for further work.`;
  }
  if (from === "cancelled") {
    return `A work order that is cancelled cannot be moved to ${t}; a cancelled order is final. Create a new work order instead.`;
  }
  if (from === "on_hold" && to === "done") {
    return "A work order that is on hold cannot be moved to done; resume it (in progress) first.";
  }
  return `A work order that is ${f} cannot be moved to ${t}.`;
}

export function assertTransition(from: WorkOrderState, to: WorkOrderState): void {
  const refusal = transitionRefusal(from, to);
  if (refusal !== null) throw new WorkOrderTransitionError(from, to, refusal);
}

export type ChecklistItem = { id: string; label: string; mandatory: boolean };
export type ChecklistResult = { ok: boolean | null; note?: string };

/**
 * Mandatory checklist items that have no answer (missing, or ok = null), in checklist order.
 * An item answered "not OK" (ok = false) is answered: the failure is recorded, not hidden, and
 * the order may still close (a corrective order follows).
 */
export function checkClose(input: {
  checklist: readonly ChecklistItem[];
  results: Readonly<Record<string, ChecklistResult | undefined>>;
}): { id: string; label: string }[] {
  return input.checklist
    .filter((item) => item.mandatory)
    .filter((item) => {
      const r = input.results[item.id];
      return r === undefined || r === null || r.ok === null || r.ok === undefined;
    })
    .map(({ id, label }) => ({ id, label }));
}

/** "2 mandatory checklist items are unanswered: “A”, “B”." or null when none. */
export function describeUnanswered(items: readonly { label: string }[]): string | null {
  if (items.length === 0) return null;
  const names = items.map((i) => `“${i.label}”`).join(", ");
  return items.length === 1
    ? `1 mandatory checklist item is unanswered: ${names}.`
    : `${items.length} mandatory checklist items are unanswered: ${names}.`;
}
