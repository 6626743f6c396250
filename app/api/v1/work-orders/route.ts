import { NextResponse } from "next/server";
import { parseQuery, readJson, withApi } from "@/lib/api";
import { createWorkOrder, listWorkOrders, workOrderListJson, type WorkOrderListJson } from "@/db/queries/work-orders";
import { workOrderCreateSchema, workOrderFilterSchema } from "@/lib/validation/maintenance";

export type WorkOrderListResponse = { items: WorkOrderListJson[]; total: number };

export const GET = withApi(
  async ({ req, db }) => {
    const { items, total } = await listWorkOrders(db, parseQuery(req, workOrderFilterSchema));
    return { items: items.map(workOrderListJson), total } satisfies WorkOrderListResponse;
  },
  { permission: "maintenance.read" },
);

/** Unplanned work: corrective (breakdowns) and drift investigations. */
export const POST = withApi(
  async ({ req, db, actor }) => {
    const created = await createWorkOrder(db, await readJson(req, workOrderCreateSchema), actor);
    return NextResponse.json(created, { status: 201 });
  },
  { permission: "workorder.create", what: "raise work orders" },
);
