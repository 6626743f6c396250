import { z } from "zod";
import { defineAction } from "@/lib/action";
import { createChange } from "@/db/queries/changes";
import { changeCreateSchema } from "@/lib/validation/change";

export const createChangeDef = defineAction({
  name: "createChange",
  permission: "change.create",
  schema: z.object({ ovenId: z.coerce.number().int().positive() }).and(changeCreateSchema),
  run: async ({ db, actor, input }) => {
    const { ovenId, ...rest } = input;
    const row = await createChange(db, ovenId, rest, actor);
    return { id: row.id, ovenId };
  },
});
