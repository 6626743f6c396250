import { parseId, withApi } from "@/lib/api";
import { getAttachment } from "@/db/queries/work-order-extras";
import { blobStore } from "@/lib/storage/blob-store";
import { notFound } from "@/lib/errors";

type Params = { attachmentId: string };

export const GET = withApi<Params>(
  async ({ db, params }) => {
    const row = await getAttachment(db, parseId(params.attachmentId, "That attachment"));
    if (!row) throw notFound("That attachment");
    const bytes = await blobStore().get(row.sha256);
    if (!bytes) throw notFound("That attachment's file");
    return new Response(new Uint8Array(bytes), {
      headers: {
        "content-type": row.contentType,
        "content-disposition": `inline; filename="${row.fileName.replace(/"/g, "")}"`,
        "x-content-type-options": "nosniff",
        "cache-control": "private, max-age=3600",
      },
    });
  },
  { permission: "maintenance.read" },
);
