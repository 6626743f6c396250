import { parseId, parseQuery, withApi } from "@/lib/api";
import { changeImpact, type ImpactResponse } from "@/db/queries/impact";
import { impactQuerySchema } from "@/lib/validation/drift";

export type { ImpactResponse };

export const GET = withApi<{ changeId: string }>(
  async ({ req, db, params }) => {
    const q = parseQuery(req, impactQuerySchema);
    return changeImpact(db, parseId(params.changeId, "That change"), q.metric, { before: q.before, after: q.after, delta: q.delta }) satisfies Promise<ImpactResponse>;
  },
  { permission: "change.read" },
);
