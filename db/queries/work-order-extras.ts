import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import { createHash } from "node:crypto";
import { asc, eq, sql } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { users } from "../schema/users";
import { workOrderAttachments, workOrderComments, workOrders } from "../schema/maintenance";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, notFound } from "@/lib/errors";
import { env } from "@/lib/env";
import { parseMentions } from "@/lib/maintenance/mentions";
import { MAX_UPLOAD_BYTES, sniffFileType } from "@/lib/uploads/file-type";

// Photos, documents and comments on a work order. Each marks the order as touched.

async function assertOrder(db: DbOrTx, id: number) {
  const [o] = await db.select({ id: workOrders.id }).from(workOrders).where(eq(workOrders.id, id)).limit(1);
  if (!o) throw notFound("That work order");
}

export function uploadPath(sha256: string) {
  return path.resolve(env().UPLOAD_DIR, sha256);
}

/** Stores the bytes under their SHA-256 (the same photo twice is stored once). */
export async function addAttachment(db: Db, workOrderId: number, file: { name: string; bytes: Uint8Array }, actor: Actor) {
  await assertOrder(db, workOrderId);
  if (file.bytes.byteLength === 0) throw new AppError("invalid_file", "file: the file is empty.", { fields: { file: "is empty" } });
  if (file.bytes.byteLength > MAX_UPLOAD_BYTES) {
    throw new AppError("file_too_large", `file: ${(file.bytes.byteLength / 1048576).toFixed(1)} MB is over the 10 MB limit; send a smaller photo.`, { fields: { file: "over 10 MB" } });
  }
  const type = sniffFileType(file.bytes);
  if (!type) throw new AppError("unsupported_file", "file: only JPEG, PNG or WebP photos and PDF documents can be attached.", { fields: { file: "not a JPEG, PNG, WebP or PDF" } });
  const sha256 = createHash("sha256").update(file.bytes).digest("hex");
  await fs.mkdir(path.resolve(env().UPLOAD_DIR), { recursive: true });
  await fs.writeFile(uploadPath(sha256), file.bytes);
  const fileName = file.name.replace(/[^\w.\- ]+/g, "_").slice(0, 120) || `upload.${type.ext}`;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(workOrderAttachments)
      .values({ workOrderId, sha256, fileName, contentType: type.contentType, sizeBytes: file.bytes.byteLength, uploadedById: actor.userId })
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
