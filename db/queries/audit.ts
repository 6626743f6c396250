import "server-only";
import { desc, eq, and } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { auditLog } from "../schema/audit";
import type { Actor } from "@/lib/actor";

export async function recordAudit(
  tx: DbOrTx,
  entry: { actor: Actor | null; action: string; entity: string; entityId: string | number; before?: unknown; after?: unknown },
) {
  await tx.insert(auditLog).values({
    actorUserId: entry.actor?.userId ?? null,
    actorTokenId: entry.actor?.tokenId ?? null,
    action: entry.action,
    entity: entry.entity,
    entityId: String(entry.entityId),
    before: (entry.before ?? null) as never,
    after: (entry.after ?? null) as never,
  });
}

export async function listAudit(db: DbOrTx, { entity, entityId, limit = 50 }: { entity?: string; entityId?: string; limit?: number }) {
  const where = [entity ? eq(auditLog.entity, entity) : undefined, entityId ? eq(auditLog.entityId, entityId) : undefined].filter(Boolean);
  return db
    .select()
    .from(auditLog)
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditLog.id))
    .limit(limit);
}
