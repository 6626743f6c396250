import Papa from "papaparse";
import { parseQuery, withApi } from "@/lib/api";
import { listWorkOrders, workOrderListJson } from "@/db/queries/work-orders";
import { workOrderFilterSchema } from "@/lib/validation/maintenance";
import { neutraliseCell } from "@/lib/csv-cell";

const COLUMNS = ["number", "ovenTag", "title", "kind", "priority", "state", "dueAt", "completedAt", "assigneeName"] as const;

/** The filtered list as CSV (same filters as GET /api/v1/work-orders, up to 5 000 rows). */
export const GET = withApi(
  async ({ req, db }) => {
    const filter = { ...parseQuery(req, workOrderFilterSchema.omit({ limit: true, offset: true })), limit: 5000, offset: 0 };
    const { items } = await listWorkOrders(db, filter);
    const rows = items.map(workOrderListJson).map((o) => COLUMNS.map((c) => neutraliseCell(o[c])));
    const csv = Papa.unparse({ fields: [...COLUMNS], data: rows });
    return new Response(csv, {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": 'attachment; filename="work-orders.csv"' },
    });
  },
  { permission: "maintenance.read" },
);
