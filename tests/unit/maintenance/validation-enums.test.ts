import { describe, expect, it } from "vitest";
import { workOrderFilterSchema, workOrderPatchSchema, workOrderCreateSchema, planCreateSchema, METER_KIND_VALUES } from "@/lib/validation/maintenance";
import { WORK_ORDER_KINDS, WORK_ORDER_STATES } from "@/lib/maintenance/work-order-state";
import { METER_KINDS, PRIORITIES } from "@/db/schema/maintenance";
import { can } from "@/lib/permissions";

// lib/validation imports only zod, so it repeats the enum lists; these checks keep them in step.
describe("maintenance validation enums match the schema and the core", () => {
  it("states, kinds, priorities and meter kinds", () => {
    for (const s of WORK_ORDER_STATES) expect(workOrderPatchSchema.safeParse({ version: 1, state: s }).success).toBe(true);
    expect(workOrderPatchSchema.safeParse({ version: 1, state: "finished" }).success).toBe(false);
    for (const k of WORK_ORDER_KINDS) expect(workOrderFilterSchema.safeParse({ kind: k }).success).toBe(true);
    for (const p of PRIORITIES) expect(workOrderCreateSchema.safeParse({ ovenId: 1, title: "x", priority: p }).success).toBe(true);
    expect([...METER_KIND_VALUES]).toEqual([...METER_KINDS]);
  });
  it("a plan needs exactly one trigger, and a start with an RRULE", () => {
    const base = { ovenIds: [1], title: "t" };
    expect(planCreateSchema.safeParse({ ...base }).success).toBe(false);
    expect(planCreateSchema.safeParse({ ...base, rrule: "FREQ=DAILY" }).success).toBe(false);
    expect(planCreateSchema.safeParse({ ...base, rrule: "FREQ=DAILY", dtstart: "2026-01-01T07:00" }).success).toBe(true);
    expect(planCreateSchema.safeParse({ ...base, rrule: "FREQ=DAILY", dtstart: "2026-01-01T07:00", everyRuns: 5 }).success).toBe(false);
    expect(planCreateSchema.safeParse({ ...base, everyHeaterHours: 500 }).success).toBe(true);
  });
});

describe("maintenance permissions (brief §2)", () => {
  it("technicians do floor work but not plans, assignment or generation", () => {
    expect(can("technician", "workorder.update")).toBe(true);
    expect(can("technician", "meter.record")).toBe(true);
    expect(can("technician", "plan.manage")).toBe(false);
    expect(can("technician", "workorder.assign")).toBe(false);
    expect(can("technician", "maintenance.generate")).toBe(false);
  });
  it("engineers and managers manage plans; only managers assign; managers and admins generate; viewers read", () => {
    expect(can("engineer", "plan.manage") && can("manager", "plan.manage")).toBe(true);
    expect(["viewer", "technician", "engineer", "manager", "admin"].filter((r) => can(r as never, "workorder.assign"))).toEqual(["manager"]);
    expect(["viewer", "technician", "engineer", "manager", "admin"].filter((r) => can(r as never, "maintenance.generate"))).toEqual(["manager", "admin"]);
    expect(can("viewer", "maintenance.read")).toBe(true);
    expect(can("viewer", "workorder.update")).toBe(false);
  });
});
