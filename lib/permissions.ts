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
  "maintenance.read",
  "workorder.update",
  "workorder.create",
  "workorder.assign",
  "meter.record",
  "plan.manage",
  "maintenance.generate",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const READ: Permission[] = ["fleet.read", "oven.read", "profile.analyze", "maintenance.read"];
// Floor work on orders and meters: technicians, and everyone above them on the shop floor.
const FLOOR: Permission[] = ["workorder.update", "workorder.create", "meter.record"];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  viewer: READ,
  technician: [...READ, ...FLOOR],
  engineer: [...READ, ...FLOOR, "oven.create", "oven.update", "plan.manage"],
  manager: [...READ, ...FLOOR, "oven.create", "oven.update", "audit.read", "plan.manage", "workorder.assign", "maintenance.generate"],
  admin: [...READ, "oven.create", "oven.update", "oven.retire", "site.manage", "user.manage", "token.manage", "audit.read", "mail.sink.read", "maintenance.generate"],
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
