import "server-only";
import { asc, eq } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { testBoards, type TestBoardRow } from "../schema/windows";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, fromDbError, notFound } from "@/lib/errors";
import type { BoardCreateInput, BoardUpdateInput } from "@/lib/validation/windows";

const nameTaken = (name: string) => () => `Another test board is already called "${name}".`;

export async function listBoards(db: DbOrTx) {
  return db.select().from(testBoards).orderBy(asc(testBoards.name));
}

export async function getBoard(db: DbOrTx, id: number) {
  const [row] = await db.select().from(testBoards).where(eq(testBoards.id, id)).limit(1);
  return row ?? null;
}

export async function createBoard(db: Db, input: BoardCreateInput, actor: Actor | null): Promise<TestBoardRow> {
  try {
    return await db.transaction(async (tx) => {
      const [created] = await tx.insert(testBoards).values({ ...input, notes: input.notes ?? null }).returning();
      await recordAudit(tx, { actor, action: "board.create", entity: "test_board", entityId: created.id, after: created });
      return created;
    });
  } catch (err) {
    throw fromDbError(err, nameTaken(input.name)) ?? err;
  }
}

export async function updateBoard(db: Db, id: number, patch: BoardUpdateInput, actor: Actor): Promise<TestBoardRow> {
  try {
    return await db.transaction(async (tx) => {
      const before = await getBoard(tx, id);
      if (!before) throw notFound("That test board");
      const next = { ...before, ...patch };
      for (const p of next.probes) {
        if (p.x > next.widthMm || p.y > next.heightMm) throw new AppError("invalid_input", `probes: ${p.label} lies outside the board outline.`, { fields: { probes: `${p.label} lies outside the outline` } });
      }
      const [after] = await tx.update(testBoards).set({ ...patch, updatedAt: new Date() }).where(eq(testBoards.id, id)).returning();
      await recordAudit(tx, { actor, action: "board.update", entity: "test_board", entityId: id, before, after });
      return after;
    });
  } catch (err) {
    throw fromDbError(err, nameTaken(patch.name ?? "")) ?? err;
  }
}

export function boardJson(b: TestBoardRow) {
  return { id: b.id, name: b.name, widthMm: b.widthMm, heightMm: b.heightMm, probes: b.probes, notes: b.notes };
}
export type BoardJson = ReturnType<typeof boardJson>;
