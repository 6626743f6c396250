import { parseId, withApi } from "@/lib/api";
import { getChangeAttachment } from "@/db/queries/changes";
import { blobStore } from "@/lib/storage/blob-store";
import { notFound } from "@/lib/errors";

export const GET = withApi<{ attachmentId: string }>(
  async ({ db, params }) => {
    const row = await getChangeAttachment(db, parseId(params.attachmentId, "That attachment"));
    if (!row) throw notFound("That attachment");
    const bytes = await blobStore().get(row.sha256);
    if (!bytes) throw notFound("That attachment's file");
    return new Response(new Uint8Array(bytes), {
      headers: { "content-type": row.contentType, "content-disposition": `inline; filename="${row.fileName.replace(/"/g, "")}"`, "x-content-type-options": "nosniff", "cache-control": "private, max-age=3600" },
    });
  },
  { permission: "change.read" },
);
