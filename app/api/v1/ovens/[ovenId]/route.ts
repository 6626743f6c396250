import { parseId, readJson, withApi } from "@/lib/api";
import { getOven, ovenJson, updateOven } from "@/db/queries/ovens";
import { ovenUpdateSchema } from "@/lib/validation/oven";
import { forbidden, notFound } from "@/lib/errors";
import { can } from "@/lib/permissions";

type Params = { ovenId: string };

export const GET = withApi<Params>(
  async ({ db, params }) => {
    const row = await getOven(db, parseId(params.ovenId, "That oven"));
    if (!row) throw notFound("That oven");
    return ovenJson(row);
  },
  { permission: "oven.read" },
);

export const PATCH = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const id = parseId(params.ovenId, "That oven");
    const patch = await readJson(req, ovenUpdateSchema);
    // Retiring an oven takes it out of the fleet's figures: only an admin may do that.
    if (patch.serviceState === "retired" && !can(actor.role, "oven.retire")) throw forbidden("retire ovens");
    const existing = await getOven(db, id);
    if (!existing) throw notFound("That oven");
    if (existing.oven.serviceState === "retired" && patch.serviceState && patch.serviceState !== "retired" && !can(actor.role, "oven.retire"))
      throw forbidden("return a retired oven to service");
    await updateOven(db, id, patch, actor);
    return ovenJson((await getOven(db, id))!);
  },
  { permission: "oven.update", what: "edit ovens" },
);
