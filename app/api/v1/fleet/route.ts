import { parseQuery, withApi } from "@/lib/api";
import { fleetView, type FleetOven } from "@/db/queries/fleet-view";
import { fleetQuerySchema } from "@/lib/validation/drift";

export type FleetResponse = { ovens: FleetOven[] };

export const GET = withApi(
  async ({ req, db }) => ({ ovens: await fleetView(db, parseQuery(req, fleetQuerySchema), new Date()) }) satisfies FleetResponse,
  { permission: "fleet.read" },
);
