import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { actorFor, createTestDb } from "./test-db";
import { createRun } from "@/db/queries/run-create";
import { deleteRun } from "@/db/queries/runs";
import { fleetView } from "@/db/queries/fleet-view";
import { ovenHealth } from "@/db/schema/drift";
import { ovens } from "@/db/schema/fleet";
import { runs } from "@/db/schema/runs";
import type { Actor } from "@/lib/actor";

// The fleet view reads each oven's latest run and 30 days of ΔT from a summary stored with its
// health. These checks hold it to what the runs themselves say, through the real write paths.
const uploads = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-uploads-"));
process.env.UPLOAD_DIR = uploads;

let t: Awaited<ReturnType<typeof createTestDb>>;
let technician: Actor;
let engineer: Actor;
let ovenId: number;

/** The fleet view worked out from the runs (no stored summaries), then the summaries put back. */
async function fleetFromRuns(now: Date) {
  const saved = await t.db.select({ ovenId: ovenHealth.ovenId, runSummary: ovenHealth.runSummary }).from(ovenHealth);
  await t.db.update(ovenHealth).set({ runSummary: null });
  const fleet = await fleetView(t.db, {}, now);
  for (const s of saved) await t.db.update(ovenHealth).set({ runSummary: s.runSummary }).where(eq(ovenHealth.ovenId, s.ovenId));
  return fleet;
}

beforeAll(async () => {
  t = await createTestDb();
  technician = await actorFor(t.db, "technician");
  engineer = await actorFor(t.db, "engineer");
  [{ id: ovenId }] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "L1-RF1"));
});
afterAll(() => {
  t.close();
  fs.rmSync(uploads, { recursive: true, force: true });
});

describe("the fleet view's stored run summaries", () => {
  it("are stored for every oven by the seed and give the same view as reading the runs", async () => {
    const stored = await t.db.select().from(ovenHealth);
    expect(stored.length).toBe(6);
    expect(stored.every((h) => h.runSummary !== null)).toBe(true);
    const now = new Date();
    const fleet = await fleetView(t.db, {}, now);
    expect(fleet.some((o) => o.deltaT.length >= 25)).toBe(true);
    expect(fleet).toEqual(await fleetFromRuns(now));
  });

  it("follow a new upload and its deletion", async () => {
    const bytes = new Uint8Array(fs.readFileSync("tests/fixtures/logger-files/generic-8ch.csv"));
    const before = (await fleetView(t.db, {}, new Date())).find((o) => o.id === ovenId)!;
    const created = await createRun(t.db, ovenId, { runAt: new Date(Date.now() - 60_000) }, { bytes, name: "generic-8ch.csv", mediaType: "text/csv" }, technician);
    const [row] = await t.db.select().from(runs).where(eq(runs.id, created.id));

    const now = new Date();
    const after = (await fleetView(t.db, {}, now)).find((o) => o.id === ovenId)!;
    expect(after.lastRun).toEqual({ id: created.id, runAt: row.runAt.toISOString(), verdict: row.verdictStatus, windowUse: row.windowUse });
    expect(after.deltaT.length).toBe(before.deltaT.length + 1);
    expect(after.deltaT.at(-1)).toEqual({ at: row.runAt.toISOString(), value: row.deltaTPeak });
    expect(await fleetFromRuns(now)).toEqual(await fleetView(t.db, {}, now));

    await deleteRun(t.db, created.id, engineer);
    const again = (await fleetView(t.db, {}, new Date())).find((o) => o.id === ovenId)!;
    expect(again.lastRun).toEqual(before.lastRun);
    expect(again.deltaT).toEqual(before.deltaT);
  });
});
