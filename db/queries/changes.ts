import "server-only";
import { and, asc, desc, eq, gte, inArray, lte, type SQL } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { changeAttachments, changes, type ChangeRow } from "../schema/changes";
import { storeSniffedUpload } from "@/lib/uploads/store";
import { ovens } from "../schema/fleet";
import { users } from "../schema/users";
import { recordAudit } from "./audit";
import { requireOven } from "./ovens";
import type { Actor } from "@/lib/actor";
import { notFound } from "@/lib/errors";
import type { ChangeCreateInput, ChangeFilter } from "@/lib/validation/change";

type Upload = { name: string; bytes: Uint8Array };

/** Logs a change with its photos and documents; a refused file stops it before anything is written. */
export async function createChange(db: Db, ovenId: number, input: ChangeCreateInput, actor: Actor, files: Upload[] = []): Promise<ChangeRow> {
  // An unknown oven is refused before any file is stored, so a 404 leaves no bytes behind.
  await requireOven(db, ovenId);
  const stored: Awaited<ReturnType<typeof storeSniffedUpload>>[] = [];
  for (const f of files) stored.push(await storeSniffedUpload(f));
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(changes)
      .values({ ovenId, at: input.at, area: input.area, summary: input.summary, before: input.before ?? null, after: input.after, reason: input.reason ?? null, workOrderId: input.workOrderId ?? null, createdBy: actor.userId })
      .returning();
    for (const f of stored) await tx.insert(changeAttachments).values({ changeId: row.id, ...f, uploadedBy: actor.userId });
    await recordAudit(tx, { actor, action: "change.create", entity: "oven_change", entityId: row.id, after: { ...row, attachments: stored.map((f) => f.fileName) } });
    return row;
  });
}

export async function listChanges(db: DbOrTx, filter: ChangeFilter & { limit?: number } = {}) {
  const where: SQL[] = [];
  if (filter.ovenId) where.push(eq(changes.ovenId, filter.ovenId));
  if (filter.area) where.push(eq(changes.area, filter.area));
  if (filter.from) where.push(gte(changes.at, filter.from));
  if (filter.to) where.push(lte(changes.at, filter.to));
  return db
    .select({ change: changes, oven: { id: ovens.id, tag: ovens.tag }, author: { name: users.name, email: users.email } })
    .from(changes)
    .innerJoin(ovens, eq(ovens.id, changes.ovenId))
    .leftJoin(users, eq(users.id, changes.createdBy))
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(changes.at), desc(changes.id))
    .limit(filter.limit ?? 500);
}
export type ChangeListRow = Awaited<ReturnType<typeof listChanges>>[number];

/** The oven's current configuration: the latest `after` value in each area, in time order. */
export async function currentConfiguration(db: DbOrTx, ovenId: number) {
  const rows = await db.select().from(changes).where(eq(changes.ovenId, ovenId)).orderBy(asc(changes.at), asc(changes.id));
  const latest = new Map<string, ChangeRow>();
  for (const r of rows) latest.set(r.area, r);
  return [...latest.values()].sort((a, b) => a.area.localeCompare(b.area));
}

export function changeJson(row: ChangeListRow) {
  const c = row.change;
  return {
    id: c.id,
    ovenId: c.ovenId,
    ovenTag: row.oven.tag,
    at: c.at.toISOString(),
    area: c.area,
    summary: c.summary,
    before: c.before,
    after: c.after,
    reason: c.reason,
    workOrderId: c.workOrderId,
    by: row.author?.name ?? row.author?.email ?? null,
  };
}
export type ChangeJson = ReturnType<typeof changeJson>;

export async function addChangeAttachment(db: Db, changeId: number, file: Upload, actor: Actor) {
  const [c] = await db.select({ id: changes.id }).from(changes).where(eq(changes.id, changeId));
  if (!c) throw notFound("That change");
  const f = await storeSniffedUpload(file);
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(changeAttachments).values({ changeId, ...f, uploadedBy: actor.userId }).returning();
    await recordAudit(tx, { actor, action: "change.attach", entity: "oven_change", entityId: changeId, after: row });
    return { id: row.id, fileName: row.fileName, contentType: row.contentType, sizeBytes: row.sizeBytes };
  });
}

export async function attachmentsFor(db: DbOrTx, changeIds: number[]) {
  if (!changeIds.length) return [];
  return db.select().from(changeAttachments).where(inArray(changeAttachments.changeId, changeIds));
}

export async function getChangeAttachment(db: DbOrTx, id: number) {
  const [row] = await db.select().from(changeAttachments).where(eq(changeAttachments.id, id));
  return row ?? null;
}
