import "server-only";
import { and, eq, isNull, ne } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { changeAttachments } from "../schema/changes";
import { calibrations } from "../schema/instruments";
import { workOrderAttachments } from "../schema/maintenance";
import { runs } from "../schema/runs";
import { testBoards } from "../schema/windows";

/**
 * Whether anything but the given run still refers to these bytes. Logger files, certificates,
 * pictures and attachments share one store keyed by hash, so the same bytes may have several
 * owners, and the bytes may go only when the last one does.
 */
export async function contentStillReferenced(db: DbOrTx, sha256: string, exceptRunId: number): Promise<boolean> {
  const checks = [
    db.select({ id: runs.id }).from(runs).where(and(eq(runs.fileSha256, sha256), isNull(runs.deletedAt), ne(runs.id, exceptRunId))).limit(1),
    db.select({ id: calibrations.id }).from(calibrations).where(eq(calibrations.certificateSha256, sha256)).limit(1),
    db.select({ id: testBoards.id }).from(testBoards).where(eq(testBoards.pictureSha256, sha256)).limit(1),
    db.select({ id: workOrderAttachments.id }).from(workOrderAttachments).where(eq(workOrderAttachments.sha256, sha256)).limit(1),
    db.select({ id: changeAttachments.id }).from(changeAttachments).where(eq(changeAttachments.sha256, sha256)).limit(1),
  ];
  // One at a time: inside a transaction on one connection the statements take turns anyway.
  for (const q of checks) if ((await q).length > 0) return true;
  return false;
}
