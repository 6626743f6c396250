import { z } from "zod";
import { defineAction } from "@/lib/action";
import { createOven, updateOven, getOven } from "@/db/queries/ovens";
import { ovenCreateSchema, ovenUpdateSchema } from "@/lib/validation/oven";
import { forbidden, notFound } from "@/lib/errors";
import { can } from "@/lib/permissions";

export const createOvenDef = defineAction({
  name: "createOven",
  permission: "oven.create",
  schema: ovenCreateSchema,
  run: async ({ db, actor, input }) => {
    if (input.serviceState === "retired") throw forbidden("add an oven that is already retired");
    const row = await createOven(db, input, actor);
    return { id: row.id };
  },
});

export const updateOvenDef = defineAction({
  name: "updateOven",
  permission: "oven.update",
  schema: z.object({ ovenId: z.coerce.number().int().positive() }).and(ovenUpdateSchema),
  run: async ({ db, actor, input }) => {
    const { ovenId, ...patch } = input;
    const existing = await getOven(db, ovenId);
    if (!existing) throw notFound("That oven");
    const wasRetired = existing.oven.serviceState === "retired";
    const touchesRetired = patch.serviceState !== undefined && (patch.serviceState === "retired") !== wasRetired;
    if (touchesRetired && !can(actor.role, "oven.retire")) throw forbidden("retire ovens or return them to service");
    await updateOven(db, ovenId, patch, actor);
    return { id: ovenId };
  },
});

export const retireOvenDef = defineAction({
  name: "retireOven",
  permission: "oven.retire",
  schema: z.object({ ovenId: z.coerce.number().int().positive() }),
  run: async ({ db, actor, input }) => {
    const existing = await getOven(db, input.ovenId);
    if (!existing) throw notFound("That oven");
    await updateOven(db, input.ovenId, { serviceState: "retired" }, actor);
    return { id: input.ovenId };
  },
});
