import "server-only";
import { asc, eq } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { lines, sites } from "../schema/fleet";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { fromDbError } from "@/lib/errors";

export async function listSitesWithLines(db: DbOrTx) {
  const siteRows = await db.select().from(sites).orderBy(asc(sites.name));
  const lineRows = await db.select().from(lines).orderBy(asc(lines.name));
  return siteRows.map((s) => ({ ...s, lines: lineRows.filter((l) => l.siteId === s.id) }));
}
export type SiteWithLines = Awaited<ReturnType<typeof listSitesWithLines>>[number];

export async function createSite(db: Db, input: { name: string; timeZone: string }, actor: Actor) {
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.insert(sites).values(input).returning();
      await recordAudit(tx, { actor, action: "site.create", entity: "site", entityId: row.id, after: row });
      return row;
    });
  } catch (err) {
    throw fromDbError(err, () => `A site named ${input.name} already exists.`) ?? err;
  }
}

export async function createLine(db: Db, input: { siteId: number; name: string; kind: "smt" | "lab" | "other" }, actor: Actor) {
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.insert(lines).values(input).returning();
      await recordAudit(tx, { actor, action: "line.create", entity: "line", entityId: row.id, after: row });
      return row;
    });
  } catch (err) {
    throw fromDbError(err, () => `That site already has a line named ${input.name}.`) ?? err;
  }
}

export async function getSite(db: DbOrTx, id: number) {
  const [row] = await db.select().from(sites).where(eq(sites.id, id)).limit(1);
  return row ?? null;
}
