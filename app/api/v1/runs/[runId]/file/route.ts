import { parseId, withApi } from "@/lib/api";
import { getRunFile } from "@/db/queries/runs";
import { notFound } from "@/lib/errors";
import { blobStore } from "@/lib/storage/blob-store";

// The original logger file, byte for byte, under a safe name (the stored name is the hash).
export const GET = withApi<{ runId: string }>(
  async ({ db, params }) => {
    const runId = parseId(params.runId, "That run");
    const row = await getRunFile(db, runId);
    const bytes = row ? await blobStore().get(row.file.sha256) : null;
    if (!row || !bytes) throw notFound("The original file of that run");
    const safe = (row.run.fileName ?? `run-${runId}.csv`).replace(/[^\w.\- ]+/g, "_").slice(0, 120);
    return new Response(new Uint8Array(bytes), {
      headers: {
        // Logger files are only accepted when they decode as UTF-8 delimited text, so that is what
        // they are served as; the type the uploader claimed (stored beside them) could say text/html.
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${safe}"`,
        "x-content-type-options": "nosniff",
      },
    });
  },
  { permission: "run.read", what: "download run files" },
);
