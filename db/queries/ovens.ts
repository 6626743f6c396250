import "server-only";
import { refreshHealth } from "./health";
import { and, asc, eq, like, or, sql, type SQL } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { lines, ovens, sites, type OvenRow } from "../schema/fleet";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, fromDbError, notFound } from "@/lib/errors";
import type { FleetFilter, OvenCreateInput, OvenUpdateInput } from "@/lib/validation/oven";

const ovenWithPlace = {
  oven: ovens,
  line: { id: lines.id, name: lines.name, kind: lines.kind },
  site: { id: sites.id, name: sites.name, timeZone: sites.timeZone },
};

export async function listOvens(db: DbOrTx, filter: FleetFilter = {}) {
  const where: SQL[] = [];
  if (filter.siteId) where.push(eq(sites.id, filter.siteId));
  if (filter.lineId) where.push(eq(lines.id, filter.lineId));
  if (filter.state) where.push(eq(ovens.serviceState, filter.state));
  if (filter.q) {
    const q = `%${filter.q.replace(/[%_]/g, "")}%`;
    where.push(or(like(ovens.tag, q), like(ovens.name, q))!);
  }
  return db
    .select(ovenWithPlace)
    .from(ovens)
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .where(where.length ? and(...where) : undefined)
    .orderBy(asc(sites.name), asc(lines.name), asc(ovens.tag));
}
export type OvenListRow = Awaited<ReturnType<typeof listOvens>>[number];

export async function getOven(db: DbOrTx, id: number) {
  const [row] = await db
    .select(ovenWithPlace)
    .from(ovens)
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .where(eq(ovens.id, id))
    .limit(1);
  return row ?? null;
}

/** The oven's id when it exists; otherwise not_found ("That oven was not found."), before anything is written. */
export async function requireOven(db: DbOrTx, id: number): Promise<number> {
  const [row] = await db.select({ id: ovens.id }).from(ovens).where(eq(ovens.id, id)).limit(1);
  if (!row) throw notFound("That oven");
  return row.id;
}

const tagTaken = (tag: string) => () => `Another oven already has the tag ${tag}. Tags are unique across the plant.`;

async function assertLine(tx: DbOrTx, lineId: number) {
  const [line] = await tx.select({ id: lines.id }).from(lines).where(eq(lines.id, lineId)).limit(1);
  if (!line) throw new AppError("invalid_input", "lineId: no line has that id.", { fields: { lineId: "no line has that id" } });
}

export async function createOven(db: Db, input: OvenCreateInput, actor: Actor): Promise<OvenRow> {
  try {
    return await db.transaction(async (tx) => {
      await assertLine(tx, input.lineId);
      const [created] = await tx.insert(ovens).values(input).returning();
      await recordAudit(tx, { actor, action: "oven.create", entity: "oven", entityId: created.id, after: created });
      await refreshHealth(tx, created.id, new Date());
      return created;
    });
  } catch (err) {
    throw fromDbError(err, tagTaken(input.tag)) ?? err;
  }
}

export async function updateOven(db: Db, id: number, patch: OvenUpdateInput, actor: Actor): Promise<OvenRow> {
  try {
    return await db.transaction(async (tx) => {
      const [before] = await tx.select().from(ovens).where(eq(ovens.id, id)).limit(1);
      if (!before) throw notFound("That oven");
      if (patch.lineId) await assertLine(tx, patch.lineId);
      const [after] = await tx.update(ovens).set({ ...patch, updatedAt: new Date() }).where(eq(ovens.id, id)).returning();
      await recordAudit(tx, { actor, action: patch.serviceState === "retired" ? "oven.retire" : "oven.update", entity: "oven", entityId: id, before, after });
      if (patch.serviceState && patch.serviceState !== before.serviceState) await refreshHealth(tx, id, new Date());
      return after;
    });
  } catch (err) {
    throw fromDbError(err, tagTaken(patch.tag ?? "")) ?? err;
  }
}

export async function countOvensByState(db: DbOrTx) {
  return db.select({ state: ovens.serviceState, n: sql<number>`count(*)` }).from(ovens).groupBy(ovens.serviceState);
}

/** The API shape of an oven. */
export function ovenJson(row: { oven: OvenRow; line: { id: number; name: string }; site: { id: number; name: string; timeZone: string } }) {
  const o = row.oven;
  return {
    id: o.id,
    tag: o.tag,
    name: o.name,
    kind: o.kind,
    zones: o.zones,
    maker: o.maker,
    model: o.model,
    serial: o.serial,
    installedOn: o.installedOn,
    serviceState: o.serviceState,
    notes: o.notes,
    line: { id: row.line.id, name: row.line.name },
    site: { id: row.site.id, name: row.site.name, timeZone: row.site.timeZone },
    createdAt: o.createdAt.toISOString(),
    updatedAt: o.updatedAt.toISOString(),
  };
}
export type OvenJson = ReturnType<typeof ovenJson>;
