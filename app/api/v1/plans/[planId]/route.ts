import { parseId, readJson, withApi } from "@/lib/api";
import { getPlan, planJson, updatePlan } from "@/db/queries/plans";
import { notFound } from "@/lib/errors";
import { planUpdateSchema } from "@/lib/validation/maintenance";

type Params = { planId: string };

export const GET = withApi<Params>(
  async ({ db, params }) => {
    const row = await getPlan(db, parseId(params.planId, "That plan"));
    if (!row) throw notFound("That plan");
    return { ...planJson(row.plan), ovenTag: row.ovenTag };
  },
  { permission: "maintenance.read" },
);

/** `{ version, … }`; a stale version is 409 with the current plan. */
export const PATCH = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const after = await updatePlan(db, parseId(params.planId, "That plan"), await readJson(req, planUpdateSchema), actor);
    return planJson(after);
  },
  { permission: "plan.manage", what: "edit maintenance plans" },
);
