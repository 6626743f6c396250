import { NextResponse } from "next/server";
import { parseId, readJson, withApi } from "@/lib/api";
import { listMeterReadings, recordMeterReading } from "@/db/queries/meters";
import { meterReadingSchema } from "@/lib/validation/maintenance";

type Params = { ovenId: string };

export const GET = withApi<Params>(
  async ({ db, params }) => {
    const rows = await listMeterReadings(db, parseId(params.ovenId, "That oven"), 200);
    return { items: rows.map((r) => ({ id: r.id, kind: r.kind, value: r.value, at: r.at.toISOString() })) };
  },
  { permission: "maintenance.read" },
);

/** `{ kind, value, at? }`; readings only count up (400 says why one is refused). */
export const POST = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const saved = await recordMeterReading(db, parseId(params.ovenId, "That oven"), await readJson(req, meterReadingSchema), actor);
    return NextResponse.json(saved, { status: 201 });
  },
  { permission: "meter.record", what: "record meter readings" },
);
