import "server-only";
import { asc, eq, sql } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { users } from "../schema/users";
import { workOrderAttachments, workOrderComments, workOrders } from "../schema/maintenance";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, notFound } from "@/lib/errors";
import { parseMentions } from "@/lib/maintenance/mentions";
import { storeSniffedUpload } from "@/lib/uploads/store";

// Photos, documents and comments on a work order. Each marks the order as touched.

async function assertOrder(db: DbOrTx, id: number) {
  const [o] = await db.select({ id: workOrders.id }).from(workOrders).where(eq(workOrders.id, id)).limit(1);
  if (!o) throw notFound("That work order");
}

/** Stores the bytes under their SHA-256 (the same photo twice is stored once). */
export async function addAttachment(db: Db, workOrderId: number, file: { name: string; bytes: Uint8Array }, actor: Actor) {
  await assertOrder(db, workOrderId);
  const { sha256, fileName, contentType, sizeBytes } = await storeSniffedUpload(file);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(workOrderAttachments)
      .values({ workOrderId, sha256, fileName, contentType, sizeBytes, uploadedById: actor.userId })
      .returning();
    await tx.update(workOrders).set({ touched: true }).where(eq(workOrders.id, workOrderId));
    await recordAudit(tx, { actor, action: "workorder.attach", entity: "work_order", entityId: workOrderId, after: row });
    return { id: row.id, fileName: row.fileName, contentType: row.contentType, sizeBytes: row.sizeBytes, sha256 };
  });
}

export async function listAttachments(db: DbOrTx, workOrderId: number) {
  return db.select().from(workOrderAttachments).where(eq(workOrderAttachments.workOrderId, workOrderId)).orderBy(asc(workOrderAttachments.id));
}

export async function getAttachment(db: DbOrTx, id: number) {
  const [row] = await db.select().from(workOrderAttachments).where(eq(workOrderAttachments.id, id)).limit(1);
  return row ?? null;
}

export async function addComment(db: Db, workOrderId: number, body: string, actor: Actor) {
  await assertOrder(db, workOrderId);
  const people = await db.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.active, true));
  const mentions = parseMentions(body, people);
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(workOrderComments).values({ workOrderId, authorId: actor.userId, body, mentions }).returning();
    await tx.update(workOrders).set({ touched: true }).where(eq(workOrders.id, workOrderId));
    await recordAudit(tx, { actor, action: "workorder.comment", entity: "work_order", entityId: workOrderId, after: row });
    return { id: row.id, body: row.body, mentions, createdAt: row.createdAt.toISOString() };
  });
}

export async function listComments(db: DbOrTx, workOrderId: number) {
  return db
    .select({ comment: workOrderComments, authorName: users.name })
    .from(workOrderComments)
    .leftJoin(users, eq(users.id, workOrderComments.authorId))
    .where(eq(workOrderComments.workOrderId, workOrderId))
    .orderBy(asc(workOrderComments.id));
}

export async function countAttachments(db: DbOrTx, workOrderId: number) {
  const [r] = await db.select({ n: sql<number>`count(*)` }).from(workOrderAttachments).where(eq(workOrderAttachments.workOrderId, workOrderId));
  return r.n;
}
