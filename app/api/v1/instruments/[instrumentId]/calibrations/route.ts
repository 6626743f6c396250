import { NextResponse } from "next/server";
import { parseId, readJson, readMultipart, withApi } from "@/lib/api";
import { calibrationJson, createCalibration, listCalibrations } from "@/db/queries/instruments";
import { invalidInput } from "@/lib/errors";
import { MAX_CERTIFICATE_BYTES } from "@/lib/uploads/file-type";
import { calibrationSchema } from "@/lib/validation/instruments";

export const GET = withApi<{ instrumentId: string }>(
  async ({ db, params }) => ({ items: (await listCalibrations(db, parseId(params.instrumentId, "That instrument"))).map(calibrationJson) }),
  { permission: "run.read", what: "see calibrations" },
);

// JSON, or multipart with an optional `certificate` (PDF, PNG or JPEG, at most 10 MB).
export const POST = withApi<{ instrumentId: string }>(
  async ({ req, db, actor, params }) => {
    const instrumentId = parseId(params.instrumentId, "That instrument");
    let input;
    let certificate: { bytes: Uint8Array } | null = null;
    if ((req.headers.get("content-type") ?? "").startsWith("multipart/form-data")) {
      const form = await readMultipart(req, { maxBytes: MAX_CERTIFICATE_BYTES, label: "certificate" });
      const fields: Record<string, unknown> = {};
      for (const [k, v] of form.entries()) if (typeof v === "string") fields[k] = v;
      const parsed = calibrationSchema.safeParse(fields);
      if (!parsed.success) throw invalidInput(parsed.error.issues);
      input = parsed.data;
      const file = form.get("certificate");
      if (file instanceof File && file.size > 0) certificate = { bytes: new Uint8Array(await file.arrayBuffer()) };
    } else {
      input = await readJson(req, calibrationSchema);
    }
    return NextResponse.json(calibrationJson(await createCalibration(db, instrumentId, input, actor, certificate)), { status: 201 });
  },
  { permission: "instrument.manage", what: "record calibrations" },
);
