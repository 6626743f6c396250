import "server-only";
import { asc, eq, isNull } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { processWindows, processWindowVersions, type ProcessWindowRow } from "../schema/windows";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { fromDbError, notFound } from "@/lib/errors";
import type { WindowCreateInput, WindowUpdateInput } from "@/lib/validation/windows";

const nameTaken = (name: string) => () => `Another process window is already called "${name}".`;

export async function listWindows(db: DbOrTx, { includeArchived = false } = {}) {
  return db.select().from(processWindows).where(includeArchived ? undefined : isNull(processWindows.archivedAt)).orderBy(asc(processWindows.name));
}

export async function getWindow(db: DbOrTx, id: number) {
  const [row] = await db.select().from(processWindows).where(eq(processWindows.id, id)).limit(1);
  return row ?? null;
}

export async function listWindowVersions(db: DbOrTx, windowId: number) {
  return db.select().from(processWindowVersions).where(eq(processWindowVersions.windowId, windowId)).orderBy(asc(processWindowVersions.version));
}

export async function createWindow(db: Db, input: WindowCreateInput, actor: Actor | null): Promise<ProcessWindowRow> {
  try {
    return await db.transaction(async (tx) => {
      const [created] = await tx.insert(processWindows).values({ name: input.name, presetId: input.presetId ?? null, notes: input.notes ?? null, values: input.values, version: 1 }).returning();
      await tx.insert(processWindowVersions).values({ windowId: created.id, version: 1, values: input.values, createdBy: actor?.userId ?? null });
      await recordAudit(tx, { actor, action: "window.create", entity: "process_window", entityId: created.id, after: created });
      return created;
    });
  } catch (err) {
    throw fromDbError(err, nameTaken(input.name)) ?? err;
  }
}

/** Changing the limits makes a new version; past runs keep the values they were judged with. */
export async function updateWindow(db: Db, id: number, patch: WindowUpdateInput, actor: Actor): Promise<ProcessWindowRow> {
  try {
    return await db.transaction(async (tx) => {
      const before = await getWindow(tx, id);
      if (!before) throw notFound("That process window");
      const changed = patch.values !== undefined && JSON.stringify(patch.values) !== JSON.stringify(before.values);
      const version = changed ? before.version + 1 : before.version;
      const [after] = await tx
        .update(processWindows)
        .set({ name: patch.name ?? before.name, notes: patch.notes ?? before.notes, values: patch.values ?? before.values, version, updatedAt: new Date() })
        .where(eq(processWindows.id, id))
        .returning();
      if (changed) await tx.insert(processWindowVersions).values({ windowId: id, version, values: patch.values!, createdBy: actor.userId });
      await recordAudit(tx, { actor, action: "window.update", entity: "process_window", entityId: id, before, after });
      return after;
    });
  } catch (err) {
    throw fromDbError(err, nameTaken(patch.name ?? "")) ?? err;
  }
}

export function windowJson(w: ProcessWindowRow) {
  return { id: w.id, name: w.name, presetId: w.presetId, version: w.version, values: w.values, notes: w.notes, archived: w.archivedAt !== null, updatedAt: w.updatedAt.toISOString() };
}
export type WindowJson = ReturnType<typeof windowJson>;
