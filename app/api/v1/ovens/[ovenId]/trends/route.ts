import { parseId, parseQuery, withApi } from "@/lib/api";
import { getOven } from "@/db/queries/ovens";
import { getTrend, type TrendResponse } from "@/db/queries/trends";
import { trendQuerySchema } from "@/lib/validation/drift";
import { notFound } from "@/lib/errors";

export type { TrendResponse };

export const GET = withApi<{ ovenId: string }>(
  async ({ req, db, params }) => {
    const ovenId = parseId(params.ovenId, "That oven");
    if (!(await getOven(db, ovenId))) throw notFound("That oven");
    const q = parseQuery(req, trendQuerySchema);
    return getTrend(db, ovenId, q.metric, { from: q.from, to: q.to }, new Date()) satisfies Promise<TrendResponse>;
  },
  { permission: "fleet.read" },
);
