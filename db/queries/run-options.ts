import "server-only";
import { asc } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { ovens } from "../schema/fleet";
import { instruments } from "../schema/instruments";
import { processWindows, testBoards } from "../schema/windows";

/** The choices the runs filters and the upload wizard offer. */
export async function runChoices(db: DbOrTx) {
  const [o, w, i, b] = await Promise.all([
    db.select({ id: ovens.id, tag: ovens.tag }).from(ovens).orderBy(asc(ovens.tag)),
    db.select({ id: processWindows.id, name: processWindows.name, version: processWindows.version }).from(processWindows).orderBy(asc(processWindows.name)),
    db.select({ id: instruments.id, name: instruments.name, serial: instruments.serial, kind: instruments.kind }).from(instruments).orderBy(asc(instruments.name)),
    db.select({ id: testBoards.id, name: testBoards.name, probes: testBoards.probes }).from(testBoards).orderBy(asc(testBoards.name)),
  ]);
  return {
    ovens: o.map((x) => ({ id: x.id, label: x.tag })),
    windows: w.map((x) => ({ id: x.id, label: x.name })),
    instruments: i.map((x) => ({ id: x.id, label: `${x.name} (${x.serial})`, kind: x.kind })),
    boards: b.map((x) => ({ id: x.id, label: x.name, probes: x.probes })),
  };
}
