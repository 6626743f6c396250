import { parseQuery, withApi } from "@/lib/api";
import { listRunsForExport } from "@/db/queries/run-list";
import { runsCsv } from "@/lib/runs/csv";
import { runListQuerySchema } from "@/lib/validation/runs";

// The filtered runs list as CSV; the same filters as GET /api/v1/runs, without paging.
export const GET = withApi(
  async ({ req, db }) => {
    const q = parseQuery(req, runListQuerySchema);
    const rows = await listRunsForExport(db, q);
    return new Response(runsCsv(rows), {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": 'attachment; filename="ovenward-runs.csv"' },
    });
  },
  { permission: "run.read", what: "export runs" },
);
