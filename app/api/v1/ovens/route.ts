import { NextResponse } from "next/server";
import { parseQuery, readJson, withApi } from "@/lib/api";
import { createOven, getOven, listOvens, ovenJson, type OvenJson } from "@/db/queries/ovens";
import { fleetFilterSchema, ovenCreateSchema } from "@/lib/validation/oven";

export type OvenListResponse = { items: OvenJson[]; total: number };

export const GET = withApi(
  async ({ req, db }) => {
    const rows = await listOvens(db, parseQuery(req, fleetFilterSchema));
    return { items: rows.map(ovenJson), total: rows.length } satisfies OvenListResponse;
  },
  { permission: "oven.read" },
);

export const POST = withApi(
  async ({ req, db, actor }) => {
    const input = await readJson(req, ovenCreateSchema);
    const created = await createOven(db, input, actor);
    return NextResponse.json(ovenJson((await getOven(db, created.id))!), { status: 201 });
  },
  { permission: "oven.create", what: "add ovens" },
);
