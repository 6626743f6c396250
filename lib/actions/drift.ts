import { z } from "zod";
import { and, eq } from "drizzle-orm";
import { defineAction } from "@/lib/action";
import { acknowledgeAlert } from "@/db/queries/alerts";
import { recomputeDrift } from "@/db/queries/drift";
import { refreshHealth } from "@/db/queries/health";
import { recordAudit } from "@/db/queries/audit";
import { driftBaselines } from "@/db/schema/drift";
import { runs } from "@/db/schema/runs";
import { acknowledgeSchema, baselineSchema } from "@/lib/validation/drift";
import { AppError, forbidden } from "@/lib/errors";
import { can } from "@/lib/permissions";

export const acknowledgeAlertDef = defineAction({
  name: "acknowledgeAlert",
  permission: "alert.acknowledge",
  schema: z.object({ alertId: z.coerce.number().int().positive() }).and(acknowledgeSchema),
  run: async ({ db, actor, input }) => {
    if (input.openWorkOrder && !can(actor.role, "workorder.create")) throw forbidden("open work orders");
    const r = await acknowledgeAlert(db, input.alertId, input, actor);
    return { id: r.alert.id, workOrderId: r.workOrderId };
  },
});

export const setBaselineDef = defineAction({
  name: "setBaseline",
  permission: "baseline.manage",
  schema: z.object({ ovenId: z.coerce.number().int().positive() }).and(baselineSchema),
  run: async ({ db, actor, input }) => {
    return db.transaction(async (tx) => {
      const picked = await tx.select({ id: runs.id, ovenId: runs.ovenId }).from(runs).where(and(eq(runs.ovenId, input.ovenId)));
      const ids = new Set(picked.map((p) => p.id));
      if (!ids.has(input.fromRunId) || !ids.has(input.toRunId)) throw new AppError("invalid_input", "Both runs of the baseline must belong to this oven.", { fields: { fromRunId: "not a run of this oven" } });
      const [before] = await tx.select().from(driftBaselines).where(and(eq(driftBaselines.ovenId, input.ovenId), eq(driftBaselines.metric, input.metric)));
      const row = { ovenId: input.ovenId, metric: input.metric, fromRunId: input.fromRunId, toRunId: input.toRunId, setBy: actor.userId, setAt: new Date() };
      await tx.insert(driftBaselines).values(row).onConflictDoUpdate({ target: [driftBaselines.ovenId, driftBaselines.metric], set: row });
      const result = await recomputeDrift(tx, input.ovenId, input.metric);
      await refreshHealth(tx, input.ovenId, new Date());
      await recordAudit(tx, { actor, action: "baseline.set", entity: "drift_baseline", entityId: `${input.ovenId}:${input.metric}`, before: before ?? null, after: row });
      return { ovenId: input.ovenId, n: result?.baseline.n ?? 0 };
    });
  },
});
