import { NextResponse } from "next/server";
import { parseId, readJson, withApi } from "@/lib/api";
import { changeJson, createChange, listChanges, type ChangeJson } from "@/db/queries/changes";
import { getOven } from "@/db/queries/ovens";
import { changeCreateSchema } from "@/lib/validation/change";
import { notFound } from "@/lib/errors";

type Params = { ovenId: string };
export type OvenChangesResponse = { items: ChangeJson[] };

export const GET = withApi<Params>(
  async ({ db, params }) => {
    const ovenId = parseId(params.ovenId, "That oven");
    if (!(await getOven(db, ovenId))) throw notFound("That oven");
    const rows = await listChanges(db, { ovenId });
    return { items: rows.map(changeJson) } satisfies OvenChangesResponse;
  },
  { permission: "change.read" },
);

export const POST = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const ovenId = parseId(params.ovenId, "That oven");
    const input = await readJson(req, changeCreateSchema);
    const row = await createChange(db, ovenId, input, actor);
    const [created] = (await listChanges(db, { ovenId })).filter((r) => r.change.id === row.id);
    return NextResponse.json(changeJson(created), { status: 201 });
  },
  { permission: "change.create", what: "log hardware changes" },
);
