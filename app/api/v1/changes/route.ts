import { parseQuery, withApi } from "@/lib/api";
import { changeJson, listChanges, type ChangeJson } from "@/db/queries/changes";
import { changeFilterSchema } from "@/lib/validation/change";

export type ChangesResponse = { items: ChangeJson[] };

// The fleet-wide modification log, newest first, filtered by oven, area and date range.
export const GET = withApi(
  async ({ req, db }) => ({ items: (await listChanges(db, parseQuery(req, changeFilterSchema))).map(changeJson) }) satisfies ChangesResponse,
  { permission: "change.read" },
);
