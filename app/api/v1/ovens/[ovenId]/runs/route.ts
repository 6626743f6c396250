import { NextResponse } from "next/server";
import { parseId, withApi } from "@/lib/api";
import { createRun } from "@/db/queries/run-create";
import { getRunDetail, runSummaryJson } from "@/db/queries/runs";
import { asInputError, readRunUpload } from "@/lib/runs/upload-request";

export type CreateRunResponse = ReturnType<typeof runSummaryJson>;

// Loggers with tokens and the upload wizard both record runs here.
export const POST = withApi<{ ovenId: string }>(
  async ({ req, db, actor, params }) => {
    const ovenId = parseId(params.ovenId, "That oven");
    const { input, file } = await readRunUpload(req);
    try {
      const created = await createRun(db, ovenId, input, file, actor);
      const detail = await getRunDetail(db, created.id);
      return NextResponse.json(runSummaryJson(detail!.run) satisfies CreateRunResponse, { status: 201, headers: { location: `/api/v1/runs/${created.id}` } });
    } catch (err) {
      throw asInputError(err);
    }
  },
  { permission: "run.create", what: "record verification runs" },
);
