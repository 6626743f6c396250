import { parseId, readJson, withApi } from "@/lib/api";
import { getWorkOrder, listParts, patchWorkOrder, workOrderJson } from "@/db/queries/work-orders";
import { notFound } from "@/lib/errors";
import { workOrderPatchSchema } from "@/lib/validation/maintenance";

type Params = { workOrderId: string };

export const GET = withApi<Params>(
  async ({ db, params }) => {
    const id = parseId(params.workOrderId, "That work order");
    const row = await getWorkOrder(db, id);
    if (!row) throw notFound("That work order");
    return workOrderJson(row, await listParts(db, id));
  },
  { permission: "maintenance.read" },
);

/** `{ version, … }` → 200 with the new version, or 409 `conflict` with the current record. */
export const PATCH = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const id = parseId(params.workOrderId, "That work order");
    return patchWorkOrder(db, id, await readJson(req, workOrderPatchSchema), actor);
  },
  { permission: "workorder.update", what: "update work orders" },
);
