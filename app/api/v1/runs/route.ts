import { parseQuery, withApi } from "@/lib/api";
import { listRuns, runListItemJson } from "@/db/queries/run-list";
import { runListQuerySchema } from "@/lib/validation/runs";

export type RunListResponse = { items: ReturnType<typeof runListItemJson>[]; total: number };

export const GET = withApi(
  async ({ req, db }) => {
    const q = parseQuery(req, runListQuerySchema);
    const { items, total } = await listRuns(db, q);
    return { items: items.map(runListItemJson), total } satisfies RunListResponse;
  },
  { permission: "run.read", what: "see runs" },
);
