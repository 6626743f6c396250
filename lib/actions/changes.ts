import { z } from "zod";
import { defineAction } from "@/lib/action";
import { createChange } from "@/db/queries/changes";
import { changeCreateSchema } from "@/lib/validation/change";

export const createChangeDef = defineAction({
  name: "createChange",
  permission: "change.create",
  schema: z.object({ ovenId: z.coerce.number().int().positive(), attachment: z.unknown().optional() }).and(changeCreateSchema),
  run: async ({ db, actor, input }) => {
    const { ovenId, attachment, ...rest } = input;
    // An empty file input arrives as a File of size 0: no attachment.
    const files = attachment instanceof File && attachment.size > 0 ? [{ name: attachment.name, bytes: new Uint8Array(await attachment.arrayBuffer()) }] : [];
    const row = await createChange(db, ovenId, rest, actor, files);
    return { id: row.id, ovenId };
  },
});
