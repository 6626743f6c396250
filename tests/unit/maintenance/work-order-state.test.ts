import { describe, expect, it } from "vitest";
import {
  assertTransition,
  canTransition,
  checkClose,
  describeUnanswered,
  isFinalState,
  WORK_ORDER_STATES,
  WorkOrderTransitionError,
  type WorkOrderState,
} from "@/lib/maintenance/work-order-state";

/*
 * The full 5 × 5 table, written out by hand from the rules and the documented decisions
 * (in_progress → open allowed; on_hold → done refused; done and cancelled final).
 * Rows: from; columns: open, in_progress, on_hold, done, cancelled.
 */
const TABLE: Record<WorkOrderState, [boolean, boolean, boolean, boolean, boolean]> = {
  open: [false, true, true, true, true],
  in_progress: [true, false, true, true, true],
  on_hold: [true, true, false, false, true],
  done: [false, false, false, false, false],
  cancelled: [false, false, false, false, false],
};

describe("work-order transitions: every pair", () => {
  for (const from of WORK_ORDER_STATES) {
    WORK_ORDER_STATES.forEach((to, i) => {
      const allowed = TABLE[from][i];
      it(`${from} → ${to}: ${allowed ? "allowed" : "refused"}`, () => {
        expect(canTransition(from, to)).toBe(allowed);
        if (allowed) expect(() => assertTransition(from, to)).not.toThrow();
        else expect(() => assertTransition(from, to)).toThrow(WorkOrderTransitionError);
      });
    });
  }

  it("exactly 11 of the 25 pairs are allowed", () => {
    const n = WORK_ORDER_STATES.flatMap((f) => WORK_ORDER_STATES.map((t) => canTransition(f, t))).filter(Boolean).length;
    expect(n).toBe(11);
  });

  it("done and cancelled are final", () => {
    expect(WORK_ORDER_STATES.filter(isFinalState)).toEqual(["done", "cancelled"]);
  });
});

describe("refusal messages", () => {
  const message = (from: WorkOrderState, to: WorkOrderState) => {
    try {
      assertTransition(from, to);
    } catch (e) {
      return e instanceof WorkOrderTransitionError ? { code: e.code, message: e.message, from: e.from, to: e.to } : null;
    }
    return null;
  };
  it("say what cannot happen and why", () => {
    expect(message("done", "in_progress")).toEqual({
      code: "invalid_transition", from: "done", to: "in_progress",
      message: "A work order that is done cannot be moved to in progress; reopen is not allowed. Create a new work order for further work.",
    });
    expect(message("cancelled", "open")?.message).toBe(
      "A work order that is cancelled cannot be moved to open; a cancelled order is final. Create a new work order instead.",
    );
    expect(message("on_hold", "done")?.message).toBe("A work order that is on hold cannot be moved to done; resume it (in progress) first.");
    expect(message("open", "open")?.message).toBe("The work order is already open.");
    expect(message("open" as WorkOrderState, "closed" as WorkOrderState)?.message).toBe('"closed" is not a work-order state.');
  });
});

describe("checkClose", () => {
  const checklist = [
    { id: "vents", label: "Exhaust vents cleaned", mandatory: true },
    { id: "traps", label: "Condensation traps emptied", mandatory: true },
    { id: "filters", label: "Filters checked", mandatory: true },
    { id: "notes", label: "Findings noted", mandatory: false },
  ];
  it("names mandatory items with no answer (missing or null), in checklist order", () => {
    const missing = checkClose({ checklist, results: { vents: { ok: true }, traps: { ok: null }, notes: { ok: null } } });
    expect(missing).toEqual([
      { id: "traps", label: "Condensation traps emptied" },
      { id: "filters", label: "Filters checked" },
    ]);
    expect(describeUnanswered(missing)).toBe("2 mandatory checklist items are unanswered: “Condensation traps emptied”, “Filters checked”.");
  });
  it("an item answered 'not OK' counts as answered; all answered → nothing missing", () => {
    const missing = checkClose({ checklist, results: { vents: { ok: true }, traps: { ok: false, note: "Trap cracked" }, filters: { ok: true } } });
    expect(missing).toEqual([]);
    expect(describeUnanswered(missing)).toBeNull();
  });
});
