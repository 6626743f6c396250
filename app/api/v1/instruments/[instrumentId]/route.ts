import { parseId, readJson, withApi } from "@/lib/api";
import { calibrationState, getInstrument, instrumentJson, latestCalibrationAt, updateInstrument } from "@/db/queries/instruments";
import { notFound } from "@/lib/errors";
import { instrumentUpdateSchema } from "@/lib/validation/instruments";

export const GET = withApi<{ instrumentId: string }>(
  async ({ db, params }) => {
    const i = await getInstrument(db, parseId(params.instrumentId, "That instrument"));
    if (!i) throw notFound("That instrument");
    const now = new Date();
    const latest = await latestCalibrationAt(db, i.id, now);
    return instrumentJson(i, latest, calibrationState(latest, now));
  },
  { permission: "run.read", what: "see instruments" },
);

export const PATCH = withApi<{ instrumentId: string }>(
  async ({ req, db, actor, params }) => instrumentJson(await updateInstrument(db, parseId(params.instrumentId, "That instrument"), await readJson(req, instrumentUpdateSchema), actor)),
  { permission: "instrument.manage", what: "edit instruments" },
);
