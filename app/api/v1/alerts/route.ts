import { parseQuery, withApi } from "@/lib/api";
import { alertJson, listAlerts, type AlertJson } from "@/db/queries/alerts";
import { alertQuerySchema } from "@/lib/validation/drift";

export type AlertsResponse = { items: AlertJson[] };

export const GET = withApi(
  async ({ req, db }) => ({ items: (await listAlerts(db, parseQuery(req, alertQuerySchema))).map(alertJson) }) satisfies AlertsResponse,
  { permission: "alert.read" },
);
