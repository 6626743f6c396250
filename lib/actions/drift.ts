import { z } from "zod";
import { and, asc, eq, gte, isNull, lte } from "drizzle-orm";
import { defineAction } from "@/lib/action";
import { acknowledgeAlert } from "@/db/queries/alerts";
import { recomputeDrift, recomputeOven } from "@/db/queries/drift";
import { refreshHealth } from "@/db/queries/health";
import { recordAudit } from "@/db/queries/audit";
import { requireOven } from "@/db/queries/ovens";
import { driftBaselines, driftSettings } from "@/db/schema/drift";
import { runs } from "@/db/schema/runs";
import { acknowledgeSchema, baselineByDatesSchema, baselineSchema, driftSettingsSchema } from "@/lib/validation/drift";
import { TRACKED_METRICS } from "@/lib/tracked-metrics";
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

export const setDriftSettingsDef = defineAction({
  name: "setDriftSettings",
  permission: "baseline.manage",
  schema: driftSettingsSchema,
  run: async ({ db, actor, input }) =>
    db.transaction(async (tx) => {
      const { ovenId, ...params } = input;
      await requireOven(tx, ovenId);
      const [before] = await tx.select().from(driftSettings).where(eq(driftSettings.ovenId, ovenId));
      const row = { ovenId, ...params, updatedBy: actor.userId, updatedAt: new Date() };
      await tx.insert(driftSettings).values(row).onConflictDoUpdate({ target: driftSettings.ovenId, set: row });
      // New settings change every past EWMA/CUSUM value: rebuild from the history.
      await recomputeOven(tx, ovenId);
      await refreshHealth(tx, ovenId, new Date());
      await recordAudit(tx, { actor, action: "drift.settings", entity: "drift_setting", entityId: ovenId, before: before ?? null, after: row });
      return { ovenId };
    }),
});

export const setBaselineByDatesDef = defineAction({
  name: "setBaselineByDates",
  permission: "baseline.manage",
  schema: baselineByDatesSchema,
  run: async ({ db, actor, input }) => {
    await requireOven(db, input.ovenId);
    const picked = await db
      .select({ id: runs.id })
      .from(runs)
      .where(and(eq(runs.ovenId, input.ovenId), isNull(runs.deletedAt), gte(runs.runAt, input.from), lte(runs.runAt, input.to)))
      .orderBy(asc(runs.runAt));
    if (picked.length < 2) throw new AppError("invalid_input", "Pick dates that hold at least two runs of this oven.", { fields: { from: "fewer than two runs in this range" } });
    if (!TRACKED_METRICS.includes(input.metric)) throw new AppError("invalid_input", "Unknown metric.", { fields: { metric: "unknown" } });
    return setBaselineDef.run({ db, actor, input: { ovenId: input.ovenId, metric: input.metric, fromRunId: picked[0].id, toRunId: picked[picked.length - 1].id } });
  },
});
