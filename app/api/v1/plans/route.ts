import { NextResponse } from "next/server";
import { z } from "zod";
import { parseQuery, readJson, withApi } from "@/lib/api";
import { createPlans, listPlans, planJson } from "@/db/queries/plans";
import { planCreateSchema } from "@/lib/validation/maintenance";

export type PlanJson = ReturnType<typeof planJson>;
export type PlanListResponse = { items: (PlanJson & { ovenTag: string })[]; total: number };

export const GET = withApi(
  async ({ req, db }) => {
    const { ovenId } = parseQuery(req, z.object({ ovenId: z.coerce.number().int().positive().optional() }));
    const rows = await listPlans(db, { ovenId });
    return { items: rows.map((r) => ({ ...planJson(r.plan), ovenTag: r.ovenTag })), total: rows.length } satisfies PlanListResponse;
  },
  { permission: "maintenance.read" },
);

/** One plan per oven in `ovenIds` (copies that share a groupKey). */
export const POST = withApi(
  async ({ req, db, actor }) => {
    const rows = await createPlans(db, await readJson(req, planCreateSchema), actor);
    return NextResponse.json({ items: rows.map(planJson) }, { status: 201 });
  },
  { permission: "plan.manage", what: "create maintenance plans" },
);
