import { parseId, withApi } from "@/lib/api";
import { deleteRun, getRunDetail, runDetailJson, type RunDetailJson } from "@/db/queries/runs";
import { notFound } from "@/lib/errors";

export type RunResponse = RunDetailJson;

export const GET = withApi<{ runId: string }>(
  async ({ db, params }) => {
    const detail = await getRunDetail(db, parseId(params.runId, "That run"));
    if (!detail) throw notFound("That run");
    return runDetailJson(detail) satisfies RunResponse;
  },
  { permission: "run.read", what: "see runs" },
);

export const DELETE = withApi<{ runId: string }>(
  async ({ db, actor, params }) => deleteRun(db, parseId(params.runId, "That run"), actor),
  { permission: "run.delete", what: "delete runs" },
);
