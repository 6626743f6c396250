import { readJson, withApi } from "@/lib/api";
import { generateWorkOrders } from "@/db/queries/work-order-generation";
import { generateSchema } from "@/lib/validation/maintenance";

/** `{ until? }` → `{ created }`. Idempotent: the (plan, occurrence) unique key absorbs repeats. */
export const POST = withApi(
  async ({ req, db, actor }) => {
    const text = await req.clone().text();
    const { until } = text.trim() ? await readJson(req, generateSchema) : { until: undefined };
    return generateWorkOrders(db, { now: new Date(), until, actor });
  },
  { permission: "maintenance.generate", what: "run work-order generation" },
);
