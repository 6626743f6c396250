import { NextResponse } from "next/server";
import { readJson, withApi } from "@/lib/api";
import { createInstrument, instrumentJson, listInstruments } from "@/db/queries/instruments";
import { instrumentSchema } from "@/lib/validation/instruments";

export const GET = withApi(
  async ({ db }) => ({ items: (await listInstruments(db)).map((r) => instrumentJson(r.instrument, r.latest, r.state)) }),
  { permission: "run.read", what: "see instruments" },
);

export const POST = withApi(
  async ({ req, db, actor }) => NextResponse.json(instrumentJson(await createInstrument(db, await readJson(req, instrumentSchema), actor)), { status: 201 }),
  { permission: "instrument.manage", what: "edit instruments" },
);
