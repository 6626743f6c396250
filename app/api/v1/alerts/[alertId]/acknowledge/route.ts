import { parseId, readJson, withApi } from "@/lib/api";
import { acknowledgeAlert } from "@/db/queries/alerts";
import { acknowledgeSchema } from "@/lib/validation/drift";
import { forbidden } from "@/lib/errors";
import { can } from "@/lib/permissions";

export const POST = withApi<{ alertId: string }>(
  async ({ req, db, actor, params }) => {
    const input = await readJson(req, acknowledgeSchema);
    if (input.openWorkOrder && !can(actor.role, "workorder.create")) throw forbidden("open work orders");
    const r = await acknowledgeAlert(db, parseId(params.alertId, "That alert"), input, actor);
    return { id: r.alert.id, acknowledgedAt: r.alert.acknowledgedAt?.toISOString() ?? null, workOrderId: r.workOrderId };
  },
  { permission: "alert.acknowledge", what: "acknowledge alerts" },
);
