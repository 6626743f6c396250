import { z } from "zod";
import { eq } from "drizzle-orm";
import { defineAction } from "@/lib/action";
import { createWindow, getWindow, updateWindow } from "@/db/queries/windows";
import { createBoard, getBoard, updateBoard } from "@/db/queries/boards";
import { createCalibration, createInstrument, updateInstrument } from "@/db/queries/instruments";
import { deleteRun, rejudgeRun } from "@/db/queries/runs";
import { recordAudit } from "@/db/queries/audit";
import { ovens } from "@/db/schema/fleet";
import { AppError, notFound } from "@/lib/errors";
import { boardCreateSchema, boardUpdateSchema, ovenDefaultsSchema, windowCreateSchema, windowUpdateSchema } from "@/lib/validation/windows";
import { calibrationSchema, instrumentSchema, instrumentUpdateSchema } from "@/lib/validation/instruments";

const id = z.coerce.number().int().positive();

export const createWindowDef = defineAction({
  name: "createWindow",
  permission: "window.manage",
  schema: windowCreateSchema,
  run: async ({ db, actor, input }) => ({ id: (await createWindow(db, input, actor)).id }),
});

export const updateWindowDef = defineAction({
  name: "updateWindow",
  permission: "window.manage",
  schema: z.object({ windowId: id }).and(windowUpdateSchema),
  run: async ({ db, actor, input }) => {
    const { windowId, ...patch } = input;
    const w = await updateWindow(db, windowId, patch, actor);
    return { id: w.id, version: w.version };
  },
});

export const createBoardDef = defineAction({
  name: "createBoard",
  permission: "board.manage",
  schema: boardCreateSchema,
  run: async ({ db, actor, input }) => ({ id: (await createBoard(db, input, actor)).id }),
});

export const updateBoardDef = defineAction({
  name: "updateBoard",
  permission: "board.manage",
  schema: z.object({ boardId: id }).and(boardUpdateSchema),
  run: async ({ db, actor, input }) => {
    const { boardId, ...patch } = input;
    return { id: (await updateBoard(db, boardId, patch, actor)).id };
  },
});

export const createInstrumentDef = defineAction({
  name: "createInstrument",
  permission: "instrument.manage",
  schema: instrumentSchema,
  run: async ({ db, actor, input }) => ({ id: (await createInstrument(db, input, actor)).id }),
});

export const updateInstrumentDef = defineAction({
  name: "updateInstrument",
  permission: "instrument.manage",
  schema: z.object({ instrumentId: id }).and(instrumentUpdateSchema),
  run: async ({ db, actor, input }) => {
    const { instrumentId, ...patch } = input;
    return { id: (await updateInstrument(db, instrumentId, patch, actor)).id };
  },
});

export const createCalibrationDef = defineAction({
  name: "createCalibration",
  permission: "instrument.manage",
  schema: z.object({ instrumentId: id, certificate: z.unknown().optional() }).and(calibrationSchema),
  run: async ({ db, actor, input }) => {
    const { instrumentId, certificate, ...rest } = input;
    const file = certificate instanceof Blob && certificate.size > 0 ? { bytes: new Uint8Array(await certificate.arrayBuffer()) } : null;
    const c = await createCalibration(db, instrumentId, rest, actor, file);
    return { id: c.id, instrumentId };
  },
});

export const setOvenDefaultsDef = defineAction({
  name: "setOvenDefaults",
  permission: "window.manage",
  schema: ovenDefaultsSchema,
  run: async ({ db, actor, input }) => {
    if (input.defaultWindowId && !(await getWindow(db, input.defaultWindowId))) throw new AppError("invalid_input", "No such process window.", { fields: { defaultWindowId: "no such window" } });
    if (input.defaultBoardId && !(await getBoard(db, input.defaultBoardId))) throw new AppError("invalid_input", "No such test board.", { fields: { defaultBoardId: "no such board" } });
    return db.transaction(async (tx) => {
      const [before] = await tx.select().from(ovens).where(eq(ovens.id, input.ovenId)).limit(1);
      if (!before) throw notFound("That oven");
      const [after] = await tx.update(ovens).set({ defaultWindowId: input.defaultWindowId, defaultBoardId: input.defaultBoardId, updatedAt: new Date() }).where(eq(ovens.id, input.ovenId)).returning();
      await recordAudit(tx, { actor, action: "oven.defaults", entity: "oven", entityId: input.ovenId, before: { defaultWindowId: before.defaultWindowId, defaultBoardId: before.defaultBoardId }, after: { defaultWindowId: after.defaultWindowId, defaultBoardId: after.defaultBoardId } });
      return { id: input.ovenId };
    });
  },
});

export const rejudgeRunDef = defineAction({
  name: "rejudgeRun",
  permission: "run.rejudge",
  schema: z.object({ runId: id, windowId: z.preprocess((v) => (v === "" ? undefined : v), id.optional()) }),
  run: async ({ db, actor, input }) => {
    const r = await rejudgeRun(db, input.runId, input.windowId, actor);
    return { runId: input.runId, judgementId: r.judgement.id, status: r.judgement.verdict.status };
  },
});

export const deleteRunDef = defineAction({
  name: "deleteRun",
  permission: "run.delete",
  schema: z.object({ runId: id }),
  run: async ({ db, actor, input }) => deleteRun(db, input.runId, actor),
});
