import { describe, expect, it } from "vitest";
import { can, PERMISSIONS, ROLE_PERMISSIONS } from "@/lib/permissions";
import { ROLES } from "@/db/schema/users";

describe("ROLE_PERMISSIONS (brief, section 2)", () => {
  it("a viewer only reads (and chooses their own e-mails)", () => {
    expect(ROLE_PERMISSIONS.viewer.every((p) => p.endsWith(".read") || p === "profile.analyze" || p === "subscription.manage.own")).toBe(true);
  });
  it("everyone manages their own e-mails; managers (and admins) the team's; only admins the outbox", () => {
    expect(ROLES.filter((r) => can(r, "subscription.manage.own"))).toEqual([...ROLES]);
    expect(ROLES.filter((r) => can(r, "subscription.manage.team"))).toEqual(["manager", "admin"]);
    expect(ROLES.filter((r) => can(r, "outbox.manage"))).toEqual(["admin"]);
  });
  it("a technician may not edit the registry; an engineer may", () => {
    expect(can("technician", "oven.create")).toBe(false);
    expect(can("engineer", "oven.create")).toBe(true);
    expect(can("engineer", "oven.update")).toBe(true);
  });
  it("only an admin retires ovens, manages people, sites and tokens", () => {
    for (const p of ["oven.retire", "user.manage", "site.manage", "token.manage", "mail.sink.read"] as const) {
      expect(ROLES.filter((r) => can(r, p))).toEqual(["admin"]);
    }
  });
  it("every permission named in the table exists", () => {
    for (const r of ROLES) for (const p of ROLE_PERMISSIONS[r]) expect(PERMISSIONS).toContain(p);
  });
});
