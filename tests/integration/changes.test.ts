import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { actorFor, createTestDb } from "./test-db";
import { attachmentsFor, createChange, currentConfiguration, listChanges } from "@/db/queries/changes";
import { changeCreateSchema } from "@/lib/validation/change";
import { ovens } from "@/db/schema/fleet";
import { auditLog } from "@/db/schema/audit";

let t: Awaited<ReturnType<typeof createTestDb>>;
let ovenId = 0;
beforeAll(async () => {
  t = await createTestDb();
  [{ id: ovenId }] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "LAB-B2")); // the demo logs no change on LAB-B2
});
afterAll(() => t.close());

const input = (v: Record<string, unknown>) => changeCreateSchema.parse(v);

describe("the modification log", () => {
  it("derives the current configuration as the latest value per area, in time order", async () => {
    const engineer = await actorFor(t.db, "engineer");
    // Logged out of order on purpose: the later change wins whatever the insertion order.
    await createChange(t.db, ovenId, input({ at: "2026-05-10T09:00:00Z", area: "fan", summary: "Fan re-shaped", before: "added fan", after: "re-shaped fan, 55 mm" }), engineer);
    await createChange(t.db, ovenId, input({ at: "2026-03-01T09:00:00Z", area: "fan", summary: "Circulation fan added", before: "none", after: "added fan" }), engineer);
    await createChange(t.db, ovenId, input({ at: "2026-01-15T09:00:00Z", area: "baffle", summary: "Baffle plate fitted", after: "baffle plate A" }), engineer);
    const config = await currentConfiguration(t.db, ovenId);
    expect(config.map((c) => [c.area, c.after])).toEqual([
      ["baffle", "baffle plate A"],
      ["fan", "re-shaped fan, 55 mm"],
    ]);
    const listed = await listChanges(t.db, { ovenId, area: "fan" });
    expect(listed.map((r) => r.change.summary)).toEqual(["Fan re-shaped", "Circulation fan added"]);
  });

  it("audits every change with the engineer who logged it", async () => {
    const rows = await t.db.select().from(auditLog).where(eq(auditLog.action, "change.create"));
    expect(rows.length).toBeGreaterThanOrEqual(3);
    const engineer = await actorFor(t.db, "engineer");
    expect(rows.every((r) => r.actorUserId === engineer.userId)).toBe(true);
  });

  it("refuses a change dated in the future and one without an after value, naming the field", () => {
    const future = changeCreateSchema.safeParse({ at: new Date(Date.now() + 86_400_000).toISOString(), area: "fan", summary: "Later", after: "x" });
    expect(future.success).toBe(false);
    expect(future.error!.issues[0].path).toEqual(["at"]);
    const noAfter = changeCreateSchema.safeParse({ at: "2026-01-01T00:00:00Z", area: "fan", summary: "Nothing after" });
    expect(noAfter.error!.issues.map((i) => i.path[0])).toEqual(["after"]);
  });

  it("refuses a change to an oven that does not exist, and writes nothing", async () => {
    const engineer = await actorFor(t.db, "engineer");
    const before = (await listChanges(t.db)).length;
    await expect(createChange(t.db, 999999, input({ at: "2026-01-01T00:00:00Z", area: "fan", summary: "Ghost", after: "x" }), engineer)).rejects.toThrow(/not found/);
    expect((await listChanges(t.db)).length).toBe(before);
  });
});

describe("photos and documents of a change", () => {
  it("stores a photo with the change, and refuses a file that is not an image or PDF without writing the change", async () => {
    const fs = await import("node:fs");
    const engineer = await actorFor(t.db, "engineer");
    const png = new Uint8Array(fs.readFileSync("tests/fixtures/checklist-photo.png"));
    const row = await createChange(t.db, ovenId, input({ at: "2026-06-01T09:00:00Z", area: "exhaust", summary: "Exhaust duct cleaned", after: "clean duct" }), engineer, [{ name: "duct.png", bytes: png }]);
    const files = await attachmentsFor(t.db, [row.id]);
    expect(files.map((f) => [f.fileName, f.contentType, f.sizeBytes])).toEqual([["duct.png", "image/png", png.byteLength]]);
    const before = (await listChanges(t.db)).length;
    // A script renamed to .png is still text: checked by content, not by name (OWASP file-upload guidance).
    await expect(
      createChange(t.db, ovenId, input({ at: "2026-06-02T09:00:00Z", area: "exhaust", summary: "Sneaky", after: "x" }), engineer, [{ name: "photo.png", bytes: new TextEncoder().encode("#!/bin/sh\nrm -rf /\n") }]),
    ).rejects.toMatchObject({ code: "unsupported_file" });
    expect((await listChanges(t.db)).length).toBe(before);
  });
});
