import { parseId, withApi } from "@/lib/api";
import { prepareRun } from "@/db/queries/run-prepare";
import { previewJson } from "@/lib/runs/preview";
import { asInputError, readRunUpload } from "@/lib/runs/upload-request";

export type { RunPreview as PreviewResponse } from "@/lib/runs/preview";

// The upload wizard's steps 2 and 3: layout, mapping, metrics and verdict. Stores nothing.
export const POST = withApi<{ ovenId: string }>(
  async ({ req, db, params }) => {
    const ovenId = parseId(params.ovenId, "That oven");
    const { input, file } = await readRunUpload(req);
    try {
      return previewJson(await prepareRun(db, ovenId, input, file.bytes));
    } catch (err) {
      throw asInputError(err);
    }
  },
  { permission: "run.create", what: "record verification runs" },
);
