import type { Role } from "@/db/schema/users";

// The one table of who may do what. Every server action and route handler names one of these.
export const PERMISSIONS = [
  "fleet.read",
  "oven.read",
  "oven.create",
  "oven.update",
  "oven.retire",
  "site.manage",
  "user.manage",
  "token.manage",
  "audit.read",
  "profile.analyze",
  "mail.sink.read",
  "change.read",
  "change.create",
  "subscription.manage.own",
  "subscription.manage.team",
  "outbox.manage",
  "run.read",
  "run.create",
  "run.rejudge",
  "run.delete",
  "window.manage",
  "board.manage",
  "instrument.manage",
  "maintenance.read",
  "workorder.update",
  "workorder.create",
  "workorder.assign",
  "meter.record",
  "plan.manage",
  "maintenance.generate",
  "alert.read",
  "alert.acknowledge",
  "baseline.manage",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const READ: Permission[] = ["fleet.read", "oven.read", "profile.analyze", "change.read", "subscription.manage.own", "run.read", "maintenance.read", "alert.read"];
// Engineers look after the measurement: windows, boards, instruments, calibrations, re-judging and deleting runs.
const MEASUREMENT: Permission[] = ["run.create", "run.rejudge", "run.delete", "window.manage", "board.manage", "instrument.manage"];
// Floor work on orders and meters: technicians, and everyone above them on the shop floor.
const FLOOR: Permission[] = ["workorder.update", "workorder.create", "meter.record", "alert.acknowledge"];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  viewer: READ,
  technician: [...READ, ...FLOOR, "run.create"],
  engineer: [...READ, ...FLOOR, ...MEASUREMENT, "oven.create", "oven.update", "change.create", "plan.manage", "baseline.manage"],
  manager: [...READ, ...FLOOR, ...MEASUREMENT, "oven.create", "oven.update", "audit.read", "subscription.manage.team", "plan.manage", "workorder.assign", "maintenance.generate"],
  admin: [...READ, ...MEASUREMENT, "oven.create", "oven.update", "oven.retire", "site.manage", "user.manage", "token.manage", "audit.read", "mail.sink.read", "subscription.manage.team", "outbox.manage", "maintenance.generate"],
};

export function can(role: Role, permission: Permission): boolean {
  return ROLE_PERMISSIONS[role].includes(permission);
}

export const ROLE_LABELS: Record<Role, string> = {
  viewer: "Viewer",
  technician: "Technician",
  engineer: "Engineer",
  manager: "Manager",
  admin: "Admin",
};
