import { readJson, withApi } from "@/lib/api";
import { bulkAssign } from "@/db/queries/work-orders";
import { bulkAssignSchema } from "@/lib/validation/maintenance";

/** `{ ids, assigneeId }` → `{ assigned, skipped }` (done and cancelled orders are skipped). */
export const POST = withApi(
  async ({ req, db, actor }) => {
    const { ids, assigneeId } = await readJson(req, bulkAssignSchema);
    return bulkAssign(db, ids, assigneeId, actor);
  },
  { permission: "workorder.assign", what: "assign work orders" },
);
