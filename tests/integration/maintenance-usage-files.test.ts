import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { actorFor, createTestDb } from "./test-db";
import { ovens } from "@/db/schema/fleet";
import { meterReadings, workOrders } from "@/db/schema/maintenance";
import { createPlans } from "@/db/queries/plans";
import { generateWorkOrders } from "@/db/queries/work-order-generation";
import { addAttachment, addComment } from "@/db/queries/work-order-extras";
import { createWorkOrder } from "@/db/queries/work-orders";

// Heater-hour plans from meter readings, and uploads, against a real database and a temp upload dir.
const uploads = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-uploads-"));
process.env.UPLOAD_DIR = uploads;
let t: Awaited<ReturnType<typeof createTestDb>>;
let ovenId = 0;
beforeAll(async () => {
  t = await createTestDb();
  const [o] = await t.db.insert(ovens).values({ tag: "USE-1", name: "usage test", lineId: (await t.db.select().from(ovens).limit(1))[0].lineId, kind: "convection" }).returning();
  ovenId = o.id;
});
afterAll(() => {
  t.close();
  fs.rmSync(uploads, { recursive: true, force: true });
});

describe("heater-hour plans", () => {
  it("create one order per 500 h threshold crossed, once", async () => {
    const engineer = await actorFor(t.db, "engineer");
    const [plan] = await createPlans(t.db, { ovenIds: [ovenId], title: "Blower check every 500 h", instructions: "", kind: "preventive", checklist: [], safetyLockout: true, everyHeaterHours: 500, lookAheadDays: 14 }, engineer);
    // Readings 1000 → 1300 → 1620 → 2110 h: since the first reading (the baseline) that is 0, 300, 620, 1110 h,
    // crossing 500 h (at the 1620 h reading) and 1000 h (at the 2110 h reading) — two orders (hand-worked).
    const day = (n: number) => new Date(Date.UTC(2026, 10, n, 8));
    await t.db.insert(meterReadings).values([1000, 1300, 1620, 2110].map((value, i) => ({ ovenId, kind: "heater_hours" as const, value, at: day(1 + i * 7) })));
    const manager = await actorFor(t.db, "manager");
    await generateWorkOrders(t.db, { now: day(25), actor: manager });
    await generateWorkOrders(t.db, { now: day(25), actor: manager });
    const rows = await t.db.select().from(workOrders).where(eq(workOrders.planId, plan.id));
    expect(rows.map((r) => r.occurrenceKey).sort()).toEqual([`${plan.id}:hours:1000`, `${plan.id}:hours:500`]);
    expect(rows.find((r) => r.occurrenceKey!.endsWith(":500"))!.dueAt).toEqual(day(15));
  });
});

describe("attachments and comments", () => {
  it("stores a PNG under its SHA-256 and refuses what is not a photo or PDF", async () => {
    const tech = await actorFor(t.db, "technician");
    const order = await createWorkOrder(t.db, { ovenId, title: "Photo test", kind: "corrective", priority: "normal", breakdown: false }, tech);
    const png = fs.readFileSync("tests/fixtures/checklist-photo.png");
    const saved = await addAttachment(t.db, order.id, { name: "photo.png", bytes: png }, tech);
    expect(saved.contentType).toBe("image/png");
    expect(fs.readFileSync(path.join(uploads, saved.sha256.slice(0, 2), saved.sha256))).toEqual(png);
    // Claimed to be a JPEG by its name, but an SVG by its content.
    await expect(addAttachment(t.db, order.id, { name: "x.jpg", bytes: new TextEncoder().encode("<svg/>") }, tech)).rejects.toMatchObject({ code: "unsupported_file", status: 415 });
    const big = new Uint8Array(10 * 1024 * 1024 + 1);
    big.set(png.subarray(0, 8));
    await expect(addAttachment(t.db, order.id, { name: "big.png", bytes: big }, tech)).rejects.toMatchObject({ code: "file_too_large", status: 413 });
  });

  it("resolves @mentions to user ids", async () => {
    const tech = await actorFor(t.db, "technician");
    const engineer = await actorFor(t.db, "engineer");
    const order = await createWorkOrder(t.db, { ovenId, title: "Mention test", kind: "corrective", priority: "normal", breakdown: false }, tech);
    const c = await addComment(t.db, order.id, "Bearing noisy — @priya can you look?", tech);
    expect(c.mentions).toEqual([engineer.userId]);
  });
});
